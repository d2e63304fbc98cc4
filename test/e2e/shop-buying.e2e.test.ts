import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { season3Shirt } from '../../seeds/shop-art/product-art';
import { storeProductArt } from '../../seeds/shop-art/store-art';
import { DiskStorage } from '../../server/uploads/disk-storage';
import { ImageUploads } from '../../server/uploads/image-uploads';
import { browserSuite, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import { firstLink, waitForEmails } from '../helpers/maildev';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';
import { openShirt } from '../api/shop-fixtures';
import { toPaymentStep } from './checkout-steps';
import { formatDateTime } from '../../contracts/dates/club-dates';

let t: TestApp;
let browser: Browser;
let site: Site;
let staff: Client;

browserSuite({}, async (s) => {
  ({ t, site, browser } = s);
  t.deps.mail.start(300);
  const staffUser = await createUser(t.deps.db, ['fan', 'treasurer'], 'Odile Ferrand');
  staff = new Client(t.app);
  await staff.signIn(staffUser);
});

/** A fresh browser context the size of a phone (390x844), with touch. */
function phone(width = 390): Promise<BrowserContext> {
  return browser.newContext({ viewport: { width, height: 844 }, isMobile: true, hasTouch: true });
}

/** From the product page to the review step as a guest: size L, the e-mail typed, mailed within Manitoba. */
async function guestToReview(page: Page, slug: string, email: string): Promise<void> {
  await page.goto(`${site.baseUrl}/shop/p/${slug}`);
  await page.getByRole('radio', { name: /^L\b/ }).click();
  await page.getByRole('button', { name: 'Add to cart' }).click();
  await page.getByRole('dialog', { name: 'Your cart' }).getByRole('link', { name: 'Check out' }).click();
  await page.getByRole('heading', { name: 'Checkout' }).waitFor();
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Next: shipping' }).click();
  await page.getByRole('radio', { name: /Mail within Canada/ }).check();
  await page.getByLabel('Name').fill('Tamsin Quarrie');
  await page.getByLabel('Address', { exact: true }).fill('12 Launch Rail Rd');
  await page.getByLabel('City').fill('Gopher Flats');
  await page.getByLabel('Postal code').fill('R0K 1A0');
  await page.getByRole('button', { name: 'Next: payment' }).click();
  await page.getByRole('radio', { name: 'Test Visa (pays)' }).check();
  await page.getByRole('button', { name: 'Next: review' }).click();
}

describe('guest checkout on a phone', () => {
  it('shows the guest their confirmation after Place order, and the e-mailed link opens the order in a fresh browser', async () => {
    const shirt = await openShirt(staff, { cap: 20 });
    const email = `guest-${shirt.slug}@padside.test`;
    const ctx = await phone();
    const page = await ctx.newPage();
    await guestToReview(page, shirt.slug, email);
    await page.getByRole('button', { name: 'Place order' }).click();
    await page.getByRole('heading', { name: 'Thank you, your order is in' }).waitFor({ timeout: 15_000 });
    expect(new URL(page.url()).pathname).toMatch(/^\/shop\/orders\/\d+$/);
    const number = (await page
      .getByRole('status')
      .filter({ hasText: 'Order' })
      .locator('strong')
      .first()
      .textContent())!.trim();
    expect(number).toMatch(/^PS-\d{6}$/);
    await screenshot(page, 'buying-guest-confirmation-phone');
    // Opening it again in the same browser still shows it (the session remembers the guest's order).
    await page.goto(`${site.baseUrl}${new URL(page.url()).pathname}`);
    await page.getByRole('heading', { name: `Order ${number}` }).waitFor();
    await ctx.close();

    const [mail] = await waitForEmails(email, new RegExp(`order ${number}`), 1, 15_000);
    const mailed = firstLink(mail);
    expect(mailed.startsWith(`${t.config.publicUrl}/shop/orders/`)).toBe(true);
    expect(mailed).toMatch(/\/shop\/orders\/\d+\?key=[A-Za-z0-9_-]{20,}$/);
    // The link names PUBLIC_URL; this test serves the app on its own port, so the path and key are opened there.
    const link = site.baseUrl + mailed.slice(t.config.publicUrl.length);
    const fresh = await phone();
    const page2 = await fresh.newPage();
    await page2.goto(link);
    await page2.getByRole('heading', { name: `Order ${number}` }).waitFor();
    expect(new URL(page2.url()).pathname).not.toContain('sign-in');
    await screenshot(page2, 'buying-guest-emailed-link-phone');
    // A tampered key opens nothing.
    const other = await phone();
    const page3 = await other.newPage();
    await page3.goto(link.replace(/key=.*$/, 'key=forged-key-value'));
    await page3.waitForTimeout(3000);
    await screenshot(page3, 'buying-guest-forged-link');
    console.log(page3.url(), await page3.locator('main').innerText());
    await page3.getByRole('heading', { name: 'Order not found' }).waitFor();
    await other.close();
    await fresh.close();
  });
});

describe('the cart drawer on a phone', () => {
  it.each([320, 390])('keeps every element of the open drawer inside a %i px wide viewport', async (width) => {
    const shirt = await openShirt(staff, { cap: 20 });
    const ctx = await phone(width);
    const page = await ctx.newPage();
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    await page.getByRole('radio', { name: /^L\b/ }).click();
    await page.getByRole('button', { name: 'Add to cart' }).click();
    const drawer = page.getByRole('dialog', { name: 'Your cart' });
    await drawer.getByRole('link', { name: 'Check out' }).waitFor();
    await screenshot(page, `buying-cart-drawer-${width}`);
    const outside = await drawer.evaluate((root) => {
      const vw = document.documentElement.clientWidth;
      return [root, ...Array.from(root.querySelectorAll('*'))]
        .map((el) => ({ el, box: el.getBoundingClientRect() }))
        .filter(({ box }) => box.width > 0 && (box.left < -0.5 || box.right > vw + 0.5))
        .map(
          ({ el, box }) =>
            `${el.tagName.toLowerCase()}.${el.className} ${Math.round(box.left)}..${Math.round(box.right)}`,
        );
    });
    expect(outside).toEqual([]);
    await ctx.close();
  });
});

describe('a declined card on a phone', () => {
  it('shows the refusal beside the card choice, clears it on change, and the failed attempt is not one of My orders', async () => {
    const shirt = await openShirt(staff, { cap: 20 });
    const fan = await createUser(t.deps.db, ['fan'], 'Corin Abernathy');
    const ctx = await phone();
    const page = await ctx.newPage();
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    await toPaymentStep(page, shirt.slug);
    await page.getByRole('radio', { name: 'Test card that is declined' }).check();
    await page.getByRole('button', { name: 'Next: review' }).click();
    await page.getByRole('button', { name: 'Place order' }).click();

    const cardChoice = page.locator('form', { has: page.getByRole('radiogroup', { name: 'Test card' }) });
    const refusal = cardChoice.getByRole('alert');
    await refusal.waitFor();
    expect(await refusal.textContent()).toMatch(/declined/i);
    await expect(refusal.isVisible()).resolves.toBe(true);
    expect(
      await page
        .getByRole('complementary', { name: 'Order summary' })
        .getByText(/declined/i)
        .count(),
    ).toBe(0);
    await screenshot(page, 'buying-declined-card-phone');

    await page.getByRole('radio', { name: 'Test Visa (pays)' }).check();
    // The refusal clears on the next change detection, not synchronously with the click.
    await refusal.waitFor({ state: 'detached', timeout: 5_000 });
    expect(await cardChoice.getByRole('alert').count()).toBe(0);
    await page.getByRole('button', { name: 'Next: review' }).click();
    await page.getByRole('button', { name: 'Place order' }).click();
    await page.getByRole('heading', { name: 'Thank you, your order is in' }).waitFor({ timeout: 15_000 });
    const number = (await page
      .getByRole('status')
      .filter({ hasText: 'Order' })
      .locator('strong')
      .first()
      .textContent())!.trim();

    await page.goto(`${site.baseUrl}/shop/orders`);
    await page.getByRole('heading', { name: 'My orders' }).waitFor();
    await page.getByRole('link', { name: number }).waitFor();
    expect(await page.getByRole('row').count()).toBe(2); // the header and the one paid order
    expect(await page.getByText('Not paid').count()).toBe(0);
    await screenshot(page, 'buying-my-orders-phone');
    await ctx.close();

    // Staff still see the failed attempt, once they ask for it.
    const rows = await t.deps.db('shop_orders').where('email', fan.email).orderBy('id');
    expect(rows.map((r) => r.status)).toEqual(['failed', 'paid']);
    const byDefault = await staff.get(`/api/admin/orders?q=${encodeURIComponent(fan.email)}&status=placed`);
    expect(byDefault.body.items.map((o: { number: string }) => o.number)).toEqual([number]);
    const staffUser = await createUser(t.deps.db, ['fan', 'treasurer'], 'Bastien Corr');
    const staffPage = await browser.newPage();
    await signInThroughForm(staffPage, site.baseUrl, staffUser.email, staffUser.password);
    await staffPage.goto(`${site.baseUrl}/console/orders`);
    await staffPage.getByLabel('Search e-mail or order number').fill(fan.email);
    await staffPage.getByRole('link', { name: number }).waitFor();
    expect(await staffPage.getByRole('cell', { name: 'Not paid' }).count()).toBe(0);
    await staffPage.getByRole('combobox', { name: 'Status' }).click();
    await staffPage.getByRole('option', { name: /Any status/ }).click();
    await staffPage.getByRole('cell', { name: 'Not paid' }).waitFor();
    await screenshot(staffPage, 'buying-console-failed-attempts');
    await staffPage.close();
  });
});

describe('quantities on a phone', () => {
  it('caps 500 at the per-order limit and refuses 0 and -2, saying so beside the field', async () => {
    const shirt = await openShirt(staff, { cap: 50 });
    expect((await staff.patch(`/api/admin/products/${shirt.id}`, { maxPerOrder: 4 })).status).toBe(200);
    const ctx = await phone();
    const page = await ctx.newPage();
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    await page.getByRole('radio', { name: /^L\b/ }).click();
    await page.getByText('At most 4 per order').waitFor();
    const qty = page.getByLabel('Quantity');
    await qty.fill('500');
    await qty.press('Tab');
    await page.getByText('Changed to 4: at most 4 per order.').waitFor();
    expect(await qty.inputValue()).toBe('4');
    await screenshot(page, 'buying-quantity-capped-phone');
    for (const typed of ['0', '-2']) {
      await qty.fill(typed);
      await qty.press('Tab');
      await page.getByText('Enter a whole number of at least 1.').waitFor();
      expect(await page.getByRole('button', { name: 'Add to cart' }).isDisabled()).toBe(true);
    }
    await screenshot(page, 'buying-quantity-refused-phone');
    await qty.fill('3');
    await qty.press('Tab');
    await page.getByRole('button', { name: 'Add to cart' }).click();
    await page.getByRole('status').filter({ hasText: 'Added 3 to the cart.' }).waitFor();
    await ctx.close();
  });
});

describe('sizes and options on a phone', () => {
  it('says "sold out" on a sold-out size and preselects a sole option', async () => {
    const shirt = await openShirt(staff, { cap: 50, variantCaps: { M: 0 } });
    const ctx = await phone();
    const page = await ctx.newPage();
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    const m = page.getByRole('radio', { name: /^M\b/ });
    await m.waitFor();
    expect(await m.textContent()).toMatch(/M\s+sold out/);
    expect(await m.isDisabled()).toBe(true);
    await screenshot(page, 'buying-sold-out-size-phone');

    const single = await staff.post('/api/admin/products', {
      name: `Single pin ${shirt.slug.slice(-6)}`,
      priceCents: 900,
      weightGrams: 15,
      variants: [{ label: 'Brass', stock: 5 }],
    });
    expect(single.status).toBe(201);
    await page.goto(`${site.baseUrl}/shop/p/${single.body.product.slug}`);
    await page.getByText('5 left in Brass').waitFor();
    expect(await page.getByRole('radio', { name: /^Brass/ }).getAttribute('aria-checked')).toBe('true');
    expect(await page.getByRole('button', { name: 'Add to cart' }).isEnabled()).toBe(true);
    await screenshot(page, 'buying-sole-option-phone');
    await ctx.close();
  });
});

describe('product photos', () => {
  it('shows our drawn photos in responsive WebP sizes with alt text, in a gallery that swipes, steps and answers the keyboard', async () => {
    const shirt = await openShirt(staff, { cap: 20 });
    const uploads = new ImageUploads(t.deps.db, new DiskStorage(path.join(t.config.dataDir, 'uploads')));
    const images = await storeProductArt(t.deps.db, uploads, shirt.id, season3Shirt());
    expect(images).toHaveLength(2);

    const ctx = await phone();
    const page = await ctx.newPage();
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    const gallery = page.getByRole('group', { name: /^Photos of / });
    const main = gallery.locator('img').first();
    await main.waitFor();
    await page.waitForFunction(() => Array.from(document.images).every((i) => i.complete));
    const shown = await main.evaluate((img: HTMLImageElement) => ({
      alt: img.alt,
      srcset: img.srcset,
      w: img.getAttribute('width'),
      h: img.getAttribute('height'),
      natural: img.naturalWidth,
      src: img.currentSrc,
    }));
    expect(shown.alt).toMatch(/^Navy tee with the round Season 3 patch/);
    expect(shown.srcset).toMatch(/\/uploads\/[a-z0-9-]+-thumb\.webp 480w, \/uploads\/[a-z0-9-]+\.webp 1200w/);
    expect([shown.w, shown.h]).toEqual(['1200', '1200']);
    expect(shown.natural).toBeGreaterThan(0);
    const served = await page.request.get(shown.src);
    expect(served.headers()['content-type']).toBe('image/webp');
    await screenshot(page, 'buying-product-gallery-phone');

    // A swipe to the left shows the next photo.
    const box = (await gallery.boundingBox())!;
    const y = box.y + box.height / 2;
    await gallery.dispatchEvent('pointerdown', {
      clientX: box.x + box.width * 0.8,
      clientY: y,
      pointerType: 'touch',
      isPrimary: true,
    });
    await gallery.dispatchEvent('pointerup', {
      clientX: box.x + box.width * 0.2,
      clientY: y,
      pointerType: 'touch',
      isPrimary: true,
    });
    await gallery.getByText('Photo 2 of 2').waitFor();
    expect(await main.getAttribute('alt')).toMatch(/^The Season 3 patch up close/);
    await screenshot(page, 'buying-product-gallery-swiped-phone');

    // The grid and the home page show the photo too.
    await page.goto(`${site.baseUrl}/shop`);
    const tile = page.getByRole('link', { name: new RegExp(shirt.slug.replace(/-/g, ' '), 'i') });
    expect(await tile.locator('img').getAttribute('srcset')).toMatch(/480w/);
    await screenshot(page, 'buying-grid-photos-phone');
    // The home page features one open run with photos; other suites open runs with photos too, so it may be theirs.
    await page.goto(`${site.baseUrl}/`);
    const featured = page.locator('img.photo').first();
    await featured.waitFor();
    expect(await featured.getAttribute('alt')).toMatch(/\S/);
    expect(await featured.getAttribute('srcset')).toMatch(/ 480w, .+ \d+w$/);
    await screenshot(page, 'buying-home-photo-phone');
    await ctx.close();

    const desk = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const dpage = await desk.newPage();
    await dpage.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    const dgallery = dpage.getByRole('group', { name: /^Photos of / });
    await dgallery.getByRole('button', { name: 'Next photo' }).click();
    await dgallery.getByText('Photo 2 of 2').waitFor();
    await dpage
      .getByRole('list', { name: 'Choose a photo' })
      .getByRole('button', { name: /^Photo 1: Navy tee/ })
      .click();
    await dgallery.getByText('Photo 1 of 2').waitFor();
    await dgallery.focus();
    await dpage.keyboard.press('ArrowRight');
    await dgallery.getByText('Photo 2 of 2').waitFor();
    expect(await dpage.getByRole('button', { name: /^Photo 2: / }).getAttribute('aria-current')).toBe('true');
    await screenshot(dpage, 'buying-product-gallery-desktop');
    await desk.close();
  });
});

describe('checkout details on a phone', () => {
  it('prices each shipping method, counts the cart, stores the postal code normalised, wraps a long e-mail, shows the whole address and offers the last address again', async () => {
    const shirt = await openShirt(staff, { cap: 20 });
    const fan = await createUser(t.deps.db, ['fan'], 'Marguerite Oyelaran-Fitzwilliam');
    const longEmail = `marguerite.oyelaran-fitzwilliam.launch-crew-${shirt.slug.slice(-6)}@padside.test`;
    const ctx = await phone();
    const page = await ctx.newPage();
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    await page.getByRole('radio', { name: /^L\b/ }).click();
    await page.getByRole('button', { name: 'Add to cart' }).click();
    await page.getByRole('dialog', { name: 'Your cart' }).getByRole('button', { name: 'Close the cart' }).click();
    await page.getByRole('link', { name: 'Cart, 1 item' }).waitFor();
    expect(await page.getByTestId('cart-count').textContent()).toBe('1');
    await screenshot(page, 'buying-cart-count-phone');

    await page.goto(`${site.baseUrl}/shop/checkout`);
    await page.getByLabel('E-mail').fill(longEmail);
    await page.getByRole('button', { name: 'Next: shipping' }).click();
    // 220 g (size L) fits the first bracket of mail within Canada, $9.00 (the shop's default brackets); pickup is free.
    await page.getByRole('radio', { name: 'Mail within Canada · $9.00' }).waitFor();
    await page.getByRole('radio', { name: /Pick up .*· free/i }).waitFor();
    const labels = await page
      .getByRole('radiogroup', { name: 'Shipping method' })
      .getByRole('radio')
      .evaluateAll((els) => els.map((e) => e.closest('mat-radio-button')?.textContent?.trim() ?? ''));
    expect(labels.length).toBeGreaterThan(1);
    for (const l of labels) expect(l).toMatch(/· (\$\d+\.\d\d|free|from \$\d+\.\d\d)$/);
    await screenshot(page, 'buying-shipping-prices-phone');
    await page.getByRole('radio', { name: /Mail within Canada/ }).check();
    await page.getByLabel('Address', { exact: true }).fill('88 Igniter Crescent');
    await page.getByLabel('Address line 2 (optional)').fill('Unit 4');
    await page.getByLabel('City').fill('Gopher Flats');
    await page.getByLabel('Postal code').fill('r0k1a0');
    await page.getByRole('button', { name: 'Next: payment' }).click();
    await page.getByRole('radio', { name: 'Test Visa (pays)' }).check();
    await page.getByRole('button', { name: 'Next: review' }).click();

    const review = page.locator('dl.review');
    await review.waitFor();
    for (const line of ['88 Igniter Crescent', 'Unit 4', 'Gopher Flats MB R0K 1A0', 'Canada'])
      await review.getByText(line, { exact: true }).waitFor();
    const email = review.getByText(longEmail);
    const right = await email.evaluate((el) => el.getBoundingClientRect().right);
    expect(right).toBeLessThanOrEqual(390);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await screenshot(page, 'buying-review-long-email-phone');
    await page.getByRole('button', { name: 'Place order' }).click();
    await page.getByRole('heading', { name: 'Thank you, your order is in' }).waitFor({ timeout: 15_000 });
    const order = await t.deps.db('shop_orders').where('email', longEmail).first();
    expect(order.ship_postal_code).toBe('R0K 1A0');

    // The next checkout offers that address again.
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    await page.getByRole('radio', { name: /^M\b/ }).click();
    await page.getByRole('button', { name: 'Add to cart' }).click();
    await page.getByRole('dialog', { name: 'Your cart' }).getByRole('link', { name: 'Check out' }).click();
    await page.getByRole('button', { name: 'Next: shipping' }).click();
    await page.getByText('88 Igniter Crescent, Gopher Flats MB R0K 1A0').waitFor();
    await page.getByRole('button', { name: 'Use my last address' }).click();
    expect(await page.getByLabel('Address', { exact: true }).inputValue()).toBe('88 Igniter Crescent');
    expect(await page.getByLabel('Postal code').inputValue()).toBe('R0K 1A0');
    await screenshot(page, 'buying-last-address-phone');
    await ctx.close();
  });
});

describe('what happens next', () => {
  it('the confirmation page and the receipt say when the run closes and goes to the printer, and where a pickup is handed out', async () => {
    const shirt = await openShirt(staff, { cap: 20 });
    const run = await t.deps.db('shop_runs').where('id', shirt.run.id).first();
    const fan = await createUser(t.deps.db, ['fan'], 'Ines Valcourt');
    const ctx = await phone();
    const page = await ctx.newPage();
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.goto(`${site.baseUrl}/shop/p/${shirt.slug}`);
    await page.getByRole('radio', { name: /^L\b/ }).click();
    await page.getByRole('button', { name: 'Add to cart' }).click();
    await page.getByRole('dialog', { name: 'Your cart' }).getByRole('link', { name: 'Check out' }).click();
    await page.getByRole('button', { name: 'Next: shipping' }).click();
    await page.getByRole('radio', { name: /Pick up/i }).check();
    await page.getByRole('button', { name: 'Next: payment' }).click();
    await page.getByRole('radio', { name: 'Test Visa (pays)' }).check();
    await page.getByRole('button', { name: 'Next: review' }).click();
    await page.getByRole('button', { name: 'Place order' }).click();
    await page.getByRole('heading', { name: 'Thank you, your order is in' }).waitFor({ timeout: 15_000 });
    const number = (await page
      .getByRole('status')
      .filter({ hasText: 'Order' })
      .locator('strong')
      .first()
      .textContent())!.trim();

    // The club format of every date people read (contracts/dates/club-dates.ts), to the minute, in club time.
    const closes = formatDateTime(new Date(run.closes_at), t.config.clubTimeZone);
    const next = page.getByRole('region', { name: 'What happens next' });
    await next.getByText(new RegExp(`${run.name} takes orders until ${closes}`)).waitFor();
    await next.getByText(/goes to the printer after that/).waitFor();
    await next
      .getByText(`handed out at the merch table at the next ${t.config.site.clubName} launch`, { exact: false })
      .waitFor();
    await screenshot(page, 'buying-what-happens-next-phone');
    await ctx.close();

    const [mail] = await waitForEmails(fan.email, new RegExp(`order ${number}`), 1, 15_000);
    expect(mail.text).toContain('What happens next:');
    expect(mail.text).toContain(`${run.name} takes orders until ${closes}`);
    expect(mail.text).toContain(`handed out at the merch table at the next ${t.config.site.clubName} launch`);
  });
});
