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

let n = 0;
/** A paid Manitoba order of two M shirts and one L shirt (35.00 each), mailed within Canada. */
async function twoLineOrder() {
  const shirt = await openShirt(staff, { cap: 20 });
  const c = new Client(t.app);
  const res = await c.post('/api/orders', {
    items: [
      { variantId: shirt.variants[0].id, quantity: 2 },
      { variantId: shirt.variants[1].id, quantity: 1 },
    ],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(c, 'canada'),
    email: `lines-${Date.now()}-${n++}@example.test`,
    paymentToken: 'tok_visa',
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  const order = (await staff.get(`/api/admin/orders/${res.body.order.id}`)).body.order;
  const row = await t.deps.db('shop_orders').where('id', order.id).first();
  return {
    shirt,
    order,
    chargeId: row.charge_id as string,
    m: order.items[0].id as number,
    l: order.items[1].id as number,
  };
}

const refund = (id: number, body: object, key?: string) => {
  const req = staff.agent.post(`/api/admin/orders/${id}/refund`);
  return staff
    .token()
    .then((token) => (key ? req.set('Idempotency-Key', key) : req).set('X-CSRF-Token', token).send(body));
};
const processorRefunds = async (chargeId: string) =>
  (await t.processor.refunds.list({ charge: chargeId, limit: 100 })).data;
const reserved = async (runId: number) => (await t.deps.db('shop_runs').where('id', runId).first()).reserved as number;

describe('POST /api/admin/orders/:id/refund-preview', () => {
  it('computes a line refund with its tax lines and moves nothing', async () => {
    const o = await twoLineOrder();
    const res = await staff.post(`/api/admin/orders/${o.order.id}/refund-preview`, {
      lines: [{ orderItemId: o.m, quantity: 1 }],
      restock: true,
    });
    expect(res.status).toBe(200);
    // Shipping here was 14.00 with GST 5% and RST 7% on goods and shipping (order's own tax lines). One shirt:
    // 35.00 + GST 1.75 + RST 2.45 = 39.20 (Excise Tax Act s. 232, credit note for the tax on what is credited, from memory).
    expect(res.body.refund).toMatchObject({
      goodsCents: 3500,
      shippingCents: 0,
      taxCents: 420,
      totalCents: 3920,
      lines: [{ orderItemId: o.m, quantity: 1, goodsCents: 3500 }],
    });
    expect(res.body.refund.taxLines.map((x: { label: string; taxCents: number }) => [x.label, x.taxCents])).toEqual([
      ['GST 5%', 175],
      ['RST 7%', 245],
    ]);
    expect(await t.deps.db('shop_refunds').where('order_id', o.order.id)).toHaveLength(0);
    expect(await processorRefunds(o.chargeId)).toHaveLength(0);
  });

  it('answers 400 beside the field for bad lines', async () => {
    const o = await twoLineOrder();
    const res = await staff.post(`/api/admin/orders/${o.order.id}/refund-preview`, {
      lines: [{ orderItemId: o.m, quantity: 0 }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['lines.0.quantity']).toBeDefined();
  });
});

describe('POST /api/admin/orders/:id/refund by line', () => {
  it('refunds one unit with its tax, puts exactly that unit back on sale and books each tax', async () => {
    const o = await twoLineOrder();
    expect(await reserved(o.shirt.run.id)).toBe(3);
    const res = await refund(o.order.id, {
      lines: [{ orderItemId: o.m, quantity: 1 }],
      restock: true,
      reason: 'Wrong size',
    });
    expect(res.status).toBe(200);
    expect(res.body.refund).toMatchObject({
      state: 'succeeded',
      origin: 'staff',
      amountCents: 3920,
      goodsCents: 3500,
      taxCents: 420,
      unitsBackOnSale: 1,
      reason: 'Wrong size',
    });
    expect(await reserved(o.shirt.run.id)).toBe(2);
    const sheet = (await staff.get(`/api/admin/runs/${o.shirt.run.id}/print-sheet`)).body;
    expect(sheet.totalPaid).toBe(2);
    expect(
      res.body.order.items.map((i: { refundedQuantity: number; unitsToPack: number }) => [
        i.refundedQuantity,
        i.unitsToPack,
      ]),
    ).toEqual([
      [1, 1],
      [0, 1],
    ]);
    expect((await processorRefunds(o.chargeId)).map((r) => r.amount)).toEqual([3920]);
    // The tax report reads the refund's tax lines: one row per tax, in the refund's own table and on its movement.
    const stored = await t.deps.db('shop_refund_taxes').where('refund_id', res.body.refund.id).orderBy('code');
    expect(stored.map((r) => [r.code, r.taxable_cents, r.tax_cents])).toEqual([
      ['GST', 3500, 175],
      ['RST', 3500, 245],
    ]);
    const move = await t.deps
      .db('money_movements')
      .where('idempotency_key', `shop-refund-${res.body.refund.id}`)
      .first();
    expect(Number(move.gross_cents)).toBe(-3920);
    const moveTaxes = await t.deps.db('money_movement_taxes').where('movement_id', move.id).orderBy('code');
    expect(moveTaxes.map((r) => [r.code, Number(r.tax_cents)])).toEqual([
      ['GST', -175],
      ['RST', -245],
    ]);
  });

  it('refunds shipping with its tax, then the rest closes the order with the tax charged exactly reversed', async () => {
    const o = await twoLineOrder();
    const ship = await refund(o.order.id, { shipping: true });
    expect(ship.body.refund).toMatchObject({
      goodsCents: 0,
      shippingCents: 1400,
      taxCents: 70 + 98,
      amountCents: 1568,
    });
    const again = await refund(o.order.id, { shipping: true });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: 'over_refund', fields: { shipping: expect.any(String) } });
    const rest = await refund(o.order.id, {
      lines: [
        { orderItemId: o.m, quantity: 2 },
        { orderItemId: o.l, quantity: 1 },
      ],
      restock: true,
    });
    expect(rest.status).toBe(200);
    expect(rest.body.order.refundedCents).toBe(o.order.totalCents);
    const taxes = await t.deps
      .db('shop_refund_taxes as t')
      .join('shop_refunds as r', 'r.id', 't.refund_id')
      .where('r.order_id', o.order.id)
      .groupBy('t.code')
      .select('t.code', t.deps.db.raw('sum(t.tax_cents)::int as s'))
      .orderBy('t.code');
    expect(taxes.map((x) => [x.code, x.s])).toEqual(
      o.order.taxLines.map((x: { code: string; amountCents: number }) => [x.code, x.amountCents]),
    );
    expect(await reserved(o.shirt.run.id)).toBe(0);
  });

  it('refuses units already refunded with 409 beside the line, and restock without lines with 400', async () => {
    const o = await twoLineOrder();
    expect((await refund(o.order.id, { lines: [{ orderItemId: o.l, quantity: 1 }] })).status).toBe(200);
    const twice = await refund(o.order.id, { lines: [{ orderItemId: o.l, quantity: 1 }] });
    expect(twice.status).toBe(409);
    expect(twice.body.error).toMatchObject({
      code: 'over_refund',
      fields: { 'lines.0.quantity': expect.stringMatching(/already refunded/) },
    });
    const goodwill = await refund(o.order.id, { amountCents: 500, restock: true });
    expect(goodwill.status).toBe(400);
    expect(goodwill.body.error.fields.restock).toBeDefined();
  });
});

describe('an Idempotency-Key on POST /api/admin/orders/:id/refund', () => {
  it('answers a repeat with the first refund, and refuses the same key for a different refund', async () => {
    const o = await twoLineOrder();
    const first = await refund(o.order.id, { amountCents: 1120 }, 'console-abc-12345');
    const repeat = await refund(o.order.id, { amountCents: 1120 }, 'console-abc-12345');
    expect([first.status, repeat.status]).toEqual([200, 200]);
    expect(repeat.body.refund.id).toBe(first.body.refund.id);
    expect(await processorRefunds(o.chargeId)).toHaveLength(1);
    const other = await refund(o.order.id, { amountCents: 500 }, 'console-abc-12345');
    expect(other.status).toBe(409);
    expect(other.body.error.code).toBe('request_key_reused');
    expect((await refund(o.order.id, { amountCents: 500 }, 'bad key!')).status).toBe(400);
  });
});

describe('refunds the processor reports', () => {
  let seq = 0;
  const webhook = (chargeId: string) => {
    const payload = JSON.stringify({
      id: `evt_refunds_${Date.now()}_${seq++}`,
      object: 'event',
      type: 'charge.refunded',
      data: { object: { id: chargeId, object: 'charge' } },
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
  const job = () => t.app.jobs.find((j) => j.name === 'reconcile-refunds')!.run();

  it('never counts a staff refund twice when its charge.refunded event arrives', async () => {
    const o = await twoLineOrder();
    await refund(o.order.id, { amountCents: 2000 });
    expect((await webhook(o.chargeId)).status).toBe(200);
    await job();
    const rows = await t.deps.db('shop_refunds').where('order_id', o.order.id);
    expect(rows.map((r) => [r.origin, r.amount_cents, r.state])).toEqual([['staff', 2000, 'succeeded']]);
    expect((await t.deps.db('shop_orders').where('id', o.order.id).first()).refunded_cents).toBe(2000);
  });

  it('records a refund made at the processor once, as processor-origin, from the job or the event', async () => {
    const o = await twoLineOrder();
    await t.processor.refunds.create({ charge: o.chargeId, amount: 1001 });
    await job();
    await job();
    expect((await webhook(o.chargeId)).status).toBe(200);
    const rows = await t.deps.db('shop_refunds').where('order_id', o.order.id);
    expect(rows.map((r) => [r.origin, r.amount_cents, r.state])).toEqual([['processor', 1001, 'succeeded']]);
    const shown = (await staff.get(`/api/admin/orders/${o.order.id}`)).body.order;
    expect(shown.refundedCents).toBe(1001);
    expect(shown.refunds[0]).toMatchObject({ origin: 'processor', amountCents: 1001 });
    expect(shown.refunds[0].goodsCents + shown.refunds[0].shippingCents + shown.refunds[0].taxCents).toBe(1001);
    const moves = await t.deps.db('money_movements').where({ reference: o.order.number, kind: 'refund' });
    expect(moves.map((m) => Number(m.gross_cents))).toEqual([-1001]);
  });

  it('settles a claim whose answer never came from the processor: succeeded if it has the refund, else released', async () => {
    const o = await twoLineOrder();
    const old = new Date(Date.now() - 3600_000);
    const claim = async (key: string, amount: number) => {
      const [row] = await t.deps
        .db('shop_refunds')
        .insert({
          order_id: o.order.id,
          origin: 'staff',
          state: 'requested',
          amount_cents: amount,
          goods_cents: amount,
          idempotency_key: key,
          created_at: old,
        })
        .returning('id');
      return Number(row.id);
    };
    const landed = await claim(`padside-shop-refund-lost-${Date.now()}`, 700);
    const never = await claim(`padside-shop-refund-never-${Date.now()}`, 300);
    // The processor took the first (same key, as the claim's call would have sent it); the second never reached it.
    const landedRow = await t.deps.db('shop_refunds').where('id', landed).first();
    await t.deps.payments.refund(o.chargeId, 700, landedRow.idempotency_key);
    await job();
    const states = await t.deps.db('shop_refunds').whereIn('id', [landed, never]).orderBy('id');
    expect(states.map((r) => r.state)).toEqual(['succeeded', 'failed']);
    expect((await t.deps.db('shop_orders').where('id', o.order.id).first()).refunded_cents).toBe(700);
    expect(await t.deps.db('shop_refunds').where('order_id', o.order.id).where('origin', 'processor')).toHaveLength(0);
  });
});
