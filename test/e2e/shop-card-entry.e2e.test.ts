import type { Browser } from 'playwright-core';
import { browserSuite, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';
import { openShirt } from '../api/shop-fixtures';
import { toPaymentStep } from './checkout-steps';
import { STRIPE_JS_STAND_IN } from './stripe-js-stand-in';

let t: TestApp;
let browser: Browser;
let site: Site;

browserSuite({ env: { STRIPE_PUBLISHABLE_KEY: 'pk_test_padsideBrowserTest' } }, (s) => {
  ({ t, site, browser } = s);
});

describe('card entry with a publishable key', () => {
  it('allows Stripe.js in the CSP and says so at /api/payments/card-entry', async () => {
    const res = await fetch(`${site.baseUrl}/`);
    const csp = res.headers.get('content-security-policy')!;
    expect(csp).toContain("script-src 'self' https://js.stripe.com");
    expect(csp).toContain('frame-src https://js.stripe.com https://hooks.stripe.com');
    expect(await (await fetch(`${site.baseUrl}/api/payments/card-entry`)).json()).toEqual({
      mode: 'stripe-js',
      publishableKey: 'pk_test_padsideBrowserTest',
    });
  });

  it('a fan pays through the processor’s card frame; the card number never reaches Padside', async () => {
    const staff = new Client(t.app);
    await staff.signIn(await createUser(t.deps.db, ['fan', 'treasurer'], 'Odile Brandt'));
    const shirt = await openShirt(staff, { cap: 10 });
    const fan = await createUser(t.deps.db, ['fan'], 'Tamsin Ruel');

    const page = await browser.newPage();
    const stripeScripts: string[] = [];
    await page.route('https://js.stripe.com/**', (route) => {
      stripeScripts.push(route.request().url());
      return route.fulfill({ contentType: 'application/javascript', body: STRIPE_JS_STAND_IN });
    });
    const leaks: string[] = [];
    const elsewhere: string[] = [];
    page.on('request', (req) => {
      if ((req.postData() ?? '').includes('4242')) leaks.push(req.url());
      if (!/^(http:\/\/127\.0\.0\.1[:/]|https:\/\/js\.stripe\.com\/|data:|blob:)/.test(req.url()))
        elsewhere.push(req.url());
    });
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    await toPaymentStep(page, shirt.slug);

    const card = page.getByRole('group', { name: 'Card details' }).getByLabel('Card number');
    await card.fill('4242 4242 42');
    await page.getByRole('button', { name: 'Next: review' }).click();
    // The step is not done until the frame reports a complete card: the review stays folded away.
    await page.waitForTimeout(500);
    expect(await page.getByRole('button', { name: 'Place order' }).isVisible()).toBe(false);
    await card.fill('4242 4242 4242 4242');
    await page.getByRole('button', { name: 'Next: review' }).click();
    await screenshot(page, 'shop-checkout-card-frame');
    await page.getByRole('button', { name: 'Place order' }).click();
    await page.getByRole('heading', { name: 'Thank you, your order is in' }).waitFor();
    await page.close();

    expect(stripeScripts).toEqual([expect.stringMatching(/^https:\/\/js\.stripe\.com\/[a-z0-9]+\/stripe\.js/)]);
    expect(leaks).toEqual([]);
    expect(elsewhere).toEqual([]);
    const order = await t.deps.db('shop_orders').where('email', fan.email).first();
    expect(order.status).toBe('paid');
  });
});
