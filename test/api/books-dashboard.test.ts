import { recordMovement } from '../../server/books/ledger-writer';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/users';

let t: TestApp;
// A day no other test writes money on, so the day's and month's sums are exactly this file's.
const TODAY = '2032-06-15T18:00:00Z';
beforeAll(() => (t = buildTestApp({ clock: fixedClock(TODAY) })));
afterAll(() => t.close());

describe('GET /api/admin/dashboard', () => {
  it('moves today’s sales (net of tax) and this month’s dues by what was just recorded, and counts what other features hold', async () => {
    const { client } = await signedIn(t.app, t.deps.db, ['treasurer']);
    await t.deps
      .db('money_movements')
      .where('occurred_at', '>=', '2032-06-01')
      .andWhere('occurred_at', '<', '2032-07-02')
      .delete();
    await t.deps.db.transaction(async (trx) => {
      // C$12.00 of goods to Manitoba + GST 5% 0.60 + RST 7% 0.84 = C$13.44 (CRA rate page; Manitoba Finance): the card
      // counts C$12.00, since the tax is owed to the authorities and is not a sale.
      await recordMovement(trx, {
        occurredAt: new Date(TODAY),
        kind: 'order_payment',
        source: 'merch',
        reference: 'DASH-1',
        counterparty: 'Dash Buyer',
        grossCents: 1344,
        method: 'card',
        taxes: [
          { code: 'GST', jurisdiction: 'MB', ratePercent: '5', taxableCents: 1200, taxCents: 60 },
          { code: 'RST', jurisdiction: 'MB', ratePercent: '7', taxableCents: 1200, taxCents: 84 },
        ],
      });
      // Earlier this month (Winnipeg time): in the month's sales, not today's.
      await recordMovement(trx, {
        occurredAt: new Date('2032-06-01T06:00:00Z'),
        kind: 'order_payment',
        source: 'merch',
        reference: 'DASH-3',
        counterparty: 'Dash Buyer',
        grossCents: 1000,
        method: 'card',
      });
      // 2032-06-01T04:59Z is still May 31 in Winnipeg (CDT, UTC-5): outside the month.
      await recordMovement(trx, {
        occurredAt: new Date('2032-06-01T04:59:00Z'),
        kind: 'order_payment',
        source: 'merch',
        reference: 'DASH-4',
        counterparty: 'Dash Buyer',
        grossCents: 777,
        method: 'card',
      });
      await recordMovement(trx, {
        occurredAt: new Date(TODAY),
        kind: 'dues_payment',
        source: 'dues',
        reference: 'DASH-2',
        counterparty: 'Dash Member',
        grossCents: 4500,
        method: 'cash',
      });
    });
    // Other suites add orders and members while this runs, so the cards are compared with counts taken straight from
    // each feature's table just before and just after the call; a try where the tables moved meanwhile is repeated.
    const counts = async () => {
      const [{ n: toShip }] = await t.deps
        .db('shop_orders')
        .whereIn('status', ['paid', 'packed'])
        .count<{ n: string }[]>({ n: '*' });
      const [{ n: members }] = await t.deps.db('memberships').count<{ n: string }[]>({ n: '*' });
      return { toShip: Number(toShip), members: Number(members) };
    };
    let after: Record<string, unknown> = {};
    let settled: Awaited<ReturnType<typeof counts>> | null = null;
    for (let i = 0; i < 20 && !settled; i++) {
      const before = await counts();
      const res = await client.get('/api/admin/dashboard');
      expect(res.status).toBe(200);
      after = res.body;
      const later = await counts();
      if (before.toShip === later.toShip && before.members === later.members) settled = later;
    }
    expect(settled).not.toBeNull();
    expect(after.today).toBe('2032-06-15');
    expect(after.salesTodayCents).toBe(1200);
    expect(after.salesMonthCents).toBe(2200);
    const june = (
      after.revenueByMonth as { month: string; source: string; netCents: number; grossCents: number }[]
    ).filter((r) => r.month === '2032-06');
    expect(june.find((r) => r.source === 'merch')).toMatchObject({ grossCents: 2344, netCents: 2200 });
    expect(after.duesMonthCents).toBe(4500);
    expect(after.ordersAwaitingShipment).toBe(settled!.toShip);
    expect(Object.values(after.membersByStatus as Record<string, number>).reduce((a, b) => a + b, 0)).toBe(
      settled!.members,
    );
    expect(typeof after.membersLapsingSoon).toBe('number');
    expect(Array.isArray(after.runsClosingSoon)).toBe(true);
    expect(Array.isArray(after.overdueDeliverables)).toBe(true);
  });

  it('is refused to an editor', async () => {
    const { client } = await signedIn(t.app, t.deps.db, ['editor']);
    expect((await client.get('/api/admin/dashboard')).status).toBe(403);
  });
});

describe('GET /api/admin/reports/sponsor-value', () => {
  it('sums a sponsor’s season cash and declared in-kind value, with promised and delivered counts', async () => {
    // Season 2032 (the fixed clock's year), so no other test's agreements are in it.
    const { client } = await signedIn(t.app, t.deps.db, ['treasurer']);
    const name = `Value Test Supply ${Date.now()}`;
    const created = await client.post('/api/admin/sponsors', {
      name,
      website: 'https://example.test',
      blurb: 'Invented for a test.',
    });
    expect(created.status).toBe(201);
    const agreement = await client.post(`/api/admin/sponsors/${created.body.id}/agreements`, {
      season: '2032',
      cashCents: 50_000,
      inKind: [
        { description: 'Filament, 10 spools', valueCents: 12_000 },
        { description: 'Shock cord', valueCents: 1_500 },
      ],
      deliverables: [
        { kind: 'build_log_credit', quantity: 2, dueOn: '2032-09-01' },
        { kind: 'video_mention', quantity: 1, dueOn: '2032-10-01' },
      ],
    });
    expect(agreement.status).toBe(201);
    const res = await client.get('/api/admin/reports/sponsor-value');
    expect(res.status).toBe(200);
    expect(res.body.season).toBe('2032');
    expect(res.body.items.find((i: { sponsor: string }) => i.sponsor === name)).toMatchObject({
      cashCents: 50_000,
      inKindCents: 13_500,
      totalCents: 63_500,
      promised: 3,
      delivered: 0,
    });
  });
});
