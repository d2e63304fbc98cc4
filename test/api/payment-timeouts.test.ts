import http from 'node:http';
import Stripe from 'stripe';
import { loadConfig } from '../../server/config';
import { PaymentGateway } from '../../server/payments/payment-gateway';
import { createStripe } from '../../server/payments/stripe-client';
import { freePort, SwitchableProxy } from '../helpers/tcp-proxy';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

// The payment fake has no delay token, so a proxy between the app and the fake lets each charge request through and
// swallows the answer: the fake has made the charge, and the SDK times out waiting for it.
//
// The rule under test (Stripe docs, "Idempotent requests", docs.stripe.com/idempotency, read for this test): Stripe
// saves the status code and body of the first request for an idempotency key, and later requests with the same key
// return the same result. The fake does the same (stripe-stateful-mock, src/api/idempotency.ts).

const SDK_TIMEOUT_MS = 1000;
/** One try and the gateway's three retries. */
const ALL_TRIES = 4;

const config = loadConfig(process.env);
const clock = fixedClock(new Date().toISOString());
/** Straight to the fake, to read its own list of charges. */
const fake = createStripe(config);
let proxy: SwitchableProxy;
let t: TestApp;
let staff: Client;

beforeAll(async () => {
  proxy = new SwitchableProxy(await freePort(), Number(new URL(config.stripe.apiBase).port));
  await proxy.up();
  const stripe = new Stripe(config.stripe.secretKey, {
    host: '127.0.0.1',
    port: proxy.port,
    protocol: 'http',
    maxNetworkRetries: 0,
    timeout: SDK_TIMEOUT_MS,
    // One connection per request, so the proxy can swallow exactly the answers the test names.
    httpAgent: new http.Agent({ keepAlive: false }),
  });
  t = buildTestApp({ clock, payments: new PaymentGateway(stripe) });
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
});
afterAll(async () => {
  await t.close();
  await proxy.down();
});
afterEach(() => proxy.holdReplies(0));

const fakeCharges = async (key: string, value: string) =>
  (await fake.charges.list({ limit: 100 })).data.filter((c) => c.metadata[key] === value);
const later = (minutes: number) => clock.set(new Date(clock.now().getTime() + minutes * 60_000).toISOString());
const orderRow = (id: number) => t.deps.db('shop_orders').where('id', id).first();
const reservedOn = async (runId: number) =>
  (await t.deps.db('shop_runs').where('id', runId).first()).reserved as number;
const movements = async (reference: string) =>
  Number((await t.deps.db('money_movements').where({ reference }).count('* as n').first())!.n);

async function placeOrder() {
  const shirt = await openShirt(staff, { cap: 3 });
  const c = new Client(t.app);
  const res = await c.post('/api/orders', {
    items: [{ variantId: shirt.variants[0].id, quantity: 2 }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(c, 'pickup'),
    email: 'lost-answer@example.test',
    paymentToken: 'tok_visa',
  });
  return { c, res, shirt, orderId: res.body.order.id as number };
}

describe('POST /api/orders when the processor charges but its answer is lost', () => {
  describe('once', () => {
    it('pays the order: the gateway’s retry with the same key gets the saved charge back, and the card is charged once', async () => {
      const heldBefore = proxy.heldReplies;
      proxy.holdReplies(1);
      const { res, shirt, orderId } = await placeOrder();
      expect(proxy.heldReplies - heldBefore).toBe(1);
      expect(res.status).toBe(201);
      expect(res.body.order.status).toBe('paid');
      // Same key -> same result (Stripe docs, Idempotent requests): the retry is answered with the first charge.
      const charges = await fakeCharges('orderId', String(orderId));
      expect(charges).toHaveLength(1);
      expect((await orderRow(orderId)).charge_id).toBe(charges[0].id);
      expect(await reservedOn(shirt.run.id)).toBe(2);
      expect(await movements(res.body.order.number)).toBe(1);
    });
  });

  describe('on every try', () => {
    it('answers 202 pending with the units held; the buyer’s second attempt finds the charge and charges nothing more', async () => {
      const heldBefore = proxy.heldReplies;
      proxy.holdReplies(ALL_TRIES);
      const { c, res, shirt, orderId } = await placeOrder();
      expect(proxy.heldReplies - heldBefore).toBe(ALL_TRIES);
      expect(res.status).toBe(202);
      expect(res.body.order.status).toBe('pending');
      expect(res.body.message).toMatch(/could not confirm/i);
      expect(await reservedOn(shirt.run.id)).toBe(2);
      // The fake made the charge on the first try; the retries, with the same key, only got it replayed.
      const charges = await fakeCharges('orderId', String(orderId));
      expect(charges).toHaveLength(1);

      const again = await c.post(`/api/orders/${orderId}/pay`, { paymentToken: 'tok_visa' });
      expect(again.status).toBe(200);
      expect(again.body.order.status).toBe('paid');
      expect(await fakeCharges('orderId', String(orderId))).toHaveLength(1);
      expect((await orderRow(orderId)).charge_id).toBe(charges[0].id);
      expect(await reservedOn(shirt.run.id)).toBe(2);
      expect(await movements(res.body.order.number)).toBe(1);
    });

    it('is settled as paid with its units by the reconciliation job, and a later attempt charges nothing more', async () => {
      proxy.holdReplies(ALL_TRIES);
      const { c, res, shirt, orderId } = await placeOrder();
      expect(res.status).toBe(202);
      const charges = await fakeCharges('orderId', String(orderId));
      expect(charges).toHaveLength(1);

      later(11);
      await t.app.jobs.find((j) => j.name === 'shop-reconcile-payments')!.run();
      const row = await orderRow(orderId);
      expect(row.status).toBe('paid');
      expect(row.charge_id).toBe(charges[0].id);
      expect(await reservedOn(shirt.run.id)).toBe(2);
      expect(await movements(res.body.order.number)).toBe(1);
      expect(
        Number(
          (await t.deps
            .db('outbound_emails')
            .where({ dedupe_key: `shop-confirmation-${orderId}` })
            .count('* as n')
            .first())!.n,
        ),
      ).toBe(1);

      const again = await c.post(`/api/orders/${orderId}/pay`, { paymentToken: 'tok_visa' });
      expect(again.body.order.status).toBe('paid');
      expect(await fakeCharges('orderId', String(orderId))).toHaveLength(1);
    });
  });
});

describe('POST /api/membership when the processor charges but its answer is lost', () => {
  let adultPlan: number;
  const joinBody = (paymentToken: string) => ({
    planId: adultPlan,
    profile: {
      legalName: 'Wendeline Okonkwo-Strand',
      dateOfBirth: '1988-09-03',
      address: '3 Sounding Rod Lane, Gopher Flats, MB',
      phone: '204-555-0177',
      emergencyContact: 'Tobiah Strand, 204-555-0178',
      certificationLevel: 'L1',
    },
    waiverVersion: '2026-1',
    paymentToken,
  });

  beforeAll(async () => {
    const res = await staff.get('/api/membership/plans');
    adultPlan = res.body.items.find((p: { code: string }) => p.code === 'adult').id;
  });

  it('activates the membership once: the gateway’s retry with the same key gets the saved charge back', async () => {
    const s = await signedIn(t.app, t.deps.db);
    proxy.holdReplies(1);
    const res = await s.client.post('/api/membership', joinBody('tok_visa'));
    expect(res.status).toBe(201);
    expect(res.body.membership.status).toBe('active');
    // Same key -> same result (Stripe docs, Idempotent requests).
    expect(await fakeCharges('memberNumber', res.body.membership.memberNumber)).toHaveLength(1);
    expect(await movements(res.body.membership.memberNumber)).toBe(1);
  });

  it('answers 502 with the payment recorded; submitting the same card again pays the term with the one charge', async () => {
    const s = await signedIn(t.app, t.deps.db);
    proxy.holdReplies(ALL_TRIES);
    const res = await s.client.post('/api/membership', joinBody('tok_visa'));
    expect(res.status).toBe(502);
    expect(res.body.error.code).toBe('payment_unconfirmed');
    const m = await t.deps.db('memberships').where('user_id', s.user.id).first();
    expect(m.status).toBe('pending');
    expect(await t.deps.db('membership_payments').where({ membership_id: m.id }).pluck('status')).toEqual(['unknown']);
    const charges = await fakeCharges('memberNumber', m.member_number);
    expect(charges).toHaveLength(1);

    const again = await s.client.post('/api/membership', joinBody('tok_visa'));
    expect(again.status).toBe(201);
    expect(again.body.membership.status).toBe('active');
    expect(await fakeCharges('memberNumber', m.member_number)).toHaveLength(1);
    const payments = await t.deps.db('membership_payments').where({ membership_id: m.id });
    expect(payments).toEqual([expect.objectContaining({ status: 'paid', processor_charge_id: charges[0].id })]);
    expect(await movements(m.member_number)).toBe(1);
  });
});

describe('POST /api/admin/orders/:id/refund when the processor refunds but its answer is lost', () => {
  it('holds the claim (502), answers a repeat as in progress, and reconciliation records the refund once', async () => {
    const { res, orderId } = await placeOrder();
    expect(res.status).toBe(201);
    const order = await orderRow(orderId);
    const refund = async (body: object, key?: string) => {
      const token = await staff.token();
      const req = staff.agent.post(`/api/admin/orders/${orderId}/refund`).set('X-CSRF-Token', token);
      return (key ? req.set('Idempotency-Key', key) : req).send(body);
    };
    proxy.holdReplies(1);
    const lost = await refund({ amountCents: 500 }, 'lost-refund-answer-1');
    expect(lost.status).toBe(502);
    expect(lost.body.error.code).toBe('processor_unreachable');
    // The processor made it (same key in its metadata); Padside holds the claim and does not count it yet.
    const held = (await fake.refunds.list({ charge: order.charge_id })).data;
    expect(held.map((r) => r.amount)).toEqual([500]);
    expect((await orderRow(orderId)).refunded_cents).toBe(0);
    const again = await refund({ amountCents: 500 }, 'lost-refund-answer-1');
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('refund_in_progress');
    // The claim still counts against what is left.
    const rest = await refund({ amountCents: order.total_cents - 499 });
    expect(rest.status).toBe(409);
    expect(rest.body.error.code).toBe('over_refund');

    later(11);
    await t.app.jobs.find((j) => j.name === 'reconcile-refunds')!.run();
    expect((await orderRow(orderId)).refunded_cents).toBe(500);
    expect(
      Number(
        (await t.deps.db('money_movements').where({ reference: order.number, kind: 'refund' }).count('* as n').first())!
          .n,
      ),
    ).toBe(1);
    const settled = await refund({ amountCents: 500 }, 'lost-refund-answer-1');
    expect(settled.status).toBe(200);
    expect(settled.body.refund).toMatchObject({ state: 'succeeded', amountCents: 500 });
    expect((await fake.refunds.list({ charge: order.charge_id })).data).toHaveLength(1);
  });
});
