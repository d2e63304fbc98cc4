import type { Page } from 'playwright-core';
import { screenshot } from '../helpers/browser';

/**
 * From the product page (already open) to the payment step: size L into the cart, contact as signed in, mailed within
 * Canada to a Manitoba address. `shots` names the screenshots taken on the way, if any.
 */
export async function toPaymentStep(
  page: Page,
  slug: string,
  shots?: { product: string; cart: string },
): Promise<void> {
  await page.getByRole('heading', { level: 1, name: new RegExp(slug.replace(/-/g, ' '), 'i') }).waitFor();
  // A single-choice toggle group is a radio group to assistive technology.
  await page.getByRole('radio', { name: 'L', exact: true }).click();
  await page.getByText('left in L').waitFor();
  if (shots) await screenshot(page, shots.product);
  await page.getByRole('button', { name: 'Add to cart' }).click();
  await page.getByRole('dialog', { name: 'Your cart' }).waitFor();
  if (shots) await screenshot(page, shots.cart);
  await page.getByRole('link', { name: 'Check out' }).click();

  await page.getByRole('heading', { name: 'Checkout' }).waitFor();
  await page.getByRole('button', { name: 'Next: shipping' }).click();
  await page.getByRole('radio', { name: 'Mail within Canada' }).check();
  await page.getByLabel('Address', { exact: true }).fill('12 Launch Rail Rd');
  await page.getByLabel('City').fill('Gopher Flats');
  await page.getByLabel('Postal code').fill('R0K 1A0');
  await page.getByRole('button', { name: 'Next: payment' }).click();
}
