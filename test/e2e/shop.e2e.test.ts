import type { Browser } from 'playwright-core';
import { launchBrowser, recordRequests, screenshot, serve, signInThroughForm } from '../helpers/browser';
import { waitForEmails } from '../helpers/maildev';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';
import { openShirt } from '../api/shop-fixtures';

let t: TestApp;
let browser: Browser;
let site: { baseUrl: string; stop(): Promise<void> };

beforeAll(async () => {
  t = buildTestApp();
  site = await serve(t);
  t.deps.mail.start(300);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await site?.stop();
  await t?.close();
});

describe('the merch shop in a browser', () => {
  it('a fan buys a shirt from the grid to the confirmation, gets the e-mail, and staff marks it shipped', async () => {
    const staffUser = await createUser(t.deps.db, ['fan', 'treasurer'], 'Dale Till');
    const staffApi = new Client(t.app);
    await staffApi.signIn(staffUser);
    const shirt = await openShirt(staffApi, { cap: 20 });
    const fan = await createUser(t.deps.db, ['fan'], 'Wren Halvorsen');

    const page = await browser.newPage();
    const requests = recordRequests(page);
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.goto(`${site.baseUrl}/shop`);
    await page.getByRole('heading', { name: 'Merch' }).waitFor();
    await screenshot(page, 'shop-grid');
    const tile = page.getByRole('link', { name: new RegExp(shirt.slug.replace(/-/g, ' '), 'i') });
    await tile.click();
    await page.waitForURL(`**/shop/p/${shirt.slug}`);
    await page.getByRole('heading', { level: 1, name: new RegExp(shirt.slug.replace(/-/g, ' '), 'i') }).waitFor();
    // A single-choice toggle group is a radio group to assistive technology.
    await page.getByRole('radio', { name: 'L', exact: true }).click();
    await page.getByText('left in L').waitFor();
    await screenshot(page, 'shop-product');
    await page.getByRole('button', { name: 'Add to cart' }).click();
    await page.getByRole('dialog', { name: 'Your cart' }).waitFor();
    await screenshot(page, 'shop-cart-panel');
    await page.getByRole('link', { name: 'Check out' }).click();

    await page.getByRole('heading', { name: 'Checkout' }).waitFor();
    await page.getByRole('button', { name: 'Next: shipping' }).click();
    await page.getByRole('radio', { name: 'Mail within Canada' }).check();
    await page.getByLabel('Address', { exact: true }).fill('12 Launch Rail Rd');
    await page.getByLabel('City').fill('Gopher Flats');
    await page.getByLabel('Postal code').fill('R0K 1A0');
    await page.getByRole('button', { name: 'Next: payment' }).click();
    await page.getByRole('radio', { name: 'Test Visa (pays)' }).check();
    // 35.00 + 9.00 shipping, GST 5% 2.20 + RST 7% 3.08 (MB shipping taxable setting) = 49.28.
    await page.getByTestId('quote-total').getByText('$49.28').waitFor();
    await page.getByRole('button', { name: 'Next: review' }).click();
    await screenshot(page, 'shop-checkout-review');
    await page.getByRole('button', { name: 'Place order' }).click();
    await page.getByRole('heading', { name: 'Thank you, your order is in' }).waitFor();
    await screenshot(page, 'shop-confirmation');
    const number = (await page.getByRole('status').first().locator('strong').textContent())!.trim();
    expect(number).toMatch(/^PS-\d{6}$/);

    const [mail] = await waitForEmails(fan.email, new RegExp(`order ${number}`), 1, 15_000);
    expect(mail.text).toContain('Total: $49.28');
    expect(requests.filter((u) => !/^(http:\/\/127\.0\.0\.1[:/]|data:|blob:)/.test(u))).toEqual([]);
    await page.close();

    const staffPage = await browser.newPage();
    await signInThroughForm(staffPage, site.baseUrl, staffUser.email, staffUser.password);
    await staffPage.goto(`${site.baseUrl}/console/orders`);
    await staffPage.getByLabel('Search e-mail or order number').fill(number);
    await staffPage.getByRole('link', { name: number }).click();
    await staffPage.getByRole('heading', { name: `Order ${number}` }).waitFor();
    await staffPage.getByLabel('Tracking number').fill('7023 4455 6677');
    await staffPage.getByRole('button', { name: 'Mark shipped' }).click();
    await staffPage.getByText(/with Canada Post, tracking 7023 4455 6677/).waitFor();
    await screenshot(staffPage, 'shop-console-order-shipped');
    await waitForEmails(fan.email, /on its way/, 1, 15_000);
    await staffPage.goto(`${site.baseUrl}/console/runs/${shirt.run.id}/print-sheet`);
    await staffPage.getByRole('heading', { name: /Print-run sheet/ }).waitFor();
    await screenshot(staffPage, 'shop-print-sheet');
    await staffPage.goto(`${site.baseUrl}/console/orders`);
    await staffPage.getByRole('heading', { name: 'Orders' }).waitFor();
    await screenshot(staffPage, 'shop-console-orders');
    await staffPage.close();
    expect((await t.deps.db('shop_orders').where('number', number).first()).status).toBe('shipped');
  });
});
