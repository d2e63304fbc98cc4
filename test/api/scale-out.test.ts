import path from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import { BenchClient } from '../../bench/bench-client';
import { startServerProcess, type ServerProcess } from '../helpers/server-process';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { createUser, type TestUser } from '../helpers/users';

let t: TestApp;
let admin: TestUser;
const running: ServerProcess[] = [];

beforeAll(async () => {
  t = buildTestApp();
  admin = await createUser(t.deps.db, ['fan', 'treasurer', 'admin'], 'Scale Admin');
});
afterAll(async () => {
  await Promise.all(running.map((s) => s.kill('SIGKILL')));
  await t.close();
});

async function start(env: Record<string, string> = {}): Promise<ServerProcess> {
  const s = await startServerProcess(env);
  running.push(s);
  return s;
}

/** A product with a small run, opened now, created through the API of `url`. */
async function dropProduct(
  url: string,
  cap: number,
): Promise<{ slug: string; variantIds: number[]; pickupId: number }> {
  const staff = new BenchClient(url);
  await staff.post('/api/auth/login', { email: admin.email, password: admin.password });
  const now = Date.now();
  const unique = `${now}-${Math.random().toString(36).slice(2, 6)}`;
  const created = await staff.post('/api/admin/products', {
    name: `Scale-out tee ${unique}`,
    description: 'Drop test.',
    priceCents: 2500,
    weightGrams: 180,
    variants: [
      { label: 'M', sku: `SO-${unique}-M` },
      { label: 'L', sku: `SO-${unique}-L` },
    ],
    run: { cap, opensAt: new Date(now - 60_000).toISOString(), closesAt: new Date(now + 3600_000).toISOString() },
  });
  if (created.status !== 201) throw new Error(`product: ${created.status} ${JSON.stringify(created.body)}`);
  const slug =
    (created.body as { slug?: string; product?: { slug: string } }).slug ??
    (created.body as { product: { slug: string } }).product.slug;
  const detail = (await staff.get(`/api/products/${slug}`)).body as { variants: { id: number }[] };
  const methods = (await staff.get('/api/shipping-methods')).body as { items: { id: number; code: string }[] };
  return {
    slug,
    variantIds: detail.variants.map((v) => v.id),
    pickupId: methods.items.find((m) => m.code === 'pickup')!.id,
  };
}

function buy(url: string, p: { variantIds: number[]; pickupId: number }, i: number) {
  return new BenchClient(url).post('/api/orders', {
    items: [{ variantId: p.variantIds[i % p.variantIds.length], quantity: 1 }],
    shipTo: {
      name: `Buyer ${i}`,
      line1: '1 Pad Road',
      city: 'Gopher Flats',
      province: 'MB',
      postalCode: 'R0A 0A0',
      country: 'CA',
    },
    shippingMethodId: p.pickupId,
    email: `scale-${Date.now()}-${i}@example.test`,
    paymentToken: 'tok_visa',
  });
}

describe('two server processes on one database', () => {
  it('sell exactly the cap in a drop split between them, and share sessions', async () => {
    const [a, b] = await Promise.all([start(), start()]);
    const product = await dropProduct(a.url, 12);
    const results = await Promise.all(Array.from({ length: 40 }, (_, i) => buy(i % 2 ? b.url : a.url, product, i)));
    const paid = results.filter((r) => r.status === 201).length;
    expect(paid).toBe(12);
    expect(results.filter((r) => r.status === 409).length).toBe(28);
    const after = (await new BenchClient(b.url).get(`/api/products/${product.slug}`)).body as {
      run: { remaining: number };
    };
    expect(after.run.remaining).toBe(0);

    // A session made on one process is honoured by the other: the cookie store is PostgreSQL.
    const client = new BenchClient(a.url);
    await client.post('/api/auth/login', { email: admin.email, password: admin.password });
    expect((await client.at(b.url).get('/api/auth/me')).status).toBe(200);
  });
});

describe('a server process killed in the middle of checkouts', () => {
  it('leaves, after a restart and reconciliation, every charge with its paid order and every paid order with its charge', async () => {
    const a = await start();
    const product = await dropProduct(a.url, 60);
    const inflight = Array.from({ length: 60 }, (_, i) =>
      buy(a.url, product, i).catch(() => ({ status: 0, body: null })),
    );
    // Kill the process as soon as the first checkout answers, so the others are cut off part-way.
    await Promise.race(inflight);
    await a.kill('SIGKILL');
    const outcomes = await Promise.all(inflight);
    expect(outcomes.filter((o) => o.status === 0).length).toBeGreaterThan(0);
    await start();

    // Reconciliation looks at orders pending for a while: run it as if 30 minutes had passed.
    const later = buildTestApp({ clock: fixedClock(new Date(Date.now() + 30 * 60_000).toISOString()) });
    try {
      await later.app.jobs.find((j) => j.name === 'shop-reconcile-payments')!.run();
      const orders = await later.deps
        .db('shop_orders as o')
        .join('shop_order_items as i', 'i.order_id', 'o.id')
        .select('o.id', 'o.status', 'o.charge_id')
        .whereIn('i.variant_id', product.variantIds);
      expect(orders.filter((o) => o.status === 'pending')).toEqual([]);
      for (const o of orders.filter((x) => x.status === 'paid')) expect(o.charge_id).toBeTruthy();
      // Every succeeded charge the processor holds for these orders belongs to a paid order.
      const ids = new Set(orders.map((o) => String(o.id)));
      const charges = (await later.processor.charges.list({ limit: 100 })).data.filter(
        (c) => ids.has(c.metadata?.orderId ?? '') && c.status === 'succeeded',
      );
      for (const c of charges) {
        const order = orders.find((o) => String(o.id) === c.metadata.orderId)!;
        expect({ order: order.id, status: order.status, charge: order.charge_id }).toEqual({
          order: order.id,
          status: 'paid',
          charge: c.id,
        });
      }
      expect(charges.length).toBe(orders.filter((o) => o.status === 'paid').length);
    } finally {
      await later.close();
    }
  });
});

describe('two server processes on one database and one object store', () => {
  it('serve through one what an editor uploaded and published through the other: the image and the credits', async () => {
    // Each process with a data folder of its own, as on two machines: only the bucket is shared.
    const machine = (name: string) => ({
      STORAGE_URL: String(process.env.TEST_STORAGE_URL),
      DATA_DIR: path.join(String(process.env.TEST_TMP), `machine-${name}`),
    });
    const [a, b] = await Promise.all([start(machine('a')), start(machine('b'))]);
    const editorUser = await createUser(t.deps.db, ['fan', 'editor'], 'Scale Editor');
    const editor = request.agent(a.url);
    const csrf = async () => (await editor.get('/api/auth/csrf')).body.csrfToken as string;
    // The token first: the agent attaches its cookies when the request is created.
    const signInToken = await csrf();
    expect(
      (
        await editor
          .post('/api/auth/login')
          .set('X-CSRF-Token', signInToken)
          .send({ email: editorUser.email, password: editorUser.password })
      ).status,
    ).toBe(200);
    const token = await csrf();

    const unique = `${Date.now()}-${Math.random().toString(36).slice(2, 6)}`;
    const photo = await sharp({
      create: { width: 64, height: 48, channels: 3, background: { r: 200, g: Date.now() % 256, b: 40 } },
    })
      .jpeg()
      .toBuffer();
    const uploaded = await editor
      .post('/api/admin/uploads')
      .set('X-CSRF-Token', token)
      .attach('file', photo, { filename: 'nose-cone.jpg', contentType: 'image/jpeg' });
    expect(uploaded.status).toBe(201);
    const sponsor = await editor
      .post('/api/admin/sponsors')
      .set('X-CSRF-Token', token)
      .send({ name: `Filamoose Supply ${unique}` });
    expect(sponsor.status).toBe(201);
    const post = await editor
      .post('/api/admin/posts')
      .set('X-CSRF-Token', token)
      .send({
        title: `Printing the nose cone ${unique}`,
        markdown: `The cone, fresh off the printer:\n\n![Nose cone](${uploaded.body.url})`,
        coverUrl: uploaded.body.url,
        status: 'published',
        credits: [sponsor.body.id],
      });
    expect(post.status).toBe(201);

    // A visitor who never touched process a.
    const visitor = request(b.url);
    const page = await visitor.get(`/api/posts/${post.body.slug}`);
    expect(page.status).toBe(200);
    expect(page.body.coverUrl).toBe(uploaded.body.url);
    expect(page.body.html).toContain(`src="${uploaded.body.url}"`);
    expect(page.body.credits.map((c: { name: string }) => c.name)).toEqual([`Filamoose Supply ${unique}`]);
    for (const url of [uploaded.body.url, uploaded.body.thumbnailUrl]) {
      const image = await visitor.get(url).buffer(true);
      expect(image.status).toBe(200);
      expect(image.headers['x-content-type-options']).toBe('nosniff');
      expect((await sharp(image.body as Buffer).metadata()).width).toBe(64);
    }
  });
});
