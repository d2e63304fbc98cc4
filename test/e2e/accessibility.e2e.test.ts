import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, serve, signInThroughForm } from '../helpers/browser';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { createUser } from '../helpers/users';

const axeSource = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}

let t: TestApp;
let browser: Browser;
let site: { baseUrl: string; stop(): Promise<void> };

beforeAll(async () => {
  t = buildTestApp();
  site = await serve(t);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await site?.stop();
  await t?.close();
});

/** axe-core's serious and critical findings for the page as it is now (WCAG 2.x A and AA rules). */
async function seriousViolations(page: Page): Promise<string[]> {
  await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(ctx: Document, opts: object): Promise<{ violations: AxeViolation[] }> } }).axe;
    return (await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } })).violations;
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join('; ')})`);
}

async function firstSlug(url: string): Promise<string | undefined> {
  const res = await fetch(site.baseUrl + url);
  const body = (await res.json()) as { items: { slug: string }[] };
  return body.items[0]?.slug;
}

// Each page is opened as the user who would use it, waits for its main heading, then goes through axe-core.
describe('main pages have no serious or critical accessibility violations (axe-core)', () => {
  const pages: [string, () => Promise<string>, ('fan' | 'admin' | 'sponsor' | 'member')?][] = [
    ['storefront', async () => '/'],
    ['merch grid', async () => '/shop'],
    ['product page', async () => `/shop/products/${(await firstSlug('/api/products')) ?? 'none'}`],
    ['cart and checkout', async () => '/shop/checkout', 'fan'],
    ['membership', async () => '/membership', 'fan'],
    ['build logs', async () => '/build-logs'],
    ['a build log', async () => `/build-logs/${(await firstSlug('/api/posts')) ?? 'none'}`],
    ['sponsors', async () => '/sponsors'],
    ['sponsor portal', async () => '/sponsors/portal', 'sponsor'],
    ['staff orders', async () => '/console/orders', 'admin'],
    ['staff roster', async () => '/console/members', 'admin'],
    ['staff books', async () => '/console/books', 'admin'],
    ['sign-in', async () => '/account/sign-in'],
    ['register', async () => '/account/register'],
  ];

  it.each(pages)('%s', async (_name, path, role) => {
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
      expect(await seriousViolations(page)).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
