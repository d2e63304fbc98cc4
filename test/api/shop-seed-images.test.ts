import { seed as seedAccounts } from '../../seeds/01_demo_accounts';
import { seed as seedShop } from '../../seeds/02_shop';
import { seed as seedImages } from '../../seeds/05_shop_images';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client } from '../helpers/users';

let t: TestApp;

beforeAll(async () => {
  t = buildTestApp();
  await seedAccounts(t.deps.db);
  await seedShop(t.deps.db);
  await seedImages(t.deps.db);
  await seedImages(t.deps.db); // a second run keeps the photos it made
});
afterAll(() => t.close());

describe('the demo shop photos', () => {
  it('gives every demo product photos of our own with alt text and sizes, served as WebP at 1200 and 480 px', async () => {
    const api = new Client(t.app);
    const items = (await api.get('/api/products')).body.items as {
      slug: string;
      images: { url: string; thumbnailUrl: string; alt: string; width: number; height: number }[];
    }[];
    const counts = Object.fromEntries(
      ['season-3-shirt', 'season-2-shirt', 'nose-cone-pin', 'sticker-sheet'].map((slug) => [
        slug,
        items.find((p) => p.slug === slug)?.images.length,
      ]),
    );
    expect(counts).toEqual({ 'season-3-shirt': 2, 'season-2-shirt': 1, 'nose-cone-pin': 2, 'sticker-sheet': 1 });
    const shirt = items.find((p) => p.slug === 'season-3-shirt')!;
    for (const img of shirt.images) {
      expect(img.alt.length).toBeGreaterThan(20);
      expect([img.width, img.height]).toEqual([1200, 1200]);
      const full = await api.get(img.url);
      expect(full.headers['content-type']).toBe('image/webp');
      const thumb = await api.get(img.thumbnailUrl);
      expect(thumb.headers['content-type']).toBe('image/webp');
      expect(thumb.body.length).toBeLessThan(full.body.length);
    }
  });
});
