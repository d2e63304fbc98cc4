import { randomUUID } from 'node:crypto';
import { serve } from '../helpers/browser';
import { startServerProcess, type ServerProcess } from '../helpers/server-process';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { createUser, type TestUser } from '../helpers/users';

// Refunds raced for real: ten requests at once over HTTP, against one server and split across two server processes
// on one database and one processor. Whatever the answers, the processor's refunds and Padside's must agree.
let t: TestApp;
let site: { baseUrl: string; stop(): Promise<void> };
let treasurer: TestUser;
let processes: ServerProcess[] = [];

beforeAll(async () => {
  t = buildTestApp();
  site = await serve(t);
  treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Refund Treasurer');
});
afterAll(async () => {
  await Promise.all(processes.map((p) => p.kill('SIGKILL')));
  await site.stop();
  await t.close();
});

type Answer = { status: number; body: { error?: { code: string }; refund?: { id: number } } & Record<string, unknown> };

/** A cookie-keeping session over fetch that can speak to any of the servers (they share the session store). */
class Session {
  private cookie = '';
  private csrf = '';
  constructor(private readonly base: string) {}

  at(base: string): Session {
    const s = new Session(base);
    s.cookie = this.cookie;
    s.csrf = this.csrf;
    return s;
  }

  /** Takes a CSRF token for an anonymous visit. */
  async begin(): Promise<this> {
    await this.refreshCsrf();
    return this;
  }

  async signIn(user: TestUser): Promise<this> {
    await this.refreshCsrf();
    const res = await this.post('/api/auth/login', { email: user.email, password: user.password });
    if (res.status !== 200) throw new Error(`login ${res.status}`);
    await this.refreshCsrf();
    return this;
  }

  private async refreshCsrf() {
    this.csrf = ((await this.get('/api/auth/csrf')).body as { csrfToken: string }).csrfToken;
  }

  get(path: string): Promise<Answer> {
    return this.send('GET', path);
  }

  post(path: string, body: unknown, headers: Record<string, string> = {}): Promise<Answer> {
    return this.send('POST', path, body, headers);
  }

  private async send(
    method: string,
    path: string,
    body?: unknown,
    headers: Record<string, string> = {},
  ): Promise<Answer> {
    const res = await fetch(this.base + path, {
      method,
      headers: {
        ...(this.cookie ? { cookie: this.cookie } : {}),
        ...(this.csrf ? { 'x-csrf-token': this.csrf } : {}),
        ...(body ? { 'content-type': 'application/json' } : {}),
        ...headers,
      },
      body: body ? JSON.stringify(body) : undefined,
    });
    const set = res.headers.get('set-cookie');
    if (set) this.cookie = set.split(';')[0];
    const text = await res.text();
    return { status: res.status, body: text ? JSON.parse(text) : {} };
  }
}

const MB = {
  name: 'Refund Buyer',
  line1: '4 Static Port Rd',
  city: 'Gopher Flats',
  province: 'MB',
  postalCode: 'R0K 1A0',
  country: 'CA',
};

/** A paid card order of three shirts mailed in Manitoba; returns its id, total and charge. */
async function paidOrder(
  staff: Session,
): Promise<{ id: number; totalCents: number; chargeId: string; number: string }> {
  const tag = randomUUID().slice(0, 6).toUpperCase();
  const created = await staff.post('/api/admin/products', {
    name: `Race shirt ${tag}`,
    priceCents: 3500,
    weightGrams: 200,
    variants: [{ label: 'M', sku: `R-${tag}-M` }],
    run: {
      cap: 50,
      opensAt: new Date(Date.now() - 86400_000).toISOString(),
      closesAt: new Date(Date.now() + 7 * 86400_000).toISOString(),
    },
  });
  if (created.status !== 201) throw new Error(JSON.stringify(created.body));
  const variantId = (created.body.product as { variants: { id: number }[] }).variants[0].id;
  const methods = (await staff.get('/api/shipping-methods')).body.items as { id: number; code: string }[];
  const buyer = await new Session(site.baseUrl).begin();
  const res = await buyer.post('/api/orders', {
    items: [{ variantId, quantity: 3 }],
    shipTo: MB,
    shippingMethodId: methods.find((m) => m.code === 'canada')!.id,
    email: `race-${tag}@example.test`,
    paymentToken: 'tok_visa',
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  const row = await t.deps
    .db('shop_orders')
    .where('id', (res.body.order as { id: number }).id)
    .first();
  return { id: Number(row.id), totalCents: row.total_cents, chargeId: row.charge_id, number: row.number };
}

/** What the processor refunded on a charge, by its own list. */
async function processorRefunded(chargeId: string): Promise<number> {
  let total = 0;
  for await (const r of t.processor.refunds.list({ charge: chargeId, limit: 100 }))
    if (r.status === 'succeeded' || r.status === 'pending') total += r.amount;
  return total;
}

/** Padside's three records of a shop order's refunds: the order's total, the refund rows and the ledger. */
async function padsideShop(orderId: number, number: string) {
  const order = await t.deps.db('shop_orders').where('id', orderId).first();
  const rows = await t.deps
    .db('shop_refunds')
    .where({ order_id: orderId, state: 'succeeded' })
    .sum('amount_cents as s')
    .first();
  const claims = await t.deps
    .db('shop_refunds')
    .where({ order_id: orderId, state: 'requested' })
    .count('* as n')
    .first();
  const ledger = await t.deps
    .db('money_movements')
    .where({ reference: number, kind: 'refund', source: 'merch' })
    .sum('gross_cents as s')
    .first();
  return {
    order: order.refunded_cents as number,
    rows: Number(rows!.s ?? 0),
    ledger: -Number(ledger!.s ?? 0),
    openClaims: Number(claims!.n),
  };
}

async function expectShopAgrees(o: { id: number; number: string; chargeId: string; totalCents: number }) {
  const processor = await processorRefunded(o.chargeId);
  const p = await padsideShop(o.id, o.number);
  expect(p).toEqual({ order: processor, rows: processor, ledger: processor, openClaims: 0 });
  expect(processor).toBeLessThanOrEqual(o.totalCents);
  return processor;
}

const noServerErrors = (answers: Answer[]) =>
  expect(answers.filter((a) => a.status >= 500).map((a) => [a.status, a.body])).toEqual([]);
const statuses = (answers: Answer[]) => [...new Set(answers.map((a) => a.status))].sort();

/** A member who paid 45.00 dues by card, and their membership id. */
async function cardMember(
  base: string,
): Promise<{ memberId: number; paymentId: number; chargeId: string; number: string }> {
  const user = await createUser(t.deps.db, ['fan'], 'Refund Member');
  const s = await new Session(base).signIn(user);
  const plan = ((await s.get('/api/membership/plans')).body.items as { code: string; id: number }[]).find(
    (p) => p.code === 'adult',
  )!.id;
  const joined = await s.post('/api/membership', {
    planId: plan,
    profile: {
      legalName: `Odalys Refund ${randomUUID().slice(0, 4)}`,
      dateOfBirth: '1984-04-04',
      address: '3 Sod Farm Lane, Gopher Flats, MB',
      phone: '204-555-0190',
      emergencyContact: 'Neighbour 204-555-0191',
      certificationLevel: 'none',
    },
    waiverVersion: '2026-1',
    paymentToken: 'tok_visa',
  });
  if (joined.status !== 201) throw new Error(JSON.stringify(joined.body));
  const m = await t.deps.db('memberships').where('user_id', user.id).first();
  const pay = await t.deps
    .db('membership_payments')
    .where({ membership_id: m.id, entry: 'payment', status: 'paid' })
    .first();
  return {
    memberId: Number(m.id),
    paymentId: Number(pay.id),
    chargeId: pay.processor_charge_id,
    number: m.member_number,
  };
}

/** A member with a 45.00 cash payment recorded by the treasurer. */
async function cashMember(staff: Session) {
  const card = await cardMember(site.baseUrl);
  const res = await staff.post(`/api/admin/members/${card.memberId}/payments`, {
    amountCents: 4500,
    method: 'cash',
    receiptNumber: `GF-${randomUUID().slice(0, 6)}`,
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  const pay = await t.deps
    .db('membership_payments')
    .where({ membership_id: card.memberId, entry: 'payment', method: 'cash' })
    .first();
  return { memberId: card.memberId, paymentId: Number(pay.id), number: card.number, amountCents: 4500 };
}

/** Padside's records of a dues payment's refunds: the refund rows (settled, and claims left open) and the ledger. */
async function padsideDues(paymentId: number, number: string, method: string) {
  const rows = await t.deps
    .db('membership_payments')
    .where({ refund_of: paymentId, entry: 'refund', status: 'refunded' })
    .sum('amount_cents as s')
    .first();
  const claims = await t.deps
    .db('membership_payments')
    .where({ refund_of: paymentId, entry: 'refund', status: 'requested' })
    .count('* as n')
    .first();
  const ledger = await t.deps
    .db('money_movements')
    .where({ reference: number, kind: 'refund', source: 'dues', method })
    .sum('gross_cents as s')
    .first();
  return { rows: -Number(rows!.s ?? 0), ledger: -Number(ledger!.s ?? 0), openClaims: Number(claims!.n) };
}

const differentAmounts = [900, 1300, 700, 2100, 1100, 1500, 600, 1900, 1700, 800];

/** The races, run against whichever servers `bases` lists (request i goes to bases[i % length]). */
function races(label: string, bases: () => string[]) {
  describe(label, () => {
    let staff: Session[];
    beforeAll(async () => {
      const first = await new Session(bases()[0]).signIn(treasurer);
      staff = bases().map((b) => first.at(b));
    });
    const via = (i: number) => staff[i % staff.length];

    it('shop card: ten different refunds at once never refund more than the charge, and both sides agree', async () => {
      const o = await paidOrder(staff[0]);
      const answers = await Promise.all(
        differentAmounts.map((amountCents, i) => via(i).post(`/api/admin/orders/${o.id}/refund`, { amountCents })),
      );
      noServerErrors(answers);
      expect(answers.filter((a) => a.status !== 200 && a.status !== 409).map((a) => a.body)).toEqual([]);
      expect(answers.filter((a) => a.status === 409).every((a) => a.body.error!.code === 'over_refund')).toBe(true);
      const refunded = await expectShopAgrees(o);
      expect(refunded).toBe(answers.reduce((s, a, i) => s + (a.status === 200 ? differentAmounts[i] : 0), 0));
    });

    it('shop card: ten identical refunds with one Idempotency-Key refund once and answer with the first result', async () => {
      const o = await paidOrder(staff[0]);
      const key = `race-${randomUUID()}`;
      const answers = await Promise.all(
        Array.from({ length: 10 }, (_, i) =>
          via(i).post(`/api/admin/orders/${o.id}/refund`, { amountCents: 1000 }, { 'Idempotency-Key': key }),
        ),
      );
      noServerErrors(answers);
      const ok = answers.filter((a) => a.status === 200);
      expect(ok.length).toBeGreaterThanOrEqual(1);
      expect(new Set(ok.map((a) => a.body.refund!.id)).size).toBe(1);
      expect(
        answers
          .filter((a) => a.status !== 200)
          .map((a) => a.body.error!.code)
          .every((c) => c === 'refund_in_progress'),
      ).toBe(true);
      expect(await expectShopAgrees(o)).toBe(1000);
    });

    it('shop card: ten identical full refunds without a key give one refund and nine over_refund', async () => {
      const o = await paidOrder(staff[0]);
      const answers = await Promise.all(
        Array.from({ length: 10 }, (_, i) =>
          via(i).post(`/api/admin/orders/${o.id}/refund`, { amountCents: o.totalCents }),
        ),
      );
      noServerErrors(answers);
      expect(answers.filter((a) => a.status === 200)).toHaveLength(1);
      expect(answers.filter((a) => a.status === 409 && a.body.error!.code === 'over_refund')).toHaveLength(9);
      expect(await expectShopAgrees(o)).toBe(o.totalCents);
    });

    it('dues card: ten different refunds at once, processor and Padside agree, never more than paid', async () => {
      const m = await cardMember(bases()[0]);
      const amounts = differentAmounts.map((a) => Math.round(a / 2));
      const answers = await Promise.all(
        amounts.map((amountCents, i) =>
          via(i).post(`/api/admin/members/${m.memberId}/refunds`, {
            paymentId: m.paymentId,
            amountCents,
            reason: 'Race test',
          }),
        ),
      );
      noServerErrors(answers);
      expect(statuses(answers).every((s) => s === 201 || s === 409)).toBe(true);
      const processor = await processorRefunded(m.chargeId);
      expect(await padsideDues(m.paymentId, m.number, 'card')).toEqual({
        rows: processor,
        ledger: processor,
        openClaims: 0,
      });
      expect(processor).toBeLessThanOrEqual(4500);
      expect(processor).toBe(answers.reduce((s, a, i) => s + (a.status === 201 ? amounts[i] : 0), 0));
    });

    it('dues card: ten identical refunds with one key refund once', async () => {
      const m = await cardMember(bases()[0]);
      const key = `dues-race-${randomUUID()}`;
      const answers = await Promise.all(
        Array.from({ length: 10 }, (_, i) =>
          via(i).post(
            `/api/admin/members/${m.memberId}/refunds`,
            { paymentId: m.paymentId, amountCents: 1500, reason: 'Double click' },
            { 'Idempotency-Key': key },
          ),
        ),
      );
      noServerErrors(answers);
      expect(answers.filter((a) => a.status === 201).length).toBeGreaterThanOrEqual(1);
      expect(answers.filter((a) => a.status !== 201).every((a) => a.body.error!.code === 'refund_in_progress')).toBe(
        true,
      );
      expect(await processorRefunded(m.chargeId)).toBe(1500);
      expect(await padsideDues(m.paymentId, m.number, 'card')).toEqual({ rows: 1500, ledger: 1500, openClaims: 0 });
    });

    it('dues cash: ten different refunds at once never pay back more than was received', async () => {
      const m = await cashMember(staff[0]);
      const answers = await Promise.all(
        differentAmounts.map((amountCents, i) =>
          via(i).post(`/api/admin/members/${m.memberId}/refunds`, {
            paymentId: m.paymentId,
            amountCents,
            reason: 'Race test',
          }),
        ),
      );
      noServerErrors(answers);
      expect(statuses(answers).every((s) => s === 201 || s === 409)).toBe(true);
      const granted = answers.reduce((s, a, i) => s + (a.status === 201 ? differentAmounts[i] : 0), 0);
      expect(granted).toBeLessThanOrEqual(4500);
      expect(await padsideDues(m.paymentId, m.number, 'cash')).toEqual({
        rows: granted,
        ledger: granted,
        openClaims: 0,
      });
    });

    it('dues cash: ten identical full refunds give one 201 and nine 409, never a 500', async () => {
      const m = await cashMember(staff[0]);
      const answers = await Promise.all(
        Array.from({ length: 10 }, (_, i) =>
          via(i).post(`/api/admin/members/${m.memberId}/refunds`, {
            paymentId: m.paymentId,
            amountCents: 4500,
            reason: 'Same click',
          }),
        ),
      );
      noServerErrors(answers);
      expect(answers.filter((a) => a.status === 201)).toHaveLength(1);
      expect(answers.filter((a) => a.status === 409 && a.body.error!.code === 'over_refund')).toHaveLength(9);
      expect(await padsideDues(m.paymentId, m.number, 'cash')).toEqual({ rows: 4500, ledger: 4500, openClaims: 0 });
    });

    it('dues cash: ten identical refunds with one key give the first result to every answer that is not in progress', async () => {
      const m = await cashMember(staff[0]);
      const key = `cash-race-${randomUUID()}`;
      const answers = await Promise.all(
        Array.from({ length: 10 }, (_, i) =>
          via(i).post(
            `/api/admin/members/${m.memberId}/refunds`,
            { paymentId: m.paymentId, amountCents: 1000, reason: 'Same click' },
            { 'Idempotency-Key': key },
          ),
        ),
      );
      noServerErrors(answers);
      // A cash refund is settled inside its own transaction, so every repeat sees it done: all ten answer 201.
      expect(statuses(answers)).toEqual([201]);
      expect(await padsideDues(m.paymentId, m.number, 'cash')).toEqual({ rows: 1000, ledger: 1000, openClaims: 0 });
    });
  });
}

races('against the running server', () => [site.baseUrl]);

describe('across two server processes', () => {
  const urls: string[] = [];
  beforeAll(async () => {
    processes = await Promise.all([startServerProcess(), startServerProcess()]);
    urls.push(...processes.map((p) => p.url));
  }, 120_000);
  races('split between them', () => urls);
});
