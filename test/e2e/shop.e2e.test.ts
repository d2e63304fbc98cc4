import type { Browser } from 'playwright-core';
import { browserSuite, recordRequests, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import { waitForEmails } from '../helpers/maildev';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';
import { openShirt } from '../api/shop-fixtures';
import { toPaymentStep } from './checkout-steps';

let t: TestApp;
let browser: Browser;
let site: Site;

browserSuite({}, async (s) => {
  ({ t, site, browser } = s);
  t.deps.mail.start(300);
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
    await toPaymentStep(page, shirt.slug, { product: 'shop-product', cart: 'shop-cart-panel' });
    await page.getByRole('radio', { name: 'Test Visa (pays)' }).check();
    // 35.00 + 9.00 shipping, GST 5% 2.20 + RST 7% 3.08 (MB shipping taxable setting) = 49.28.
    await page.getByTestId('quote-total').getByText('$49.28').waitFor();
    await page.getByRole('button', { name: 'Next: review' }).click();
    await screenshot(page, 'shop-checkout-review');
    await page.getByRole('button', { name: 'Place order' }).click();
    await page.getByRole('heading', { name: 'Thank you, your order is in' }).waitFor();
    // The receipt block (ITC information: seller's name, date, total; the team's name while no seller name is set).
    await page.getByText('Sold by').waitFor();
    await page.getByText('Date paid').waitFor();
    await screenshot(page, 'shop-confirmation');
    const number = (await page.getByRole('status').first().locator('strong').textContent())!.trim();
    expect(number).toMatch(/^PS-\d{6}$/);

    const [mail] = await waitForEmails(fan.email, new RegExp(`order ${number}`), 1, 15_000);
    expect(mail.text).toContain('Total: $49.28');
    expect(requests.filter((u) => !/^(http:\/\/127\.0\.0\.1[:/]|data:|blob:)/.test(u))).toEqual([]);
    await page.close();

    // Orders of a run ship once the run is printed.
    for (const state of ['closed', 'in_production', 'shipped'])
      await staffApi.post(`/api/admin/runs/${shirt.run.id}/state`, { state });
    const staffPage = await browser.newPage();
    await signInThroughForm(staffPage, site.baseUrl, staffUser.email, staffUser.password);
    await staffPage.goto(`${site.baseUrl}/console/orders`);
    await staffPage.getByLabel('Search e-mail or order number').fill(number);
    await staffPage.getByRole('link', { name: number }).click();
    await staffPage.getByRole('heading', { name: `Order ${number}` }).waitFor();
    // The carrier is a shop setting, blank unless staff chose one: Padside names no shipping company.
    expect(await staffPage.getByLabel('Carrier').inputValue()).toBe('');
    await staffPage.getByLabel('Carrier').fill('Gopherline Courier');
    await staffPage.getByLabel('Tracking number').fill('7023 4455 6677');
    await staffPage.getByRole('button', { name: 'Mark shipped' }).click();
    await staffPage.getByText(/with Gopherline Courier, tracking 7023 4455 6677/).waitFor();
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

  it('staff closes a run and opens the product’s next run from the Runs page', async () => {
    const staffUser = await createUser(t.deps.db, ['fan', 'treasurer'], 'Ines Marlow');
    const staffApi = new Client(t.app);
    await staffApi.signIn(staffUser);
    const shirt = await openShirt(staffApi, { cap: 20 });
    const productName = (await staffApi.get(`/api/admin/products/${shirt.id}`)).body.product.name as string;
    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, staffUser.email, staffUser.password);
    await page.goto(`${site.baseUrl}/console/runs`);
    const row = page.getByRole('row', { name: new RegExp(productName) });
    await row.getByRole('button', { name: 'Close now' }).click();
    await row.getByRole('button', { name: 'Send to the printer' }).waitFor();

    const form = page.getByRole('form', { name: 'Next run of a product' });
    await form.getByRole('combobox', { name: 'Product' }).click();
    await page.getByRole('option', { name: productName }).click();
    await form.getByLabel('Run name (optional)').fill('Spring reprint');
    await form.getByLabel('Cap (units)').fill('30');
    await form.getByLabel('Opens').fill('2030-04-01T09:00');
    await form.getByLabel('Closes').fill('2030-03-01T09:00');
    await form.getByRole('button', { name: 'Add the run' }).click();
    await form.getByText('Must be after the opening.').waitFor();
    await form.getByLabel('Closes').fill('2030-04-20T21:00');
    await form.getByLabel('L', { exact: true }).fill('10');
    await screenshot(page, 'shop-console-next-run');
    await form.getByRole('button', { name: 'Add the run' }).click();
    await page.getByRole('row', { name: /Spring reprint/ }).waitFor();
    await page.close();

    const run = await t.deps.db('shop_runs').where({ product_id: shirt.id, name: 'Spring reprint' }).first();
    expect(run).toMatchObject({ cap: 30, state: 'scheduled' });
    // 09:00 in Winnipeg on 2030-04-01 is daylight time, -05:00 (IANA tz database, from memory).
    expect(new Date(run.opens_at).toISOString()).toBe('2030-04-01T14:00:00.000Z');
    expect(
      (await t.deps.db('shop_run_variant_caps').where('run_id', run.id)).map((c) => [Number(c.variant_id), c.cap]),
    ).toEqual([[shirt.variants[1].id, 10]]);
  });
});
