import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import {
  browserSuite,
  consoleErrors,
  recordRequests,
  screenshot,
  signInThroughForm,
  type Site,
} from '../helpers/browser';
import { firstLink, waitForEmails } from '../helpers/maildev';
import { freshDatabase, type FreshDatabase } from '../helpers/fresh-database';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';
import { openShirt } from '../api/shop-fixtures';

// A common 6.1-inch phone screen, in CSS pixels.
const PHONE = { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };

// Its own database: the staff announcement goes to every address with consent, on the shared database every buyer
// and member other suites made.
let fresh: FreshDatabase;
let t: TestApp;
let browser: Browser;
let site: Site;

// The database is made before the app and dropped after it has stopped (jest runs these hooks in the order written).
beforeAll(async () => {
  fresh = await freshDatabase();
});
browserSuite(
  () => ({ env: { DATABASE_URL: fresh.url } }),
  (s) => {
    ({ t, site, browser } = s);
  },
);
afterAll(() => fresh?.drop());

async function phone(): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext(PHONE);
  const page = await context.newPage();
  return { context, page, errors: consoleErrors(page) };
}

/** The mail's link opened on the served app (the mail names PUBLIC_URL, the test server listens elsewhere). */
/** Scrolls to the sign-up form's place: the form is made in the browser once its place nears the screen. */
const toSignUp = (page: Page) =>
  page.evaluate(() => document.querySelector('[data-testid="sign-up-slot"]')?.scrollIntoView());

const onSite = (link: string) => {
  const u = new URL(link);
  return `${site.baseUrl}${u.pathname}${u.search}`;
};

describe('announcements on a phone', () => {
  it('signs up on the home page, confirms from the mail, gets the staff announcement, and stops it with one click', async () => {
    const email = `phone-${Date.now().toString(36)}@example.test`;
    const subject = `Launch day moved ${Date.now().toString(36)}`;

    // A visitor asks for launch-day news on the home page.
    const visitor = await phone();
    const requests = recordRequests(visitor.page);
    await visitor.page.goto(`${site.baseUrl}/`);
    await toSignUp(visitor.page);
    await visitor.page.getByRole('heading', { name: 'Tell me about new runs, launch days and build logs' }).waitFor();
    await visitor.page.getByText('may e-mail me about the lists I ticked').waitFor();
    expect(await seriousViolations(visitor.page)).toEqual([]);
    await visitor.page.getByRole('button', { name: 'Tell me' }).click();
    await visitor.page.getByText('Tick at least one list.').waitFor();
    await visitor.page.getByRole('checkbox', { name: 'launch days' }).check();
    await visitor.page.getByLabel('E-mail').fill(email);
    await visitor.page.getByRole('button', { name: 'Tell me' }).click();
    await visitor.page.getByTestId('sign-up-sent').waitFor();
    await screenshot(visitor.page, 'announcements-phone-sign-up');

    // The confirmation mail, caught by MailDev; its link confirms.
    await t.app.platform.auth.afterAnswer.settled();
    await t.deps.mail.deliverDue();
    const [confirmMail] = await waitForEmails(email, /^Confirm your/);
    expect(confirmMail).toBeDefined();
    await visitor.page.goto(onSite(firstLink(confirmMail)));
    await visitor.page.getByTestId('subscription-confirmed').getByText('launch days').waitFor();
    expect(await seriousViolations(visitor.page)).toEqual([]);
    await screenshot(visitor.page, 'announcements-phone-confirmed');

    // An editor composes, previews, tests and sends from the console on a phone.
    const editor = await createUser(t.deps.db, ['fan', 'editor'], 'Marit Editor');
    const staff = await phone();
    await signInThroughForm(staff.page, site.baseUrl, editor.email, editor.password);
    await staff.page.goto(`${site.baseUrl}/console/announcements`);
    await staff.page.getByRole('heading', { name: 'Announcements' }).waitFor();
    await staff.page.getByRole('link', { name: 'Write an announcement' }).click();
    await staff.page.getByRole('combobox', { name: 'List' }).click();
    await staff.page.getByRole('option', { name: 'Launch days' }).click();
    await staff.page.getByLabel('Subject').fill(subject);
    await staff.page
      .getByLabel('Message (Markdown)')
      .fill('The **spring launch** moves one week later.\n\n- same field\n- same times');
    await staff.page.getByRole('button', { name: 'Preview' }).click();
    await staff.page.getByRole('heading', { name: 'Preview: as a recipient sees it' }).waitFor();
    await staff.page.locator('.mail strong', { hasText: 'spring launch' }).waitFor();
    await staff.page.getByText('List-Unsubscribe-Post: List-Unsubscribe=One-Click').waitFor();
    expect(await seriousViolations(staff.page)).toEqual([]);
    await staff.page.getByRole('button', { name: 'Send me a test' }).click();
    await staff.page.getByTestId('announcement-note').getByText(editor.email).waitFor();
    await staff.page.getByRole('button', { name: 'Send…' }).click();
    await staff.page.getByRole('button', { name: 'Yes, send to the list now' }).click();
    await staff.page.getByTestId('announcement-counts').waitFor();
    await t.deps.mail.deliverDue();
    // The page polls the counts while the mail goes out.
    await staff.page.getByTestId('announcement-status').getByText('Sent', { exact: true }).waitFor({ timeout: 15_000 });
    // Queued, sent, failed, suppressed; other suites' subscribers to the list may be counted too.
    const [queued, sent] = (await staff.page.getByTestId('announcement-counts').locator('dd').allTextContents()).map(
      Number,
    );
    expect(queued).toBe(0);
    expect(sent).toBeGreaterThanOrEqual(1);
    await screenshot(staff.page, 'announcements-phone-sent');
    expect(await staff.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

    // The recipient gets it once, with the one-click headers, and stops the list from the footer link.
    const [received] = await waitForEmails(email, new RegExp(subject));
    const raw = received as unknown as { headers: Record<string, string>; text: string };
    expect(raw.headers['list-unsubscribe']).toMatch(/^<http.+\/api\/subscriptions\/unsubscribe\?token=.+>$/);
    expect(raw.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    const [, stopLink] =
      /Stop e-mails about launch days with one click \(no sign-in needed\): (\S+)/.exec(raw.text) ?? [];
    expect(stopLink).toBeDefined();
    await visitor.page.goto(onSite(stopLink));
    await visitor.page.getByText(`Stop e-mails about launch days to ${email}?`).waitFor();
    expect(await seriousViolations(visitor.page)).toEqual([]);
    await visitor.page.getByRole('button', { name: 'Stop these e-mails' }).click();
    await visitor.page.getByTestId('unsubscribed').waitFor();
    await screenshot(visitor.page, 'announcements-phone-unsubscribed');

    // The next announcement on that list leaves the address out.
    const again = await staff.page.evaluate(async () => {
      const csrf = (await (await fetch('/api/auth/csrf')).json()).csrfToken as string;
      const headers = { 'content-type': 'application/json', 'x-csrf-token': csrf };
      const created = await (
        await fetch('/api/admin/announcements', {
          method: 'POST',
          headers,
          body: JSON.stringify({ topic: 'launches', subject: 'After the stop', markdown: 'Later news.' }),
        })
      ).json();
      await fetch(`/api/admin/announcements/${created.announcement.id}/send`, { method: 'POST', headers });
      return created.announcement.id as number;
    });
    expect(await t.deps.db('outbound_emails').where({ to_address: email, announcement_id: again })).toHaveLength(0);

    expect(requests.filter((u) => !/^(http:\/\/127\.0\.0\.1[:/]|data:|blob:)/.test(u))).toEqual([]);
    expect(visitor.errors).toEqual([]);
    expect(staff.errors).toEqual([]);
    await visitor.context.close();
    await staff.context.close();
  });

  it('asks to be told about the next run on a closed run’s product page, and lists it on the account page', async () => {
    const admin = await createUser(t.deps.db, ['fan', 'admin'], 'Run Admin');
    const staff = new Client(t.app);
    await staff.signIn(admin);
    const shirt = await openShirt(staff);
    // The run closed yesterday.
    await t.deps
      .db('shop_runs')
      .where('id', shirt.run.id)
      .update({ opens_at: new Date(Date.now() - 3 * 86_400_000), closes_at: new Date(Date.now() - 86_400_000) });
    const fan = await createUser(t.deps.db, ['fan'], 'Ilse Prairiewind');

    const visitor = await phone();
    await signInThroughForm(visitor.page, site.baseUrl, fan.email, fan.password);
    await visitor.page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    await toSignUp(visitor.page);
    await visitor.page.getByRole('heading', { name: 'Tell me when the next run opens' }).waitFor();
    const box = visitor.page.getByRole('checkbox', { name: /the next run of Test shirt/ });
    expect(await box.isChecked()).toBe(true);
    expect(await seriousViolations(visitor.page)).toEqual([]);
    await visitor.page.getByLabel('E-mail').fill(fan.email);
    await visitor.page.getByRole('button', { name: 'Tell me' }).click();
    await visitor.page.getByTestId('sign-up-sent').waitFor();
    await screenshot(visitor.page, 'announcements-phone-product');
    await t.app.platform.auth.afterAnswer.settled();
    const [row] = await t.deps.db('subscriptions').where({ email: fan.email });
    expect(row).toEqual(
      expect.objectContaining({
        topic: 'drops',
        product_id: shirt.id,
        source_page: 'product',
        confirmed_at: null,
      }),
    );

    // The account page shows the request waiting for its confirmation.
    await visitor.page.goto(`${site.baseUrl}/account`);
    await visitor.page.getByRole('heading', { name: 'E-mail lists' }).waitFor();
    await visitor.page.getByText(/The next run of Test shirt .* waiting for your confirmation/).waitFor();
    expect(await seriousViolations(visitor.page)).toEqual([]);
    await screenshot(visitor.page, 'announcements-phone-account');
    expect(visitor.errors).toEqual([]);
    await visitor.context.close();
  });
});
