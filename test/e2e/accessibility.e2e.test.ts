import type { Browser } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { browserSuite, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';

let t: TestApp;
let browser: Browser;
let site: Site;
let productSlug = '';
let postSlug = '';

browserSuite({}, async (s) => {
  ({ t, site, browser } = s);
  // This file's own product and build log, so the pages under test never depend on other tests' data.
  const staff = new Client(t.app);
  await staff.signIn(await createUser(t.deps.db, ['fan', 'editor', 'treasurer', 'admin'], 'A11y Staff'));
  const now = Date.now();
  const product = await staff.post('/api/admin/products', {
    name: `Access check tee ${now}`,
    description: 'A **soft** cotton tee.',
    priceCents: 3000,
    weightGrams: 200,
    variants: [{ label: 'S' }, { label: 'M' }],
    run: {
      cap: 20,
      opensAt: new Date(now - 60_000).toISOString(),
      closesAt: new Date(now + 7 * 86_400_000).toISOString(),
    },
  });
  productSlug = product.body.slug ?? product.body.product?.slug;
  const post = await staff.post('/api/admin/posts', {
    title: `Access check build log ${now}`,
    summary: 'Fins and a flight.',
    markdown: `## The fin can\n\nPrinted in three parts, then flown on a small motor.\n\n${'The layers were printed slowly and sanded smooth before the first coat of primer went on. '.repeat(12)}`,
    tags: ['rocketry'],
    status: 'published',
  });
  postSlug = post.body.slug;
  if (!productSlug || !postSlug) throw new Error(`fixtures not created: ${product.status} ${post.status}`);
});

// Each page is opened as the user who would use it, waits for its main heading, then goes through axe-core.
describe('main pages have no serious or critical accessibility violations (axe-core)', () => {
  const pages: [string, () => Promise<string>, ('fan' | 'admin' | 'sponsor' | 'member')?][] = [
    ['storefront', async () => '/'],
    ['merch grid', async () => '/shop'],
    ['product page', async () => `/shop/p/${productSlug}`],
    ['cart and checkout', async () => '/shop/checkout', 'fan'],
    ['membership', async () => '/membership', 'fan'],
    ['build logs', async () => '/build-logs'],
    ['a build log', async () => `/build-logs/${postSlug}`],
    ['sponsors', async () => '/sponsors'],
    ['sponsor portal', async () => '/sponsors/portal', 'sponsor'],
    ['staff orders', async () => '/console/orders', 'admin'],
    ['staff roster', async () => '/console/members', 'admin'],
    ['staff books', async () => '/console/books', 'admin'],
    ['sign-in', async () => '/account/sign-in'],
    ['register', async () => '/account/register'],
  ];

  // Rows as objects: with array rows of different lengths, jest would pass `done` as the missing role.
  it.each(pages.map(([name, path, role]) => ({ name, path, role })))('$name', async ({ name, path, role }) => {
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      if (role) {
        const user = await createUser(t.deps.db, role === 'fan' ? ['fan'] : ['fan', role], `A11y ${role}`);
        await signInThroughForm(page, site.baseUrl, user.email, user.password);
      }
      await page.goto(site.baseUrl + (await path()));
      await page.locator('h1').first().waitFor();
      await page.waitForLoadState('networkidle');
      expect(await page.locator('h1').first().textContent()).not.toMatch(/Off the pad|not found/i);
      await screenshot(page, `page-${name.replace(/\W+/g, '-')}`);
      expect(await seriousViolations(page)).toEqual([]);
    } finally {
      await context.close();
    }
  });
});

// Content that moves under the reader's eyes or finger makes them lose their place or tap the wrong thing.
// Threshold: Cumulative Layout Shift of 0.1 or less is "good" (web.dev, Core Web Vitals thresholds).
describe('pages whose content arrives late do not shift what is already painted', () => {
  it.each([
    { name: 'product page', path: () => `/shop/p/${productSlug}`, api: '**/api/products/*' },
    { name: 'a build log', path: () => `/build-logs/${postSlug}`, api: '**/api/posts/*' },
  ])('$name, on a phone-sized screen, with its data 600 ms late', async ({ path, api }) => {
    const context = await browser.newContext({ viewport: { width: 412, height: 823 } });
    const page = await context.newPage();
    try {
      await page.addInitScript(() => {
        const w = window as unknown as { shift: number };
        w.shift = 0;
        new PerformanceObserver((list) => {
          for (const e of list.getEntries() as unknown as { value: number; hadRecentInput: boolean }[])
            if (!e.hadRecentInput) w.shift += e.value;
        }).observe({ type: 'layout-shift', buffered: true });
      });
      await page.route(api, async (route) => {
        await new Promise((r) => setTimeout(r, 600));
        await route.continue();
      });
      await page.goto(site.baseUrl + path());
      await page.locator('h1').first().waitFor();
      await page.waitForLoadState('networkidle');
      expect(await page.evaluate(() => (window as unknown as { shift: number }).shift)).toBeLessThanOrEqual(0.1);
    } finally {
      await context.close();
    }
  });
});
