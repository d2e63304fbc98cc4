import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { recordedQueries } from '../helpers/recorded-queries';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

let t: TestApp;
let staff: Client;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(() => t.close());

/** The session row behind a client, found by its CSRF token (each session has its own). */
async function sessionRow(
  client: Client,
): Promise<{ sid: string; sess: Record<string, unknown>; expire: Date } | undefined> {
  return t.deps
    .db('session')
    .whereRaw("sess->>'csrfToken' = ?", [await client.token()])
    .first();
}

describe('POST /api/orders as a guest', () => {
  it('reads the order once on the way to paid, and the guest sees the confirmation in the same browser', async () => {
    const shirt = await openShirt(staff, { cap: 5 });
    const guest = new Client(t.app);
    const pickup = await methodId(guest, 'pickup');
    await guest.token();
    let placed!: request.Response;
    const sql = await recordedQueries(t.deps.db, async () => {
      placed = await guest.post('/api/orders', {
        items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
        shipTo: MB_ADDRESS,
        shippingMethodId: pickup,
        email: `writes-${Date.now()}@example.test`,
        paymentToken: 'tok_visa',
      });
    });
    expect(placed.status).toBe(201);
    expect(placed.body.order.status).toBe('paid');
    // Before: the order, its lines, taxes and refunds were read three times (after the charge, inside the settling
    // transaction and after it). Now the settling update returns the order and the lines and taxes are read once.
    expect(sql.filter((q) => /^select \* from "shop_order_items"/.test(q))).toHaveLength(1);
    expect(sql.filter((q) => /^select \* from "shop_order_taxes"/.test(q))).toHaveLength(1);
    expect(sql.filter((q) => /^select \* from "shop_refunds"/.test(q))).toHaveLength(0);
    // The catalogue is read once, for the quote.
    expect(sql.filter((q) => /from "shop_products"/.test(q))).toHaveLength(1);

    const row = await sessionRow(guest);
    expect(row?.sess.shopOrderIds).toEqual([placed.body.order.id]);
    const shown = await guest.get(`/api/orders/${placed.body.order.id}`);
    expect(shown.status).toBe(200);
    expect(shown.body.order.number).toBe(placed.body.order.number);
  });
});

describe('a session that did not change', () => {
  it('is not written again on each request: its stored expiry stays until an hour has passed', async () => {
    const guest = new Client(t.app);
    await guest.token();
    const before = await sessionRow(guest);
    expect(before).toBeDefined();
    await new Promise((r) => setTimeout(r, 20));
    for (let i = 0; i < 3; i++) expect((await guest.get('/api/auth/me')).status).toBe(200);
    const after = await sessionRow(guest);
    expect(after!.expire.getTime()).toBe(before!.expire.getTime());
    expect(after!.sess).toEqual(before!.sess);
  });

  it('is written again once it was last written more than an hour ago, moving its expiry on', async () => {
    const guest = new Client(t.app);
    await guest.token();
    const before = (await sessionRow(guest))!;
    // As if it had been written 61 minutes ago.
    const earlier = new Date(before.expire.getTime() - 61 * 60_000);
    await t.deps
      .db('session')
      .where('sid', before.sid)
      .update({ expire: earlier, sess: JSON.stringify({ ...before.sess, storedAt: Date.now() - 61 * 60_000 }) });
    expect((await guest.get('/api/auth/me')).status).toBe(200);
    const after = (await sessionRow(guest))!;
    expect(after.expire.getTime()).toBeGreaterThanOrEqual(before.expire.getTime());
    expect(Number(after.sess.storedAt)).toBeGreaterThan(Date.now() - 60_000);
  });
});
