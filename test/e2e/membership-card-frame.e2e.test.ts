import type { Browser } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { browserSuite, consoleErrors, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import { fixedClock, type TestApp } from '../helpers/test-app';
import { createUser } from '../helpers/users';
import { STRIPE_JS_STAND_IN } from './stripe-js-stand-in';

const clock = fixedClock('2026-11-20T18:00:00Z');
let t: TestApp;
let browser: Browser;
let site: Site;
const tag = `F${Date.now().toString(36)}`;

browserSuite({ clock, env: { STRIPE_PUBLISHABLE_KEY: 'pk_test_padsideDuesBrowserTest' } }, (s) => {
  ({ t, site, browser } = s);
});

describe('dues with a publishable key', () => {
  it('a fan joins on a phone through the processor’s card frame, keeps the card on file, and sees its brand and last four', async () => {
    const fan = await createUser(t.deps.db, ['fan'], 'Leofric Dunmore');
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const errors = consoleErrors(page);
    await page.route('https://js.stripe.com/**', (route) =>
      route.fulfill({ contentType: 'application/javascript', body: STRIPE_JS_STAND_IN }),
    );
    const leaks: string[] = [];
    page.on('request', (req) => {
      if ((req.postData() ?? '').includes('4242')) leaks.push(req.url());
    });
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.goto(`${site.baseUrl}/membership`);
    await page.getByRole('heading', { name: 'Join the club' }).waitFor();
    await page.getByLabel('Plan', { exact: true }).click();
    await page.getByRole('option', { name: /Adult/ }).click();
    await page.getByLabel('Legal name', { exact: true }).fill(`Leofric Dunmore ${tag}`);
    await page.getByLabel('Date of birth', { exact: true }).fill('1979-09-30');
    await page.getByLabel('Address', { exact: true }).fill('8 Badger Road, Gopher Flats, MB');
    await page.getByLabel('Phone', { exact: true }).fill('204-555-0190');
    await page.getByLabel('Emergency contact', { exact: true }).fill('Edith Dunmore 204-555-0191');
    await page.getByLabel(/I have read and accept the waiver/).check();
    await page.getByLabel(/Keep this card on file/).check();
    // No test-card list: the card goes into the processor's frame, and the form waits for a complete one.
    await expect(page.getByText('Test Visa (pays)').count()).resolves.toBe(0);
    const card = page.getByRole('group', { name: 'Card details' }).getByLabel('Card number');
    await card.fill('4242 4242 42');
    await page.getByRole('button', { name: 'Pay dues and join' }).click();
    await page.getByText('Card is required.').waitFor();
    await card.fill('4242 4242 4242 4242');
    await screenshot(page, 'membership-card-frame');
    await page.getByRole('button', { name: 'Pay dues and join' }).click();
    await page
      .getByRole('status')
      .getByText(/Welcome aboard/)
      .waitFor();
    // The stand-in frame hands over tok_visa, the processor's test Visa ending 4242.
    await page.getByTestId('card-on-file').getByText('Visa ending 4242').waitFor();
    // A November join is paid through next year, so renewing waits until January.
    await page.getByTestId('renewal-later').getByText('opens on Jan 1, 2027').waitFor();
    clock.set('2027-01-05T18:00:00Z');
    await page.reload();
    // Renewing offers the card on file or a new card in the frame, never a test-card list.
    await page.getByLabel('Card', { exact: true }).click();
    await page.getByRole('option', { name: 'Visa ending 4242 (on file)' }).waitFor();
    await page.getByRole('option', { name: 'A new card' }).click();
    await page.getByRole('form', { name: 'Renew', exact: true }).getByRole('group', { name: 'Card details' }).waitFor();
    await screenshot(page, 'membership-card-frame-renew');
    expect(await seriousViolations(page)).toEqual([]);
    expect(leaks).toEqual([]);
    expect(errors).toEqual([]);
    const row = await t.deps
      .db('memberships')
      .where('user_id', fan.id)
      .first('status', 'card_brand', 'card_last4', 'auto_renew');
    expect(row).toEqual({ status: 'active', card_brand: 'Visa', card_last4: '4242', auto_renew: true });
    await context.close();
  });
});
