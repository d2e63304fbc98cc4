import { readFileSync } from 'node:fs';
import path from 'node:path';
import { strFromU8, unzipSync } from 'fflate';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { ARTIFACTS, browserSuite, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { createUser } from '../helpers/users';

let t: TestApp;
let browser: Browser;
let site: Site;

browserSuite({}, (s) => {
  ({ t, site, browser } = s);
});

/** A phone-sized page that collects uncaught errors and console errors (failed answers the test expects aside). */
async function phone(): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, acceptDownloads: true });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => m.type() === 'error' && !/status of 40[01]/.test(m.text()) && errors.push(m.text()));
  return { context, page, errors };
}

describe('a person’s own data, on a phone', () => {
  it('downloads a ZIP from the account page, then deletes the account with the password, and the e-mail no longer signs in', async () => {
    const user = await createUser(t.deps.db, ['fan'], 'Maren Tollefson');
    const { context, page, errors } = await phone();
    try {
      await signInThroughForm(page, site.baseUrl, user.email, user.password);
      await page.goto(site.baseUrl + '/account');
      await page.getByRole('link', { name: 'Download my data' }).waitFor();
      await page.waitForLoadState('networkidle');
      expect(await seriousViolations(page)).toEqual([]);
      await screenshot(page, 'account-your-data-phone');

      const [download] = await Promise.all([
        page.waitForEvent('download'),
        page.getByRole('link', { name: 'Download my data' }).click(),
      ]);
      expect(download.suggestedFilename()).toMatch(/^padside-my-data-\d{4}-\d{2}-\d{2}\.zip$/);
      const saved = path.join(ARTIFACTS, 'account-export.zip');
      await download.saveAs(saved);
      const files = unzipSync(new Uint8Array(readFileSync(saved)));
      expect(Object.keys(files)).toEqual(
        expect.arrayContaining(['summary.html', 'profile.json', 'shop-orders.json', 'sign-ins.json']),
      );
      expect(JSON.parse(strFromU8(files['profile.json']))).toEqual([
        expect.objectContaining({ email: user.email, displayName: 'Maren Tollefson' }),
      ]);
      // The summary page reads on its own: open it as a file would open, on the same phone.
      const summary = await context.newPage();
      await summary.setContent(strFromU8(files['summary.html']));
      await summary.getByRole('heading', { name: /What .+ holds about you/ }).waitFor();
      expect(await seriousViolations(summary)).toEqual([]);
      await screenshot(summary, 'account-export-summary-phone');
      await summary.close();

      await page.getByRole('button', { name: 'Delete my account…' }).click();
      const dialog = page.getByRole('dialog', { name: 'Delete your account?' });
      await dialog.waitFor();
      await dialog.getByLabel('Your password').fill('not my password at all');
      await dialog.getByRole('button', { name: 'Delete my account' }).click();
      await dialog.getByText('Not your password.').waitFor();
      await screenshot(page, 'account-delete-wrong-password-phone');
      await dialog.getByLabel('Your password').fill(user.password);
      await dialog.getByRole('button', { name: 'Delete my account' }).click();
      await page.getByText('Your account was deleted.').waitFor();
      await page.waitForURL(site.baseUrl + '/');
      await page.getByRole('link', { name: 'Sign in' }).waitFor();
      await screenshot(page, 'account-deleted-phone');

      await page.goto(site.baseUrl + '/account/sign-in');
      await page.getByLabel('E-mail').fill(user.email);
      await page.getByLabel('Password').fill(user.password);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByText('That e-mail and password do not match an account.').waitFor();
      expect(new URL(page.url()).pathname).toBe('/account/sign-in');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('shows the privacy page to a visitor, linked from the footer, with no serious accessibility finding', async () => {
    const { context, page, errors } = await phone();
    try {
      await page.goto(site.baseUrl + '/');
      await page.getByRole('contentinfo').getByRole('link', { name: 'Privacy' }).click();
      await page.getByRole('heading', { level: 1, name: /Privacy/ }).waitFor();
      await page.waitForLoadState('networkidle');
      for (const heading of ['What we collect and why', 'Who else handles it', 'What you can ask'])
        await page.getByRole('heading', { name: heading }).waitFor();
      await page.getByText('The card processor', { exact: true }).waitFor();
      await page.getByText('The mail provider', { exact: true }).waitFor();
      expect(await seriousViolations(page)).toEqual([]);
      await screenshot(page, 'privacy-phone');
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
