import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { browserSuite, consoleErrors, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { createUser, signedIn, type Client } from '../helpers/users';

/**
 * The server-rendered pages in Chromium: the script takes over the server's DOM (hydration) without a mismatch, a tap
 * made before the script arrived is replayed, and what belongs to the signed-in person fills in afterwards.
 */
let t: TestApp;
let browser: Browser;
let site: Site;
let staff: Client;
const tag = randomUUID().slice(0, 6);
let slug: string;
let membersPost: { slug: string; body: string };
const axeSource = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

browserSuite({}, async (s) => {
  ({ t, site, browser } = s);
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'editor', 'treasurer'])).client;
  const made = await staff.post('/api/admin/products', {
    name: `Rail Buttons ${tag}`,
    description: 'A pair of printed rail buttons.',
    priceCents: 600,
    weightGrams: 20,
    variants: [{ label: 'Pair', sku: `RB-${tag}` }],
    run: {
      cap: 30,
      opensAt: new Date(Date.now() - 86400_000).toISOString(),
      closesAt: new Date(Date.now() + 5 * 86400_000).toISOString(),
      unitCostCents: 100,
    },
  });
  expect(made.status).toBe(201);
  slug = made.body.product.slug;
  const body = `Shock cord mount details ${tag}.`;
  const hidden = await staff.post('/api/admin/posts', {
    title: `Shock cord mount ${tag}`,
    summary: 'Where the cord meets the tube.',
    markdown: body,
    status: 'published',
    membersOnly: true,
  });
  expect(hidden.status).toBe(201);
  membersPost = { slug: hidden.body.post?.slug ?? hidden.body.slug, body };
});

// Angular reports hydration mismatches (NG05xx) as console errors, so `consoleErrors` catches them.

const phone = (): Promise<BrowserContext> =>
  browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });

/** Holds the app's main script back until `release()`, so the page is only the server's HTML until then. */
async function holdScript(page: Page): Promise<() => void> {
  let release!: () => void;
  const gate = new Promise<void>((resolve) => (release = resolve));
  await page.route(/\/main-[A-Z0-9]+\.js$/, async (route) => {
    await gate;
    await route.continue();
  });
  return release;
}

/**
 * Waits until Angular has taken over the page: the server marks each component it rendered with `ngh` (its hydration
 * data) and hydration removes the mark as it claims the component's DOM, so none is left once all are claimed.
 */
async function hydrated(page: Page): Promise<void> {
  await page.waitForFunction(() => document.querySelectorAll('[ngh]').length === 0);
  await page.waitForLoadState('networkidle');
}

const serverMarks = (page: Page) => page.evaluate(() => document.querySelectorAll('[ngh]').length);

describe('hydration of the public pages on a phone', () => {
  it.each([
    ['home', () => '/'],
    ['shop', () => '/shop'],
    ['product', () => `/shop/p/${slug}`],
    ['build logs', () => '/build-logs'],
    ['members-only post', () => `/build-logs/${membersPost.slug}`],
    ['sponsors', () => '/sponsors'],
    ['launch calendar', () => '/launches'],
  ])('the %s page keeps the server DOM and writes no console error', async (what, path) => {
    const ctx = await phone();
    const page = await ctx.newPage();
    const errors = consoleErrors(page);
    const release = await holdScript(page);
    await page.goto(site.baseUrl + path(), { waitUntil: 'commit' });
    const heading = page.locator('main h1').first();
    await heading.waitFor();
    // A mark on the server's own heading element: after hydration the same element must still be there.
    await heading.evaluate((el) => ((el as HTMLElement & { ssrMark?: boolean }).ssrMark = true));
    expect(await serverMarks(page)).toBeGreaterThan(0);
    release();
    await hydrated(page);
    expect(
      await page
        .locator('main h1')
        .first()
        .evaluate((el) => (el as HTMLElement & { ssrMark?: boolean }).ssrMark === true),
    ).toBe(true);
    await screenshot(page, `hydrated-${what.replace(/ /g, '-')}-phone`);
    expect(errors).toEqual([]);
    await ctx.close();
  });
});

describe('a tap before the script has arrived', () => {
  it('is replayed once the page is live: Add to cart taken from the server HTML adds the item', async () => {
    const ctx = await phone();
    const page = await ctx.newPage();
    const errors = consoleErrors(page);
    const release = await holdScript(page);
    await page.goto(`${site.baseUrl}/shop/p/${slug}`, { waitUntil: 'commit' });
    const add = page.getByRole('button', { name: 'Add to cart' });
    await add.waitFor();
    expect(await serverMarks(page)).toBeGreaterThan(0);
    await add.click();
    release();
    await page.getByText('Added 1 to the cart.').waitFor();
    await page.getByTestId('cart-count').filter({ hasText: '1' }).waitFor();
    await page.evaluate(axeSource);
    const violations = await page.evaluate(async () => {
      const axe = (
        window as unknown as {
          axe: { run(ctx: Document, opts: object): Promise<{ violations: { id: string; impact: string }[] }> };
        }
      ).axe;
      return (await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] } })).violations
        .filter((v) => v.impact === 'serious' || v.impact === 'critical')
        .map((v) => v.id);
    });
    expect(violations).toEqual([]);
    await screenshot(page, 'hydrated-replayed-add-to-cart-phone');
    expect(errors).toEqual([]);
    await ctx.close();
  });
});

describe('a signed-in member on a server-rendered page', () => {
  it('sees the visitor page first, then their own: the account menu and the members-only body', async () => {
    const member = await createUser(t.deps.db, ['fan', 'member'], `Juniper Ashgrove ${tag}`);
    const ctx = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const page = await ctx.newPage();
    const errors = consoleErrors(page);
    await signInThroughForm(page, site.baseUrl, member.email, member.password);
    await page.goto(`${site.baseUrl}/build-logs/${membersPost.slug}`);
    await page.getByText(membersPost.body).waitFor();
    await page.getByTestId('account-menu').waitFor();
    await screenshot(page, 'hydrated-members-post-desktop');
    expect(errors).toEqual([]);
    await ctx.close();
  });
});
