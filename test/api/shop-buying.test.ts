import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { chain, MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

let t: TestApp;
let staff: Client;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

const body = async (c: Client, items: { variantId: number; quantity: number }[], extra: object = {}) => ({
  items,
  shipTo: MB_ADDRESS,
  shippingMethodId: await methodId(c, 'canada'),
  ...extra,
});

describe('POST /api/checkout/quote', () => {
  describe('when a cart holds more of a product than its per-order limit', () => {
    it('answers 400 naming the quantity field, counting every size of the product together', async () => {
      const shirt = await openShirt(staff);
      expect((await staff.patch(`/api/admin/products/${shirt.id}`, { maxPerOrder: 3 })).body.product.maxPerOrder).toBe(
        3,
      );
      const buyer = new Client(t.app);
      const ok = await buyer.post(
        '/api/checkout/quote',
        await body(buyer, [{ variantId: shirt.variants[0].id, quantity: 3 }]),
      );
      expect(ok.status).toBe(200);
      const over = await buyer.post(
        '/api/checkout/quote',
        await body(buyer, [
          { variantId: shirt.variants[0].id, quantity: 2 },
          { variantId: shirt.variants[1].id, quantity: 2 },
        ]),
      );
      expect(over.status).toBe(400);
      expect(over.body.error.fields['items.0.quantity']).toMatch(/At most 3 of .* per order/);
    });
  });

  describe('when staff set a limit out of range', () => {
    it('answers 400 with the field', async () => {
      const shirt = await openShirt(staff);
      const res = await staff.patch(`/api/admin/products/${shirt.id}`, { maxPerOrder: 0 });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.maxPerOrder).toBe('At least 1.');
    });
  });
});

describe('GET /api/orders/:id with the e-mailed key', () => {
  it('opens the order in a browser session that never placed it, and refuses a wrong key or another order’s key', async () => {
    const shirt = await openShirt(staff);
    const guest = new Client(t.app);
    const placed = await guest.post(
      '/api/orders',
      await body(guest, [{ variantId: shirt.variants[0].id, quantity: 1 }], {
        email: 'guest-key@padside.test',
        paymentToken: chain(),
      }),
    );
    expect(placed.status).toBe(201);
    const id = placed.body.order.id as number;
    const row = await t.deps.db('shop_orders').where('id', id).first();
    const { OrderLinks } = await import('../../server/shop/order-links');
    const links = new OrderLinks(t.config.sessionSecret, t.config.publicUrl);
    const key = links.keyFor(id, row.email);

    const stranger = new Client(t.app);
    expect((await stranger.get(`/api/orders/${id}`)).status).toBe(404);
    expect((await stranger.get(`/api/orders/${id}?key=${links.keyFor(id, 'someone-else@padside.test')}`)).status).toBe(
      404,
    );
    expect((await stranger.get(`/api/orders/${id}?key=${links.keyFor(id + 1, row.email)}`)).status).toBe(404);
    const opened = await stranger.get(`/api/orders/${id}?key=${key}`);
    expect(opened.status).toBe(200);
    expect(opened.body.order.number).toBe(row.number);
    // The session now remembers it, as it does for the browser that placed it.
    expect((await stranger.get(`/api/orders/${id}`)).status).toBe(200);
  });
});
