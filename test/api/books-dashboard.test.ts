import { recordMovement } from '../../server/books/ledger-writer';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/users';

let t: TestApp;
beforeAll(() => (t = buildTestApp()));
afterAll(() => t.close());

describe('GET /api/admin/dashboard', () => {
  it('moves today’s sales and this month’s dues by what was just recorded, and counts what other features hold', async () => {
    const { client } = await signedIn(t.app, t.deps.db, ['treasurer']);
    const before = (await client.get('/api/admin/dashboard')).body;
    await t.deps.db.transaction(async (trx) => {
      await recordMovement(trx, { occurredAt: new Date(), kind: 'order_payment', source: 'merch', reference: 'DASH-1', counterparty: 'Dash Buyer', grossCents: 1234, method: 'card' });
      await recordMovement(trx, { occurredAt: new Date(), kind: 'dues_payment', source: 'dues', reference: 'DASH-2', counterparty: 'Dash Member', grossCents: 4500, method: 'cash' });
    });
    const res = await client.get('/api/admin/dashboard');
    expect(res.status).toBe(200);
    const after = res.body;
    expect(after.salesTodayCents - before.salesTodayCents).toBe(1234);
    expect(after.salesMonthCents - before.salesMonthCents).toBe(1234);
    expect(after.duesMonthCents - before.duesMonthCents).toBe(4500);

    // Each card's number equals the count taken straight from the feature's own table.
    const [{ n: toShip }] = await t.deps.db('shop_orders').whereIn('status', ['paid', 'packed']).count<{ n: string }[]>({ n: '*' });
    expect(after.ordersAwaitingShipment).toBe(Number(toShip));
    const [{ n: members }] = await t.deps.db('memberships').count<{ n: string }[]>({ n: '*' });
    expect(Object.values(after.membersByStatus as Record<string, number>).reduce((a, b) => a + b, 0)).toBe(Number(members));
    expect(typeof after.membersLapsingSoon).toBe('number');
    expect(Array.isArray(after.runsClosingSoon)).toBe(true);
    expect(Array.isArray(after.overdueDeliverables)).toBe(true);
  });

  it('is refused to an editor', async () => {
    const { client } = await signedIn(t.app, t.deps.db, ['editor']);
    expect((await client.get('/api/admin/dashboard')).status).toBe(403);
  });
});
