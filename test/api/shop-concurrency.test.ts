import { serve } from '../helpers/browser';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, openShirt } from './shop-fixtures';
import request from 'supertest';

let a: TestApp;
let b: TestApp;
let sites: { baseUrl: string; stop(): Promise<void> }[];

beforeAll(async () => {
  // Two app instances, each with its own pool, like two server processes on one database.
  a = buildTestApp();
  b = buildTestApp();
  sites = [await serve(a), await serve(b)];
});
afterAll(async () => {
  for (const s of sites) await s.stop();
  await a.close();
  await b.close();
});

describe('POST /api/orders from many buyers at once across two processes', () => {
  it('sells exactly the cap and never goes below zero', async () => {
    const staff = (await signedIn(a.app, a.deps.db, ['fan', 'treasurer'])).client;
    const cap = 7;
    const shirt = await openShirt(staff, { cap, variantCaps: { L: 3 } });
    const pickup = (await new Client(a.app).get('/api/shipping-methods')).body.items.find(
      (m: { code: string }) => m.code === 'pickup',
    ).id;
    const buyers = 30;
    const results = await Promise.all(
      Array.from({ length: buyers }, async (_, i) => {
        const agent = request.agent(sites[i % 2].baseUrl);
        const csrf = (await agent.get('/api/auth/csrf')).body.csrfToken;
        const variantId = shirt.variants[i % 3 === 0 ? 1 : 0].id;
        const res = await agent
          .post('/api/orders')
          .set('X-CSRF-Token', csrf)
          .send({
            items: [{ variantId, quantity: 1 }],
            shipTo: MB_ADDRESS,
            shippingMethodId: pickup,
            email: `rush-${i}@example.test`,
            paymentToken: 'tok_visa',
          });
        return res.status;
      }),
    );
    expect(results.filter((s) => s === 201)).toHaveLength(cap);
    expect(results.filter((s) => s !== 201 && s !== 409)).toEqual([]);
    const run = await a.deps.db('shop_runs').where('id', shirt.run.id).first();
    expect(run.reserved).toBe(cap);
    const capL = await a.deps.db('shop_run_variant_caps').where({ run_id: shirt.run.id }).first();
    expect(capL.reserved).toBeLessThanOrEqual(3);
    const sold = await a.deps
      .db('shop_order_items as i')
      .join('shop_orders as o', 'o.id', 'i.order_id')
      .where('i.run_id', shirt.run.id)
      .where('o.status', 'paid')
      .sum('i.quantity as n')
      .first();
    expect(Number(sold!.n)).toBe(cap);
  });
});
