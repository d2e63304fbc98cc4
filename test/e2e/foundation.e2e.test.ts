import type { Browser } from 'playwright-core';
import { browserSuite, recordRequests, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { createUser } from '../helpers/users';

let t: TestApp;
let browser: Browser;
let site: Site;

browserSuite({}, (s) => {
  ({ t, site, browser } = s);
});

describe('the storefront in a browser', () => {
  it('loads with no request to any host but 127.0.0.1, and the fan sees their name after signing in', async () => {
    const fan = await createUser(t.deps.db, ['fan'], 'Wren Halvorsen');
    const page = await browser.newPage();
    const requests = recordRequests(page);
    const consoleErrors: string[] = [];
    page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
    await page.goto(site.baseUrl + '/');
    await page.getByRole('heading', { name: 'Printed, flown, filmed.' }).waitFor();
    // The names come from the deployment (TEAM_NAME, CLUB_NAME; here the development defaults).
    await page
      .getByRole('contentinfo')
      .getByText(`for ${t.config.site.teamName} and the ${t.config.site.clubName}`)
      .waitFor();
    await screenshot(page, 'storefront');
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.getByTestId('account-menu').getByText('Wren Halvorsen').waitFor();
    await screenshot(page, 'storefront-signed-in');
    expect(requests.length).toBeGreaterThan(3);
    const foreign = requests.filter((u) => !/^(http:\/\/127\.0\.0\.1[:/]|data:|blob:)/.test(u));
    expect(foreign).toEqual([]);
    // CSP violations and failed loads show up as console errors.
    expect(consoleErrors).toEqual([]);
    expect(await page.getByRole('link', { name: 'Console' }).count()).toBe(0);
    await page.close();
  });

  it('lets an admin reach the console and the accounts page', async () => {
    const admin = await createUser(t.deps.db, ['fan', 'admin'], 'Ada Console');
    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, admin.email, admin.password);
    await page.getByRole('link', { name: 'Console' }).click();
    await page.getByRole('navigation', { name: 'Console sections' }).getByRole('link', { name: 'Accounts' }).click();
    await page.getByRole('heading', { name: 'Accounts' }).waitFor();
    await page.getByLabel('Search name or e-mail').fill('Ada Console');
    await page.getByRole('cell', { name: admin.email }).waitFor();
    await screenshot(page, 'console-accounts');
    await page.close();
  });

  it('shows the server’s field message beside the field when registration is refused', async () => {
    const page = await browser.newPage();
    await page.goto(site.baseUrl + '/account/register');
    await page.getByLabel('Your name').fill('Common Pat');
    await page.getByLabel('E-mail').fill(`pat-${Date.now()}@example.test`);
    await page.getByLabel('Password').fill('password1234');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByText('commonly used passwords').waitFor();
    await screenshot(page, 'register-refused');
    await page.close();
  });

  it('sends a fan who opens the console to sign in', async () => {
    const page = await browser.newPage();
    await page.goto(site.baseUrl + '/console');
    await page.waitForURL(/\/account\/sign-in\?returnTo=%2Fconsole/);
    await page.close();
  });
});
