import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { browserSuite, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser, type TestUser } from '../helpers/users';
import { createLaunch, memberWithCard } from '../api/launch-fixtures';
import { MB_ADDRESS, methodId, openShirt } from '../api/shop-fixtures';

// Every console page a person reads shows labels, club-format dates without seconds and the zone in words: no
// `snake_case` code, no tz database name, no "hundredths of a percent".
const SIZES = {
  phone: { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true },
  desktop: { viewport: { width: 1366, height: 900 } },
};
const SNAKE_CASE = /\b[a-z]+(?:_[a-z]+)+\b/g;
const SECONDS = /\b\d{1,2}:\d{2}:\d{2}\b/g;

let t: TestApp;
let browser: Browser;
let site: Site;
let staff: TestUser;
const ids: Record<string, number> = {};

browserSuite({}, async (s) => {
  ({ t, site, browser } = s);
  staff = await createUser(t.deps.db, ['fan', 'editor', 'treasurer', 'admin', 'range_officer'], 'Wendell Wordsworth');
  const api = new Client(t.app);
  await api.signIn(staff);

  // A sponsor owed a build log credit (overdue), a sponsors page listing and a social post, with one credit by hand.
  const sponsor = await api.post('/api/admin/sponsors', {
    name: `Words Test Widgets ${Date.now()}`,
    website: 'https://example.test',
    blurb: 'Invented for a test.',
  });
  ids.sponsor = sponsor.body.id;
  const deliverables = [
    { kind: 'build_log_credit', quantity: 2, dueOn: '2026-01-15' },
    { kind: 'sponsors_page', quantity: 1, dueOn: '2099-06-30' },
    { kind: 'social_post', quantity: 1, dueOn: '2099-07-31' },
  ];
  expect(
    (
      await api.post(`/api/admin/sponsors/${ids.sponsor}/agreements`, {
        season: '2099',
        cashCents: 25_000,
        deliverables,
      })
    ).status,
  ).toBe(201);
  expect(
    (
      await api.post(`/api/admin/sponsors/${ids.sponsor}/credits`, {
        kind: 'social_post',
        url: 'https://example.test/post/1',
      })
    ).status,
  ).toBe(201);

  // A run at the printer with one paid order in it.
  const shirt = await openShirt(api);
  const buyer = new Client(t.app);
  const order = await buyer.post('/api/orders', {
    items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(buyer, 'canada'),
    email: `words-${Date.now()}@example.test`,
    paymentToken: 'tok_visa',
  });
  expect(order.status).toBe(201);
  ids.order = order.body.order.id;
  ids.run = shirt.run.id;
  for (const state of ['closed', 'in_production'])
    expect((await api.post(`/api/admin/runs/${shirt.run.id}/state`, { state })).status).toBe(200);

  // A members-only post scheduled for later, and a draft.
  const later = await api.post('/api/admin/posts', {
    title: 'Members only: nose cone print settings',
    markdown: 'Layer heights for the nose cone.',
    membersOnly: true,
    status: 'scheduled',
    publishAt: '2099-03-08T08:30:00Z',
  });
  expect(later.status).toBe(201);
  ids.post = later.body.post?.id ?? later.body.id;
  expect(
    (
      await api.post('/api/admin/posts', {
        title: 'Draft: fin can jig',
        markdown: 'Work in progress.',
        status: 'draft',
      })
    ).status,
  ).toBe(201);

  // A member, and a launch day on the calendar.
  const member = await memberWithCard(t, { name: 'Ottilie Wordsmith' });
  ids.member = Number((await t.deps.db('memberships').where('member_number', member.memberNumber).first('id')).id);
  ids.launch = await createLaunch(api, '2099-05-09');
});

/**
 * What a person reads on the page: the visible text and the accessible names. Icon ligatures (`<mat-icon>` text
 * such as `shopping_bag`) are drawn as pictures, so they are left out.
 */
async function readable(page: Page): Promise<string> {
  return page.evaluate(() => {
    const parts: string[] = [];
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let n = walker.nextNode(); n; n = walker.nextNode()) {
      const parent = n.parentElement;
      if (!parent || parent.closest('mat-icon, .material-icons, script, style')) continue;
      if (!parent.checkVisibility()) continue;
      parts.push(n.textContent ?? '');
    }
    const labels = [...document.querySelectorAll('[aria-label]')].map((e) => e.getAttribute('aria-label') ?? '');
    return `${parts.join(' ')}\n${labels.join('\n')}`;
  });
}

const PAGES: { name: string; path: () => string; ready: string | RegExp }[] = [
  { name: 'overview', path: () => '/console', ready: /Overdue sponsor credits/ },
  { name: 'books', path: () => '/console/books', ready: 'Card-fee estimate' },
  { name: 'orders', path: () => '/console/orders', ready: /Paid|Packed/ },
  { name: 'order', path: () => `/console/orders/${ids.order}`, ready: /placed/ },
  { name: 'runs', path: () => '/console/runs', ready: 'Being printed' },
  { name: 'products', path: () => '/console/products', ready: /Times are club time/ },
  { name: 'shop-settings', path: () => '/console/shop-settings', ready: 'Shipping methods' },
  { name: 'posts', path: () => '/console/posts', ready: 'Members only' },
  { name: 'post', path: () => `/console/posts/${ids.post}`, ready: /Status: Scheduled/ },
  { name: 'members', path: () => '/console/members', ready: 'Current' },
  { name: 'member', path: () => `/console/members/${ids.member}`, ready: 'Ottilie Wordsmith' },
  { name: 'dues-summary', path: () => '/console/members/summary', ready: 'In grace period' },
  { name: 'sponsors', path: () => '/console/sponsors', ready: 'Build log credit' },
  { name: 'sponsor', path: () => `/console/sponsors/${ids.sponsor}`, ready: 'Sponsors page listing' },
  { name: 'launches', path: () => '/console/launches', ready: 'On the calendar' },
  { name: 'range', path: () => `/console/range/${ids.launch}`, ready: /Range table/ },
];

describe.each(Object.entries(SIZES))('the console on a %s', (size, options) => {
  let context: BrowserContext;
  let page: Page;
  const errors: string[] = [];
  beforeAll(async () => {
    context = await browser.newContext(options);
    page = await context.newPage();
    page.on('pageerror', (e) => errors.push(e.message));
    page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
    await signInThroughForm(page, site.baseUrl, staff.email, staff.password);
  });
  afterAll(() => context?.close());

  it.each(PAGES)('shows no raw code, no seconds and no tz database name on $name', async (p) => {
    await page.goto(`${site.baseUrl}${p.path()}`);
    await page.getByText(p.ready).filter({ visible: true }).first().waitFor();
    await page.waitForLoadState('networkidle');
    const text = await readable(page);
    expect([
      ...new Set([
        ...(text.match(SNAKE_CASE) ?? []),
        ...(text.match(SECONDS) ?? []),
        ...(text.match(/America\/\w+|hundredths/g) ?? []),
      ]),
    ]).toEqual([]);
    expect(await seriousViolations(page)).toEqual([]);
    if (['overview', 'books', 'sponsor', 'posts', 'runs', 'member'].includes(p.name))
      await screenshot(page, `console-words-${p.name}-${size}`);
    expect(errors).toEqual([]);
  });
});

describe('the card-fee estimate', () => {
  it('is typed as a percentage and a refused value is explained beside its field', async () => {
    const context = await browser.newContext(SIZES.desktop);
    const page = await context.newPage();
    await signInThroughForm(page, site.baseUrl, staff.email, staff.password);
    await page.goto(`${site.baseUrl}/console/books`);
    const percent = page.getByLabel('Percentage of each payment');
    // Stored as 290 basis points (the default): read as 2.9.
    await page.waitForFunction(
      () => (document.querySelector('input[formcontrolname="percent"]') as HTMLInputElement | null)?.value === '2.9',
    );
    expect(await percent.inputValue()).toBe('2.9');
    await percent.fill('2.955');
    await page.getByRole('button', { name: 'Save estimate' }).click();
    await page.locator('mat-error', { hasText: 'Use at most two decimals' }).waitFor();
    await screenshot(page, 'console-words-fee-refused');
    // Suites share this club-wide setting: nothing was stored.
    expect(
      (await t.deps.db('settings').where({ key: 'processor_fees' }).first('value'))?.value?.percentBasisPoints ?? 290,
    ).toBe(290);
    await context.close();
  });
});
