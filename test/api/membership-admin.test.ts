import request from 'supertest';
import { CheckInTokens } from '../../server/membership/check-in-token';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { signedIn, type Client, type TestUser } from '../helpers/users';

// 2028 dates keep these memberships clear of the other membership files' daily jobs.
const clock = fixedClock('2028-03-10T17:00:00Z');
let t: TestApp;
let treasurer: Client;
let plans: Record<string, number>;
const tag = `Q${Date.now().toString(36)}`;

beforeAll(async () => {
  t = buildTestApp({ clock });
  treasurer = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
  const res = await treasurer.get('/api/membership/plans');
  plans = Object.fromEntries(res.body.items.map((p: { code: string; id: number }) => [p.code, p.id]));
});
afterAll(() => t.close());
beforeEach(() => clock.set('2028-03-10T17:00:00Z'));

async function member(
  name: string,
  over: Record<string, unknown> = {},
  token = 'tok_visa',
): Promise<{ client: Client; user: TestUser; id: number; number: string }> {
  const s = await signedIn(t.app, t.deps.db);
  const res = await s.client.post('/api/membership', {
    planId: plans.adult,
    profile: {
      legalName: `${name} ${tag}`,
      dateOfBirth: '1979-09-09',
      address: '88 Bison Trail, Gopher Flats, MB',
      phone: '204-555-0170',
      emergencyContact: 'Neighbour 204-555-0171',
      certificationLevel: 'none',
      ...over,
    },
    waiverVersion: '2026-1',
    paymentToken: token,
  });
  expect(res.status).toBe(201);
  const row = await t.deps.db('memberships').where('user_id', s.user.id).first();
  return { ...s, id: Number(row.id), number: row.member_number };
}

describe('GET /api/admin/members', () => {
  it('filters by certification and association expiry, searches, sorts and pages on the server', async () => {
    await member('Aurelio', { certificationLevel: 'L2', associationNumber: 'NA-1', associationExpires: '2028-04-01' });
    await member('Birgit', { certificationLevel: 'L2', associationNumber: 'NA-2', associationExpires: '2029-04-01' });
    await member('Cosmo', { certificationLevel: 'L1', associationNumber: 'NA-3', associationExpires: '2028-01-01' });
    const l2 = await treasurer.get(`/api/admin/members?q=${tag}&certificationLevel=L2&sort=name&dir=desc`);
    expect(l2.body.items.map((r: { name: string }) => r.name)).toEqual([`Birgit ${tag}`, `Aurelio ${tag}`]);
    const expiring = await treasurer.get(
      `/api/admin/members?q=${tag}&associationExpiresBefore=2028-06-01&sort=associationExpires`,
    );
    expect(expiring.body.items.map((r: { name: string }) => r.name)).toEqual([`Cosmo ${tag}`, `Aurelio ${tag}`]);
    const page2 = await treasurer.get(`/api/admin/members?q=${tag}&pageSize=1&page=2&sort=name`);
    expect(page2.body).toEqual(expect.objectContaining({ total: 3, page: 2 }));
    expect(page2.body.items.map((r: { name: string }) => r.name)).toEqual([`Birgit ${tag}`]);
  });

  it('filters and sorts by the status the dates give today, before any daily job has run', async () => {
    const m = await member('Mirela');
    clock.set('2029-01-15T17:00:00Z');
    const lapsing = await treasurer.get(`/api/admin/members?q=${encodeURIComponent('Mirela ' + tag)}&status=lapsing`);
    expect(lapsing.body.items.map((r: { memberNumber: string; status: string }) => [r.memberNumber, r.status])).toEqual(
      [[m.number, 'lapsing']],
    );
    clock.set('2029-02-10T17:00:00Z');
    expect(
      (await treasurer.get(`/api/admin/members?q=${encodeURIComponent('Mirela ' + tag)}&status=lapsing`)).body.total,
    ).toBe(0);
    expect(
      (await treasurer.get(`/api/admin/members?q=${encodeURIComponent('Mirela ' + tag)}&status=lapsed&sort=status`))
        .body.total,
    ).toBe(1);
  });

  it('answers 400 for an unknown sort or status', async () => {
    const res = await treasurer.get('/api/admin/members?sort=password&status=gold');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['sort', 'status']));
  });
});

describe('GET /api/admin/members/export.csv', () => {
  it('exports the filtered roster with formula cells neutralised (OWASP, "CSV Injection")', async () => {
    await member('=HYPERLINK("x")', { associationNumber: '@evil' });
    const res = await treasurer.get(`/api/admin/members/export.csv?q=${encodeURIComponent('HYPERLINK')}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.text.startsWith('\uFEFF')).toBe(true);
    const lines = res.text.trim().split('\r\n');
    expect(lines[0]).toBe(
      'Member number,Name,E-mail,Plan,Status,Term end,Certification,Certification checked,Association number,Association expires,Association checked,Auto-renew',
    );
    expect(lines).toHaveLength(2);
    expect(lines[1]).toContain(`"'=HYPERLINK(""x"") ${tag}"`);
    expect(lines[1]).toContain(`"'@evil"`);
  });
});

describe('POST /api/admin/members/:id/payments', () => {
  it('records a cash payment with its receipt number, extends the term, books it and sends the receipt', async () => {
    const m = await member('Dagny');
    clock.set('2028-11-02T17:00:00Z');
    const res = await treasurer.post(`/api/admin/members/${m.id}/payments`, {
      amountCents: 4500,
      method: 'cash',
      receiptNumber: 'GF-0093',
    });
    expect(res.status).toBe(201);
    expect(res.body.member.termEnd).toBe('2029-12-31');
    expect(res.body.payments[0]).toEqual(
      expect.objectContaining({ method: 'cash', receiptNumber: 'GF-0093', amountCents: 4500, status: 'paid' }),
    );
    expect(res.body.audit.map((a: { action: string }) => a.action)).toContain('term_paid');
    const movement = await t.deps.db('money_movements').where({ reference: m.number, kind: 'manual_payment' }).first();
    expect(movement).toEqual(
      expect.objectContaining({ method: 'cash', gross_cents: 4500, fee_cents: 0, source: 'dues' }),
    );
    expect(
      await t.deps.db('outbound_emails').where({ to_address: m.user.email, template: 'membership-receipt' }),
    ).toHaveLength(2);
    const again = await treasurer.post(`/api/admin/members/${m.id}/payments`, {
      amountCents: 4500,
      method: 'cash',
      receiptNumber: 'gf-0093',
    });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.receiptNumber).toBeDefined();
  });

  it('answers 400 beside the field for a bad method or missing receipt number', async () => {
    const m = await member('Eero');
    const res = await treasurer.post(`/api/admin/members/${m.id}/payments`, { amountCents: 4500, method: 'barter' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['method', 'receiptNumber']));
  });
});

describe('POST /api/admin/members/:id/refunds', () => {
  it('refunds a card payment in full, takes the term back and books a negative movement', async () => {
    const m = await member('Fenella');
    const detail = await treasurer.get(`/api/admin/members/${m.id}`);
    const paid = detail.body.payments.find((p: { status: string }) => p.status === 'paid');
    const tooMuch = await treasurer.post(`/api/admin/members/${m.id}/refunds`, {
      paymentId: paid.id,
      amountCents: 9999,
      reason: 'Moved away',
    });
    expect(tooMuch.status).toBe(400);
    const res = await treasurer.post(`/api/admin/members/${m.id}/refunds`, {
      paymentId: paid.id,
      amountCents: 4500,
      reason: 'Moved away',
    });
    expect(res.status).toBe(201);
    expect(res.body.member).toEqual(expect.objectContaining({ termEnd: null, status: 'pending' }));
    const refund = await t.deps.db('money_movements').where({ reference: m.number, kind: 'refund' }).first();
    expect(refund.gross_cents).toBe(-4500);
    expect((await t.deps.db('users').where('id', m.user.id).first()).roles).not.toContain('member');
  });

  it('answers 409 over_refund, beside the amount, once earlier refunds took what was left', async () => {
    const m = await member('Fabiola');
    const paid = (await treasurer.get(`/api/admin/members/${m.id}`)).body.payments.find(
      (p: { status: string }) => p.status === 'paid',
    );
    expect(
      (
        await treasurer.post(`/api/admin/members/${m.id}/refunds`, {
          paymentId: paid.id,
          amountCents: 4000,
          reason: 'Partial',
        })
      ).status,
    ).toBe(201);
    const over = await treasurer.post(`/api/admin/members/${m.id}/refunds`, {
      paymentId: paid.id,
      amountCents: 1000,
      reason: 'Again',
    });
    expect(over.status).toBe(409);
    expect(over.body.error).toMatchObject({
      code: 'over_refund',
      fields: { amountCents: expect.stringMatching(/500 cents/) },
    });
  });

  it('records a refund made at the processor on a dues charge once, as the processor’s, from the payment event', async () => {
    const m = await member('Florentyna');
    const pay = await t.deps
      .db('membership_payments')
      .where({ membership_id: m.id, entry: 'payment', status: 'paid' })
      .first();
    await t.processor.refunds.create({ charge: pay.processor_charge_id, amount: 1200 });
    const send = () => {
      const payload = JSON.stringify({
        id: `evt_dues_${Date.now()}_${Math.random()}`,
        object: 'event',
        type: 'charge.refunded',
        data: { object: { id: pay.processor_charge_id, object: 'charge' } },
        created: Math.floor(Date.now() / 1000),
        livemode: false,
        api_version: '2024-06-20',
      });
      const header = t.processor.webhooks.generateTestHeaderString({
        payload,
        secret: t.config.stripe.webhookSecret,
      });
      return request(t.app)
        .post('/api/payments/webhook')
        .set('Content-Type', 'application/json')
        .set('Stripe-Signature', header)
        .send(payload);
    };
    expect((await send()).status).toBe(200);
    expect((await send()).status).toBe(200);
    const refunds = await t.deps.db('membership_payments').where({ refund_of: pay.id, entry: 'refund' });
    expect(refunds.map((r) => [r.status, r.amount_cents, r.recorded_by])).toEqual([['refunded', -1200, null]]);
    const moves = await t.deps.db('money_movements').where({ reference: m.number, kind: 'refund' });
    expect(moves.map((x) => Number(x.gross_cents))).toEqual([-1200]);
  });
});

describe('the membership-reconcile-refunds job', () => {
  it('settles a card refund claim whose answer never came: refunded if the processor has it, else failed', async () => {
    const m = await member('Gudrun');
    const pay = await t.deps
      .db('membership_payments')
      .where({ membership_id: m.id, entry: 'payment', status: 'paid' })
      .first();
    const claim = async (key: string, cents: number) =>
      (
        await t.deps
          .db('membership_payments')
          .insert({
            membership_id: pay.membership_id,
            plan_id: pay.plan_id,
            entry: 'refund',
            status: 'requested',
            method: 'card',
            amount_cents: -cents,
            idempotency_key: key,
            refund_of: pay.id,
            processor_charge_id: pay.processor_charge_id,
            note: 'Lost answer',
            created_at: new Date('2028-03-10T16:00:00Z'),
          })
          .returning('id')
      )[0].id;
    const landed = await claim(`dues-refund-lost-${tag}`, 700);
    const never = await claim(`dues-refund-never-${tag}`, 300);
    await t.deps.payments.refund(pay.processor_charge_id, 700, `dues-refund-lost-${tag}`);
    await t.app.jobs.find((j) => j.name === 'membership-reconcile-refunds')!.run();
    const rows = await t.deps.db('membership_payments').whereIn('id', [landed, never]).orderBy('id');
    expect(rows.map((r) => r.status)).toEqual(['refunded', 'failed']);
    const moves = await t.deps.db('money_movements').where({ reference: m.number, kind: 'refund' });
    expect(moves.map((x) => Number(x.gross_cents))).toEqual([-700]);
  });
});

describe('GET /api/admin/members/summary', () => {
  it('adds up dues per month and plan, and counts members by status', async () => {
    const before = await treasurer.get('/api/admin/members/summary');
    const cents = (body: { collected: { month: string; planCode: string; cents: number }[] }) =>
      body.collected.find((r) => r.month === '2028-03' && r.planCode === 'adult')?.cents ?? 0;
    await member('Gunnar');
    const after = await treasurer.get('/api/admin/members/summary');
    expect(cents(after.body) - cents(before.body)).toBe(4500);
    expect(after.body.byStatus.active).toBeGreaterThan(0);
    // A year on, with no daily job run, the same members count as lapsed (statuses follow the dates).
    clock.set('2029-06-01T17:00:00Z');
    const later = await treasurer.get('/api/admin/members/summary');
    expect(later.body.byStatus.lapsed).toBeGreaterThan(after.body.byStatus.lapsed);
    expect(later.body.byStatus.active).toBeLessThan(after.body.byStatus.active);
  });
});

describe('POST /api/admin/members/email', () => {
  it('queues the message for the filtered roster and skips members who opted out', async () => {
    const a = await member('Hollis', { certificationLevel: 'L3' });
    const b = await member('Ilse', { certificationLevel: 'L3' });
    await t.deps.db('users').where('id', b.user.id).update({ marketing_opt_out: true });
    const res = await treasurer.post('/api/admin/members/email', {
      filters: { q: tag, certificationLevel: 'L3' },
      subject: 'Spring launch at the sod farm',
      text: 'Bring a chair.',
    });
    expect(res.body).toEqual({ queued: 1, skippedOptedOut: 1, skippedLapsedConsent: 0, skippedSuppressed: 0 });
    expect(
      await t.deps.db('outbound_emails').where({ to_address: a.user.email, template: 'membership-roster-news' }),
    ).toHaveLength(1);
    expect(
      await t.deps.db('outbound_emails').where({ to_address: b.user.email, template: 'membership-roster-news' }),
    ).toHaveLength(0);
  });
});

describe('POST /api/admin/checkin', () => {
  it('answers active, lapsing and lapsed from the card token, with the association expiry', async () => {
    const m = await member('Jorunn', { associationNumber: 'NA-9', associationExpires: '2028-08-31' });
    const card = await m.client.get('/api/membership/card');
    const rso = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
    const check = async () => (await rso.post('/api/admin/checkin', { token: card.body.card.token })).body;
    // The association details are the member's own claim until staff verify them (membership-flying-status.test.ts).
    expect(await check()).toEqual(
      expect.objectContaining({
        status: 'active',
        memberNumber: m.number,
        name: `Jorunn ${tag}`,
        association: expect.objectContaining({ expires: '2028-08-31', answer: 'claimed' }),
      }),
    );
    clock.set('2029-01-10T17:00:00Z');
    expect((await check()).status).toBe('lapsing');
    clock.set('2029-02-10T17:00:00Z');
    expect(await check()).toEqual(
      expect.objectContaining({
        status: 'lapsed',
        mayFly: false,
        association: expect.objectContaining({ answer: 'expired' }),
      }),
    );
  });

  it('answers unknown for a tampered token or one signed with another key', async () => {
    const m = await member('Kasimir');
    const token: string = (await m.client.get('/api/membership/card')).body.card.token;
    const [v, number, issued, mac] = token.split('.');
    const other = String(Number(number) + 1).padStart(5, '0');
    for (const bad of [
      `${v}.${other}.${issued}.${mac}`,
      new CheckInTokens('some-other-secret-of-sufficient-length-0000').sign(number, new Date()),
      'not a token',
    ]) {
      const res = await treasurer.post('/api/admin/checkin', { token: bad });
      expect(res.status).toBe(200);
      expect(res.body).toEqual(expect.objectContaining({ status: 'unknown', memberNumber: null }));
    }
    expect((await treasurer.post('/api/admin/checkin', {})).status).toBe(400);
  });
});

describe('PATCH /api/admin/members/plans/:id', () => {
  it('changes the dues staff charge and the quote follows', async () => {
    const original = (await treasurer.get('/api/admin/members/plans')).body.items.find(
      (p: { code: string }) => p.code === 'family',
    );
    try {
      expect(
        (await treasurer.patch(`/api/admin/members/plans/${plans.family}`, { duesCents: 7500 })).body.plan.duesCents,
      ).toBe(7500);
      expect((await treasurer.post('/api/membership/quote', { planId: plans.family })).body.amountCents).toBe(7500);
      expect((await treasurer.patch(`/api/admin/members/plans/${plans.family}`, { duesCents: -1 })).status).toBe(400);
    } finally {
      await treasurer.patch(`/api/admin/members/plans/${plans.family}`, { duesCents: original.duesCents });
    }
  });
});

describe('PATCH /api/admin/members/:id', () => {
  it('keeps an audit of the change with before and after', async () => {
    const m = await member('Liesl', { certificationLevel: 'L1' });
    const res = await treasurer.patch(`/api/admin/members/${m.id}`, {
      certificationLevel: 'L2',
      certificationDate: '2028-03-01',
    });
    const entry = res.body.audit.find((a: { action: string }) => a.action === 'record_edited');
    expect(entry.detail.certificationLevel).toEqual({ from: 'L1', to: 'L2' });
    expect((await treasurer.patch(`/api/admin/members/${m.id}`, { certificationLevel: 'L9' })).status).toBe(400);
  });
});
