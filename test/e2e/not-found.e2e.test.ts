import type { Browser, BrowserContext, Page } from 'playwright-core';
import { browserSuite, screenshot, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { createUser, signedIn } from '../helpers/users';
import { openShirt } from '../api/shop-fixtures';

let t: TestApp;
let browser: Browser;
let site: Site;

browserSuite({}, (s) => {
  ({ t, site, browser } = s);
});

/** Uncaught exceptions and console errors of a page, as text. */
function watchErrors(page: Page): { uncaught: string[]; console: string[] } {
  const seen = { uncaught: [] as string[], console: [] as string[] };
  // Suites share one database, and another suite may delete an image that a public list still shows for a moment:
  // the browser then logs a 404 for that image, which says nothing about these pages. Each such 404 excuses one line.
  let goneImages = 0;
  page.on('response', (r) => r.status() === 404 && new URL(r.url()).pathname.startsWith('/uploads/') && goneImages++);
  page.on('pageerror', (err) => seen.uncaught.push(`${page.url()}: ${err.message}`));
  page.on('console', (m) => {
    if (m.type() !== 'error') return;
    if (goneImages > 0 && /Failed to load resource: .*404/.test(m.text())) {
      goneImages--;
      return;
    }
    seen.console.push(`${page.url()}: ${m.text()}`);
  });
  return seen;
}

/** A phone-sized context (390x844). */
const phone = (): Promise<BrowserContext> =>
  browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });

/** Waits until the router has settled and the page's data has arrived. */
async function settle(page: Page): Promise<void> {
  await page.waitForLoadState('networkidle');
  await page.locator('main h1').first().waitFor();
}

describe('addresses that lead nowhere, on a phone', () => {
  it.each([
    ['product', '/shop/p/no-such-item', 'Item not found', 'See all the merch', '/shop'],
    ['build log', '/build-logs/no-such-post', 'Build log not found', 'See all build logs', '/build-logs'],
    ['order', '/shop/orders/999999', 'Order not found', 'Sign in', '/account/sign-in'],
    ['page', '/no/such/page', 'Off the pad', 'Back to the storefront', '/'],
  ])('an unknown %s says so, offers a way back, and throws nothing', async (what, path, heading, back, backTo) => {
    const ctx = await phone();
    const page = await ctx.newPage();
    const errors = watchErrors(page);
    await page.goto(site.baseUrl + path);
    await page.getByRole('heading', { level: 1, name: heading }).waitFor();
    await screenshot(page, `not-found-${what.replace(/ /g, '-')}-phone`);
    expect(errors.uncaught).toEqual([]);
    // The API's own 404 is the one console line the browser writes for a missing record; nothing else may appear.
    expect(
      errors.console.filter((m) => !/Failed to load resource: the server responded with a status of 404/.test(m)),
    ).toEqual([]);
    await page.getByRole('main').getByRole('link', { name: back }).click();
    await page.waitForURL((u) => u.pathname === backTo);
    await ctx.close();
  });
});

describe('the main pages on a phone', () => {
  it('show no uncaught error and write no console error, for a visitor and for a signed-in fan', async () => {
    const staffApi = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer', 'editor'])).client;
    const shirt = await openShirt(staffApi, { cap: 20 });
    const post = await staffApi.post('/api/admin/posts', {
      title: `Fin can jig ${shirt.slug.slice(-6)}`,
      summary: 'A printed jig.',
      markdown: 'We printed a jig to glue the fins square.',
      status: 'published',
    });
    expect(post.status).toBe(201);
    const postSlug = post.body.post?.slug ?? post.body.slug;
    const visitorPages = [
      '/',
      '/shop',
      `/shop/p/${shirt.slug}`,
      '/shop/cart',
      '/shop/checkout',
      '/membership',
      '/build-logs',
      `/build-logs/${postSlug}`,
      '/sponsors',
      '/account/sign-in',
      '/account/register',
    ];
    const fanPages = ['/', '/shop/orders', '/account', '/membership', `/shop/p/${shirt.slug}`];

    const ctx = await phone();
    const page = await ctx.newPage();
    const errors = watchErrors(page);
    for (const path of visitorPages) {
      await page.goto(site.baseUrl + path);
      await settle(page);
    }
    await screenshot(page, 'main-pages-visitor-last-phone');
    const fan = await createUser(t.deps.db, ['fan'], 'Linnea Okafor');
    await page.goto(`${site.baseUrl}/account/sign-in`);
    await page.getByLabel('E-mail').fill(fan.email);
    await page.getByLabel('Password').fill(fan.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => !url.pathname.startsWith('/account/sign-in'));
    for (const path of fanPages) {
      await page.goto(site.baseUrl + path);
      await settle(page);
    }
    await screenshot(page, 'main-pages-fan-last-phone');
    expect(errors.uncaught).toEqual([]);
    expect(errors.console).toEqual([]);
    await ctx.close();
  });
});
