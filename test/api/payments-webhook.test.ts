import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

let t: TestApp;
let staff: Client;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

let seq = 0;
function signed(type: string, object: object, secret = t.config.stripe.webhookSecret) {
  const payload = JSON.stringify({
    id: `evt_test_${Date.now()}_${seq++}`,
    object: 'event',
    type,
    data: { object },
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    api_version: '2024-06-20',
  });
  return { payload, header: t.processor.webhooks.generateTestHeaderString({ payload, secret }) };
}
const post = (e: { payload: string; header: string }) =>
  request(t.app)
    .post('/api/payments/webhook')
    .set('Content-Type', 'application/json')
    .set('Stripe-Signature', e.header)
    .send(e.payload);

async function paidOrder() {
  const shirt = await openShirt(staff);
  const c = new Client(t.app);
  const res = await c.post('/api/orders', {
    items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(c, 'canada'),
    email: `hook-${seq++}@example.test`,
    paymentToken: 'tok_visa',
  });
  return (await t.deps.db('shop_orders').where('id', res.body.order.id).first()) as {
    id: number;
    charge_id: string;
    total_cents: number;
    number: string;
  };
}

describe('POST /api/payments/webhook', () => {
  describe('when the signature is wrong or missing', () => {
    it('answers 400 and records nothing', async () => {
      const e = signed(
        'charge.refunded',
        { id: 'ch_nope', object: 'charge', amount_refunded: 1 },
        'whsec_someone_else',
      );
      const res = await post(e);
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/signature/);
      expect(
        (await request(t.app).post('/api/payments/webhook').set('Content-Type', 'application/json').send('{}')).status,
      ).toBe(400);
      expect(await t.deps.db('payment_events').where('id', JSON.parse(e.payload).id).first()).toBeUndefined();
    });
  });

  describe('when charge.refunded arrives for a refund made in the processor dashboard, twice', () => {
    it('records one refund, one negative movement and one notice', async () => {
      const o = await paidOrder();
      // The refund exists at the processor (made in its dashboard): the event only says to look.
      await t.processor.refunds.create({ charge: o.charge_id, amount: 1000 });
      const e = signed('charge.refunded', {
        id: o.charge_id,
        object: 'charge',
        amount: o.total_cents,
        amount_refunded: 1000,
      });
      const first = await post(e);
      expect(first.status).toBe(200);
      expect(first.body).toEqual({ received: true, replay: false });
      const replay = await post(e);
      expect(replay.body).toEqual({ received: true, replay: true });
      expect((await t.deps.db('shop_orders').where('id', o.id).first()).refunded_cents).toBe(1000);
      expect(await t.deps.db('shop_refunds').where('order_id', o.id).count('* as n').first()).toEqual({ n: 1 });
      const moves = await t.deps.db('money_movements').where({ reference: o.number, kind: 'refund' });
      expect(moves.map((m) => Number(m.gross_cents))).toEqual([-1000]);
      expect(
        await t.deps
          .db('outbound_emails')
          .where('template', 'shop-order-refund')
          .where('to_address', 'like', 'hook-%')
          .whereRaw('subject like ?', [`%${o.number}%`])
          .count('* as n')
          .first(),
      ).toEqual({ n: 1 });
    });
  });

  describe('when charge.dispute.created arrives', () => {
    it('marks the order disputed and tells staff once', async () => {
      const o = await paidOrder();
      const e = signed('charge.dispute.created', {
        id: 'dp_test',
        object: 'dispute',
        charge: o.charge_id,
        reason: 'product_not_received',
        amount: o.total_cents,
      });
      await post(e);
      await post(e);
      const row = await t.deps.db('shop_orders').where('id', o.id).first();
      expect(row.disputed_at).not.toBeNull();
      expect(row.dispute_reason).toBe('product_not_received');
      expect(
        await t.deps.db('outbound_emails').where('dedupe_key', `shop-dispute-${o.id}`).count('* as n').first(),
      ).toEqual({ n: 1 });
    });
  });
});
