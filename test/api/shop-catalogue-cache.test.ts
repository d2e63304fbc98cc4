import type { Knex } from 'knex';
import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { recordedQueries } from '../helpers/recorded-queries';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

let a: TestApp;
let b: TestApp;
let staff: Client;

beforeAll(async () => {
  // Two app instances, each with its own pool and its own LISTEN connection, like two server processes on one database.
  a = buildTestApp();
  b = buildTestApp();
  staff = (await signedIn(a.app, a.deps.db, ['fan', 'treasurer'])).client;
});
afterAll(async () => {
  await a.close();
  await b.close();
});

/** Counts the catalogue queries an instance sends while `fn` runs. */
async function catalogueQueries(db: Knex, fn: () => Promise<unknown>): Promise<number> {
  return (await recordedQueries(db, fn)).filter((sql) => /from "shop_products"/.test(sql)).length;
}

/**
 * Reads the list until one read costs no query (served from the instance's copy) and returns that answer. Other
 * suites share the database and may change the catalogue between two reads, so a few tries are allowed.
 */
async function cachedList(app: TestApp): Promise<request.Response> {
  for (let i = 0; i < 10; i++) {
    await request(app.app).get('/api/products');
    let res!: request.Response;
    if ((await catalogueQueries(app.deps.db, async () => (res = await request(app.app).get('/api/products')))) === 0)
      return res;
  }
  throw new Error('every read of the list queried the database');
}

const remainingOf = (body: { items: { slug: string; run: { remaining: number } | null }[] }, slug: string) =>
  body.items.find((i) => i.slug === slug)?.run?.remaining;

async function buy(app: TestApp, variantId: number, i: number) {
  const buyer = new Client(app.app);
  return buyer.post('/api/orders', {
    items: [{ variantId, quantity: 1 }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(buyer, 'pickup'),
    email: `cache-${i}-${Date.now()}@example.test`,
    paymentToken: 'tok_visa',
  });
}

describe('GET /api/products', () => {
  it('answers with an ETag and no-cache, sets no session cookie, and answers 304 to the same If-None-Match', async () => {
    const first = await request(a.app).get('/api/products');
    expect(first.status).toBe(200);
    expect(first.headers['cache-control']).toBe('no-cache');
    expect(first.headers['set-cookie']).toBeUndefined();
    const etag = first.headers.etag;
    expect(etag).toMatch(/^"[A-Za-z0-9_-]{27}"$/);
    const again = await request(a.app).get('/api/products').set('If-None-Match', etag);
    expect(again.status).toBe(304);
    expect(again.text ?? '').toBe('');
    expect((await request(a.app).get('/api/products').set('If-None-Match', '"something-else"')).status).toBe(200);
  });

  it('builds the list with one query and then serves it without one until something changes', async () => {
    await openShirt(staff, { cap: 5 });
    expect(await catalogueQueries(a.deps.db, () => request(a.app).get('/api/products'))).toBe(1);
    expect((await cachedList(a)).status).toBe(200);
  });

  describe('when staff change a product', () => {
    it('gives the list and the product page a new ETag and the new price, on this instance and on the other', async () => {
      const shirt = await openShirt(staff, { priceCents: 3000 });
      const before = {
        list: await request(b.app).get('/api/products'),
        page: await request(b.app).get(`/api/products/${shirt.slug}`),
      };
      expect(before.page.body.priceCents).toBe(3000);
      expect((await staff.patch(`/api/admin/products/${shirt.id}`, { priceCents: 3300 })).status).toBe(200);
      // No waiting: the read itself catches up with what was committed before it.
      for (const app of [a, b]) {
        const page = await request(app.app)
          .get(`/api/products/${shirt.slug}`)
          .set('If-None-Match', before.page.headers.etag);
        expect(page.status).toBe(200);
        expect(page.body.priceCents).toBe(3300);
        const list = await request(app.app).get('/api/products').set('If-None-Match', before.list.headers.etag);
        expect(list.status).toBe(200);
        expect(list.body.items.find((i: { id: number }) => i.id === shirt.id).priceCents).toBe(3300);
      }
    });
  });

  describe('when a unit sells on one instance', () => {
    it('shows one unit fewer on the other at once, which had the list cached and learns of the sale through LISTEN/NOTIFY', async () => {
      const shirt = await openShirt(staff, { cap: 5 });
      const before = await cachedList(b);
      expect(remainingOf(before.body, shirt.slug)).toBe(5);
      expect((await buy(a, shirt.variants[0].id, 0)).status).toBe(201);
      let after!: request.Response;
      // b rebuilds because a notification reached it, not because it reads every time (counted above).
      expect(await catalogueQueries(b.deps.db, async () => (after = await request(b.app).get('/api/products')))).toBe(
        1,
      );
      expect(after.headers.etag).not.toBe(before.headers.etag);
      expect(remainingOf(after.body, shirt.slug)).toBe(4);
    });
  });

  describe('when a row changes outside the app', () => {
    it('drops the cached list too: the trigger notifies for any committed write', async () => {
      const shirt = await openShirt(staff, { cap: 5 });
      expect(remainingOf((await cachedList(b)).body, shirt.slug)).toBe(5);
      await a.deps.db('shop_runs').where('id', shirt.run.id).update({ reserved: 2 });
      expect(remainingOf((await request(b.app).get('/api/products')).body, shirt.slug)).toBe(3);
    });
  });

  describe('when ten checkouts on two instances race for six units', () => {
    it('never shows more units than are left, on either instance, and ends at exactly zero', async () => {
      const cap = 6;
      const shirt = await openShirt(staff, { cap });
      let paid = 0;
      let done = false;
      const checkouts = Promise.all(
        Array.from({ length: 10 }, async (_, i) => {
          const res = await buy(i % 2 ? b : a, shirt.variants[i % 2].id, i);
          if (res.status === 201) paid++;
          return res.status;
        }),
      ).finally(() => (done = true));
      const seen: { shown: number; left: number }[] = [];
      const watch = async (app: TestApp) => {
        while (!done) {
          // Units left when this read starts, counting only sales already answered: the most it may show.
          const left = cap - paid;
          const res = await request(app.app).get(`/api/products/${shirt.slug}`);
          seen.push({ shown: res.body.run.remaining, left });
        }
      };
      const [statuses] = await Promise.all([checkouts, watch(a), watch(b)]);
      expect(statuses.filter((s) => s === 201)).toHaveLength(cap);
      expect(statuses.filter((s) => s !== 201 && s !== 409)).toEqual([]);
      expect(seen.length).toBeGreaterThan(0);
      expect(seen.filter((s) => s.shown > s.left)).toEqual([]);
      for (const app of [a, b])
        expect((await request(app.app).get(`/api/products/${shirt.slug}`)).body.run.remaining).toBe(0);
    });
  });
});

describe('GET /api/products/:slug', () => {
  it('answers 404 for a product that does not exist, and 304 to the ETag of the product page', async () => {
    expect((await request(a.app).get('/api/products/no-such-product-here')).status).toBe(404);
    const shirt = await openShirt(staff);
    const page = await request(a.app).get(`/api/products/${shirt.slug}`);
    expect(page.status).toBe(200);
    expect(page.body.descriptionHtml).toContain('<strong>test</strong>');
    expect(
      (await request(a.app).get(`/api/products/${shirt.slug}`).set('If-None-Match', page.headers.etag)).status,
    ).toBe(304);
  });
});
