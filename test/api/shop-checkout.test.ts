import { waitForEmails } from '../helpers/maildev';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { chain, MB_ADDRESS, methodId, openShirt, stockSticker } from './shop-fixtures';

let t: TestApp;
let staff: Client;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

const body = async (c: Client, variantId: number, quantity = 1, extra: object = {}) => ({
  items: [{ variantId, quantity }],
  shipTo: MB_ADDRESS,
  shippingMethodId: await methodId(c, 'canada'),
  ...extra,
});

describe('GET /api/products', () => {
  it('lists an open run with its cap, units left and per-variant prices in CAD', async () => {
    const shirt = await openShirt(staff, { cap: 30 });
    const res = await new Client(t.app).get('/api/products');
    const p = res.body.items.find((x: { id: number }) => x.id === shirt.id);
    expect(p).toMatchObject({ currency: 'CAD', priceCents: 3500, run: { state: 'open', cap: 30, remaining: 30 } });
    expect(p.variants.map((v: { remaining: number }) => v.remaining)).toEqual([30, 30]);
    const one = await new Client(t.app).get(`/api/products/${shirt.slug}`);
    expect(one.body.descriptionHtml).toContain('<strong>test</strong>');
  });
});

describe('POST /api/checkout/quote', () => {
  describe('when a member buys two shirts shipped to Manitoba', () => {
    it('takes 10% off before tax, then charges GST on goods and shipping and RST as set', async () => {
      const shirt = await openShirt(staff);
      const { client } = await signedIn(t.app, t.deps.db, ['fan', 'member']);
      const res = await client.post('/api/checkout/quote', await body(client, shirt.variants[0].id, 2));
      expect(res.status).toBe(200);
      // 2 x 35.00 = 70.00; 10% = 7.00; goods 63.00; 400 g -> 9.00 shipping (first bracket).
      // GST 5% (CRA rate page) of 72.00 = 3.60; RST 7% (Manitoba Finance) of 72.00 = 5.04 (MB shipping setting on).
      expect(res.body).toMatchObject({
        subtotalCents: 7000,
        discountCents: 700,
        shippingCents: 900,
        taxCents: 864,
        totalCents: 8064,
      });
      expect(res.body.taxLines).toEqual([
        { code: 'GST', label: 'GST 5%', ratePercent: '5', amountCents: 360 },
        { code: 'RST', label: 'RST 7%', ratePercent: '7', amountCents: 504 },
      ]);
    });
  });
  describe('when a fan ships to Ontario', () => {
    it('charges HST 13% on goods and shipping, no discount (CRA rate page: ON 13%)', async () => {
      const shirt = await openShirt(staff);
      const c = new Client(t.app);
      const res = await c.post(
        '/api/checkout/quote',
        await body(c, shirt.variants[0].id, 1, { shipTo: { ...MB_ADDRESS, province: 'ON', postalCode: 'K1A 0B1' } }),
      );
      expect(res.body).toMatchObject({
        subtotalCents: 3500,
        discountCents: 0,
        shippingCents: 900,
        taxLines: [{ code: 'HST', amountCents: 572 }],
        totalCents: 4972,
      });
    });
  });
  describe('when the address does not fit the method or is incomplete', () => {
    it('answers 400 with the field to fix', async () => {
      const shirt = await openShirt(staff);
      const c = new Client(t.app);
      const res = await c.post(
        '/api/checkout/quote',
        await body(c, shirt.variants[0].id, 1, { shipTo: { ...MB_ADDRESS, country: 'US', postalCode: 'R0K' } }),
      );
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toHaveProperty('shippingMethodId');
      expect(res.body.error.fields).toHaveProperty(['shipTo.postalCode']);
      const bad = await c.post('/api/checkout/quote', { items: [{ variantId: 'x', quantity: -1 }] });
      expect(bad.status).toBe(400);
      expect(Object.keys(bad.body.error.fields)).toEqual(
        expect.arrayContaining(['items.0.variantId', 'items.0.quantity', 'shipTo']),
      );
    });
  });
  describe('when the postal code belongs to another province', () => {
    it('answers 400 naming the postal code (Canada Post first letters, from memory: R is Manitoba, K Ontario)', async () => {
      const shirt = await openShirt(staff);
      const c = new Client(t.app);
      const res = await c.post(
        '/api/checkout/quote',
        await body(c, shirt.variants[0].id, 1, { shipTo: { ...MB_ADDRESS, province: 'ON', postalCode: 'R0K 1A0' } }),
      );
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(Object.keys(res.body.error.fields)).toEqual(['shipTo.postalCode']);
      expect(res.body.error.fields['shipTo.postalCode']).toMatch(/not in ON.*K, L, M, N, P/);
      // The same code with its own province is priced.
      const ok = await c.post(
        '/api/checkout/quote',
        await body(c, shirt.variants[0].id, 1, { shipTo: { ...MB_ADDRESS, province: 'mb', postalCode: 'r0k 1a0' } }),
      );
      expect(ok.status).toBe(200);
    });
  });
  describe('when shipping abroad', () => {
    it('charges no Canadian tax', async () => {
      const shirt = await openShirt(staff);
      const c = new Client(t.app);
      const res = await c.post('/api/checkout/quote', {
        items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
        shipTo: { name: 'A', line1: '1 Rue', city: 'Lyon', postalCode: '69001', country: 'FR' },
        shippingMethodId: await methodId(c, 'international'),
      });
      expect(res.body).toMatchObject({ taxLines: [], taxCents: 0, shippingCents: 2600, totalCents: 6100 });
    });
  });
});

describe('POST /api/orders', () => {
  describe('when a guest pays with a test Visa', () => {
    it('answers 201 paid, records the movement with its taxes, and the confirmation arrives with the totals', async () => {
      const shirt = await openShirt(staff, { cap: 10 });
      const c = new Client(t.app);
      const email = `guest-${Date.now()}@example.test`;
      const res = await c.post('/api/orders', {
        ...(await body(c, shirt.variants[1].id, 2)),
        email,
        paymentToken: 'tok_visa',
      });
      expect(res.status).toBe(201);
      expect(res.body.order).toMatchObject({ status: 'paid', subtotalCents: 7000, shippingCents: 900 });
      const mv = await t.deps.db('money_movements').where({ reference: res.body.order.number }).first();
      expect(mv).toMatchObject({ kind: 'order_payment', source: 'merch', method: 'card', fee_estimated: true });
      expect(Number(mv.gross_cents)).toBe(res.body.order.totalCents);
      // The fake's test Visa is a US card: Stripe Canadian pricing 2.9% + 0.8% international + C$0.30
      // (Stripe Support, October 2023 pricing update): 8848 * 0.037 = 327.38 -> 327 + 30.
      expect(res.body.order.totalCents).toBe(8848);
      expect(Number(mv.fee_cents)).toBe(357);
      // 70.00 + 9.00 shipping = 79.00 taxed: GST 5% 3.95 (CRA rate page), RST 7% 5.53 (Manitoba Finance).
      const taxes = await t.deps.db('money_movement_taxes').where({ movement_id: mv.id }).orderBy('code');
      expect(taxes.map((x) => [x.code, x.jurisdiction, Number(x.tax_cents)])).toEqual([
        ['GST', 'MB', 395],
        ['RST', 'MB', 553],
      ]);
      expect((await c.get(`/api/orders/${res.body.order.id}`)).status).toBe(200);
      expect((await new Client(t.app).get(`/api/orders/${res.body.order.id}`)).status).toBe(404);
      await t.deps.mail.deliverDue();
      const [mail] = await waitForEmails(email, /Thrust & Filament order PS-/);
      expect(mail.text).toContain('Total: $88.48');
      expect(mail.text).toContain('GST 5%: $3.95');
      expect(mail.text).toContain('RST 7%: $5.53');
      const product = await c.get(`/api/products/${shirt.slug}`);
      expect(product.body.run.remaining).toBe(8);
    });
  });

  describe('when the card is declined', () => {
    it.each(['tok_chargeDeclined', 'tok_chargeDeclinedInsufficientFunds'])(
      '%s: answers 402 with the message, fails the order and gives the units back',
      async (token) => {
        const shirt = await openShirt(staff, { cap: 5 });
        const c = new Client(t.app);
        const res = await c.post('/api/orders', {
          ...(await body(c, shirt.variants[0].id, 3)),
          email: 'declined@example.test',
          paymentToken: token,
        });
        expect(res.status).toBe(402);
        expect(res.body.error.code).toBe('payment_declined');
        expect(res.body.error.message).toMatch(/declined|insufficient/i);
        expect((await t.deps.db('shop_runs').where('id', shirt.run.id).first()).reserved).toBe(0);
        expect(
          await t.deps
            .db('shop_orders')
            .where({ email: 'declined@example.test', status: 'failed' })
            .count('* as n')
            .first(),
        ).toBeTruthy();
      },
    );
  });

  describe('when the processor answers 429 once (tok_429|tok_visa|…)', () => {
    it('retries with the same key: one request, one charge, one paid order', async () => {
      const shirt = await openShirt(staff);
      const c = new Client(t.app);
      const res = await c.post('/api/orders', {
        ...(await body(c, shirt.variants[0].id)),
        email: 'rate@example.test',
        paymentToken: chain('tok_429'),
      });
      expect(res.status).toBe(201);
      expect(res.body.order.status).toBe('paid');
      const charges = await t.processor.charges.list({ limit: 100 });
      expect(charges.data.filter((ch) => ch.metadata.orderId === String(res.body.order.id))).toHaveLength(1);
      expect(
        await t.deps.db('money_movements').where({ reference: res.body.order.number }).count('* as n').first(),
      ).toEqual({ n: 1 });
    });
  });

  describe('when the run is full', () => {
    it('answers 409 sold_out and the sticker stock never goes below zero', async () => {
      const shirt = await openShirt(staff, { cap: 1 });
      const c = new Client(t.app);
      expect(
        (
          await c.post('/api/orders', {
            ...(await body(c, shirt.variants[0].id)),
            email: 'a@example.test',
            paymentToken: 'tok_visa',
          })
        ).status,
      ).toBe(201);
      const again = await c.post('/api/orders', {
        ...(await body(c, shirt.variants[1].id)),
        email: 'b@example.test',
        paymentToken: 'tok_visa',
      });
      expect(again.status).toBe(409);
      expect(again.body.error.code).toBe('sold_out');
      const sticker = await stockSticker(staff, 2);
      expect(
        (
          await c.post('/api/orders', {
            ...(await body(c, sticker.variants[0].id, 3)),
            email: 'c@example.test',
            paymentToken: 'tok_visa',
          })
        ).body.error.code,
      ).toBe('sold_out');
      expect(
        (
          await c.post('/api/orders', {
            ...(await body(c, sticker.variants[0].id, 2)),
            email: 'c@example.test',
            paymentToken: 'tok_visa',
          })
        ).status,
      ).toBe(201);
      expect((await t.deps.db('shop_variants').where('id', sticker.variants[0].id).first()).stock_on_hand).toBe(0);
    });
  });
});

describe('GET /api/account/orders', () => {
  it('lists only the signed-in buyer’s orders, and another fan gets 404 on the order', async () => {
    const shirt = await openShirt(staff);
    const { client, user } = await signedIn(t.app, t.deps.db, ['fan']);
    const placed = await client.post('/api/orders', {
      ...(await body(client, shirt.variants[0].id)),
      email: user.email,
      paymentToken: 'tok_mastercard',
    });
    expect(placed.status).toBe(201);
    const mine = await client.get('/api/account/orders');
    expect(mine.body.items.map((o: { id: number }) => o.id)).toEqual([placed.body.order.id]);
    const other = (await signedIn(t.app, t.deps.db, ['fan'])).client;
    expect((await other.get(`/api/orders/${placed.body.order.id}`)).status).toBe(404);
    expect((await staff.get(`/api/orders/${placed.body.order.id}`)).status).toBe(200);
  });
});
