import type { Browser } from 'playwright-core';
import { browserSuite, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt } from '../api/shop-fixtures';

let t: TestApp;
let browser: Browser;
let site: Site;

browserSuite({}, (s) => {
  ({ t, site, browser } = s);
});

describe('a refund by line from the console, on a phone', () => {
  it('shows the refund with each tax before it goes, puts the unit back on sale and counts it out of the packing list', async () => {
    const treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Marit Okonkwo');
    const staffApi = new Client(t.app);
    await staffApi.signIn(treasurer);
    const shirt = await openShirt(staffApi, { cap: 20 });
    const buyer = new Client(t.app);
    const placed = await buyer.post('/api/orders', {
      items: [
        { variantId: shirt.variants[0].id, quantity: 2 },
        { variantId: shirt.variants[1].id, quantity: 1 },
      ],
      shipTo: MB_ADDRESS,
      shippingMethodId: await methodId(buyer, 'canada'),
      email: `phone-refund-${Date.now()}@example.test`,
      paymentToken: 'tok_visa',
    });
    expect(placed.status).toBe(201);
    const { id, number } = placed.body.order as { id: number; number: string };

    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(page, site.baseUrl, treasurer.email, treasurer.password);
    await page.goto(`${site.baseUrl}/console/orders/${id}`);
    await page.getByRole('heading', { name: `Order ${number}` }).waitFor();
    // The run is still open: no shipping form, a note saying what it waits for.
    await page.getByTestId('awaiting-print').waitFor();
    expect(await page.getByRole('button', { name: 'Mark shipped' }).count()).toBe(0);

    const refund = page.getByRole('form', { name: 'Refund' });
    await refund.getByRole('checkbox', { name: /\(M\) · 2 of 2 left/ }).check();
    await refund.getByRole('spinbutton', { name: 'Units' }).fill('1');
    await refund.getByRole('checkbox', { name: 'Put the refunded units back on sale' }).check();
    await refund.getByRole('button', { name: 'Review the refund' }).click();
    const dialog = page.getByRole('dialog');
    // One shirt: 35.00 + GST 5% 1.75 + RST 7% 2.45 = 39.20 (Excise Tax Act s. 232, tax on what is credited, from memory).
    await dialog.getByText('GST 5% on $35.00').waitFor();
    await dialog.getByText('$2.45').waitFor();
    await dialog.getByText('1 unit goes back on sale.').waitFor();
    await screenshot(page, 'shop-refund-confirm-phone');
    expect(await t.deps.db('shop_refunds').where('order_id', id)).toHaveLength(0);
    await dialog.getByRole('button', { name: 'Refund $39.20' }).click();

    await page.getByText('Refund sent; 1 back on sale.').waitFor();
    await page.getByText(/\$39\.20 · Staff · Refunded/).waitFor();
    await page.getByText('(2 ordered, 1 refunded)').waitFor();
    expect(await page.getByText(/is required/).count()).toBe(0);
    // A fresh form for the next refund: nothing left ticked from this one.
    expect(await refund.getByRole('checkbox', { name: /\(M\) · 1 of 2 left/ }).isChecked()).toBe(false);
    await screenshot(page, 'shop-refund-done-phone');
    await context.close();

    expect(errors).toEqual([]);
    const row = await t.deps.db('shop_orders').where('id', id).first();
    expect(row.refunded_cents).toBe(3920);
    expect((await t.processor.refunds.list({ charge: row.charge_id })).data.map((r) => r.amount)).toEqual([3920]);
    expect((await t.deps.db('shop_runs').where('id', shirt.run.id).first()).reserved).toBe(2);
  });
});
