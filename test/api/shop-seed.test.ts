import { seed as seedAccounts } from '../../seeds/01_demo_accounts';
import { seed as seedShop } from '../../seeds/02_shop';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

let t: TestApp;

beforeAll(async () => {
  t = buildTestApp();
  await seedAccounts(t.deps.db);
  await seedShop(t.deps.db);
  await seedShop(t.deps.db); // a second run adds nothing
});
afterAll(() => t.close());

describe('the demo shop data', () => {
  it('has the open Season 3 run in seven sizes, an earlier shipped run, and stock items', async () => {
    const items = (await new Client(t.app).get('/api/products')).body.items as {
      slug: string;
      run: { state: string; cap: number } | null;
      variants: { sku: string }[];
    }[];
    const s3 = items.filter((p) => p.slug === 'season-3-shirt');
    expect(s3).toHaveLength(1);
    expect(s3[0].run).toMatchObject({ state: 'open', cap: 150 });
    expect(s3[0].variants.map((v) => v.sku)).toEqual([
      'TF-S3-XS',
      'TF-S3-S',
      'TF-S3-M',
      'TF-S3-L',
      'TF-S3-XL',
      'TF-S3-2XL',
      'TF-S3-3XL',
    ]);
    expect(items.find((p) => p.slug === 'season-2-shirt')?.run?.state).toBe('shipped');
    expect(items.find((p) => p.slug === 'sticker-sheet')?.run).toBeNull();
  });

  it('gives a clear 409 when staff refund a demo order paid outside the processor', async () => {
    const staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
    const fan = await t.deps.db('users').where('email', 'fan@padside.test').first();
    const order = await t.deps.db('shop_orders').where({ user_id: fan.id, status: 'paid' }).first();
    const res = await staff.post(`/api/admin/orders/${order.id}/refund`, { amountCents: 100 });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_processor_paid');
  });
});
