import { mkdirSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { buildTestApp, type TestApp } from './test-app';

/** Where a served app answers, and how to stop it. */
export interface Site {
  baseUrl: string;
  stop(): Promise<void>;
}

export const ARTIFACTS = path.resolve(__dirname, '..', 'artifacts');

/**
 * Debian's Chromium, headless, with the flags this machine needs (no sandbox as root, no background traffic), and
 * any `extraArgs` a suite needs (a fake camera).
 */
export function launchBrowser(extraArgs: string[] = []): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
      ...extraArgs,
    ],
  });
}

/** Serves the test app on a free loopback port; the URL is also its PUBLIC_URL for links in e-mails. */
export async function serve(t: TestApp): Promise<Site> {
  const server = t.app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** Every request URL the page makes, to check that nothing leaves 127.0.0.1. */
export function recordRequests(page: Page): string[] {
  const urls: string[] = [];
  page.on('request', (req) => urls.push(req.url()));
  return urls;
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(ARTIFACTS, { recursive: true });
  const file = path.join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in through the real form. */
export async function signInThroughForm(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/account/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/account/sign-in'));
}

/**
 * Uncaught errors and console errors of a page, collected from now on. Suites share one database, and another suite
 * may delete an image that a public list still shows for a moment: the browser then logs a 404 for that image, which
 * says nothing about the page under test, so each 404 of an `/uploads/` file excuses one such console line.
 */
export function consoleErrors(page: Page): string[] {
  const errors: string[] = [];
  let goneImages = 0;
  page.on('response', (r) => r.status() === 404 && new URL(r.url()).pathname.startsWith('/uploads/') && goneImages++);
  page.on('pageerror', (e) => errors.push(`uncaught: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() !== 'error') return;
    if (goneImages > 0 && /Failed to load resource: .*404/.test(m.text())) {
      goneImages--;
      return;
    }
    errors.push(`console: ${m.text()}`);
  });
  return errors;
}

/** What a test file that serves the app works with: the app and the address it is served at. */
export interface SiteSuite {
  t: TestApp;
  site: Site;
}

/** What a browser test file works with: the served app and one Chromium. */
export interface BrowserSuite extends SiteSuite {
  browser: Browser;
}

type AppOptions = Parameters<typeof buildTestApp>[0];

/**
 * Registers the set-up and tear-down of a test file that fetches from the served app without a browser: the app (built
 * with `app`, as `buildTestApp` takes it, or with what `app()` returns once an earlier `beforeAll` has run) served on
 * a free loopback port, stopped after the file. `ready` gets them once they are up and does the file's own preparation.
 */
export function siteSuite(
  app: AppOptions | (() => AppOptions) = {},
  ready: (s: SiteSuite) => void | Promise<void> = () => undefined,
  timeoutMs?: number,
): void {
  const s: Partial<SiteSuite> = {};
  beforeAll(async () => {
    s.t = buildTestApp(typeof app === 'function' ? app() : app);
    s.site = await serve(s.t);
    await ready(s as SiteSuite);
  }, timeoutMs);
  afterAll(async () => {
    await s.site?.stop();
    await s.t?.close();
  });
}

/**
 * As `siteSuite`, with one Chromium launched before `ready` and closed after the file, before the app stops (jest runs
 * `afterAll` hooks in the order they were registered).
 */
export function browserSuite(
  app: AppOptions | (() => AppOptions) = {},
  ready: (s: BrowserSuite) => void | Promise<void> = () => undefined,
  timeoutMs?: number,
): void {
  let browser: Browser | undefined;
  afterAll(() => browser?.close());
  siteSuite(
    app,
    async (s) => {
      browser = await launchBrowser();
      await ready({ ...s, browser });
    },
    timeoutMs,
  );
}
