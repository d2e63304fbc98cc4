import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { browserSuite, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn, type TestUser } from '../helpers/users';
import { MB_ADDRESS, methodId, stockSticker } from '../api/shop-fixtures';

let t: TestApp;
let browser: Browser;
let site: Site;
let admin: Client;
const stamp = Date.now().toString(36);
const year = new Date().getFullYear();
const PHONE = { width: 390, height: 844 };

browserSuite({}, async (s) => {
  ({ t, site, browser } = s);
  admin = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
});

/** A phone-sized page signed in as the user, collecting uncaught errors and console errors. */
async function phonePage(user: TestUser): Promise<{ page: Page; context: BrowserContext; errors: string[] }> {
  const context = await browser.newContext({ viewport: PHONE });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  await signInThroughForm(page, site.baseUrl, user.email, user.password);
  return { page, context, errors };
}

/** Lets running animations (a dialog opening, a ripple) finish, so a screenshot shows the settled screen. */
const settled = (page: Page) =>
  page.evaluate(() => Promise.all(document.getAnimations().map((a) => a.finished.catch(() => undefined))));

/** The elements that stick out past the right edge of the viewport (none when the page does not scroll sideways). */
const overflowing = (page: Page) =>
  page.evaluate(() => {
    if (document.documentElement.scrollWidth <= window.innerWidth) return [];
    const inScroller = (el: Element) => {
      for (let p = el.parentElement; p; p = p.parentElement)
        if (['auto', 'scroll'].includes(getComputedStyle(p).overflowX)) return true;
      return false;
    };
    return [...document.body.querySelectorAll('*')]
      .filter((el) => el.getBoundingClientRect().right > window.innerWidth + 1 && !inScroller(el))
      .slice(0, 5)
      .map((el) => `${el.tagName.toLowerCase()}.${[...el.classList].join('.')}`);
  });

async function sponsorWithPromises(name: string, deliverables: object[]) {
  const created = await admin.post('/api/admin/sponsors', { name: `${name} ${stamp}` });
  expect(created.status).toBe(201);
  expect(
    (
      await admin.post(`/api/admin/sponsors/${created.body.id}/agreements`, {
        season: String(year),
        cashCents: 25_000,
        deliverables,
      })
    ).status,
  ).toBe(201);
  return { id: created.body.id as number, slug: created.body.slug as string, name: `${name} ${stamp}` };
}

describe('the editor on a phone', () => {
  it('sees drafts, scheduled posts and credits due on the overview, in tiles as tall as what they hold', async () => {
    const editor = await createUser(t.deps.db, ['fan', 'editor'], 'Odile Overview');
    const editorApi = new Client(t.app);
    await editorApi.signIn(editor);
    expect(
      (
        await editorApi.post('/api/admin/posts', {
          title: `Draft nose cone ${stamp}`,
          markdown: 'Sanding.',
          status: 'draft',
        })
      ).status,
    ).toBe(201);
    const publishAt = new Date(Date.now() + 5 * 86400_000).toISOString();
    expect(
      (
        await editorApi.post('/api/admin/posts', {
          title: `Scheduled fins ${stamp}`,
          markdown: 'Gluing.',
          status: 'scheduled',
          publishAt,
        })
      ).status,
    ).toBe(201);
    await sponsorWithPromises('Latecredit Gizmos', [
      { kind: 'build_log_credit', quantity: 1, dueOn: `${year - 1}-12-31` },
    ]);

    const { page, context, errors } = await phonePage(editor);
    await page.goto(`${site.baseUrl}/console`);
    await page.getByRole('heading', { name: 'Your build logs and credits' }).waitFor();
    const drafts = page.getByTestId('tile-drafts');
    await drafts.getByText(`Draft nose cone ${stamp}`).waitFor();
    await page.getByTestId('tile-scheduled').getByText(`Scheduled fins ${stamp}`).waitFor();
    await page
      .getByTestId('tile-credits')
      .getByText(new RegExp(`Latecredit Gizmos ${stamp}: 1 × Build log credit`))
      .waitFor();
    // Each tile's height is its content's plus padding and border, not the tallest tile's in its row.
    const slack = await page.evaluate(() =>
      [...document.querySelectorAll<HTMLElement>('.cards .card')].map((card) => {
        const kids = [...card.children] as HTMLElement[];
        const content = kids[kids.length - 1].getBoundingClientRect().bottom - kids[0].getBoundingClientRect().top;
        const style = getComputedStyle(card);
        const frame = ['paddingTop', 'paddingBottom', 'borderTopWidth', 'borderBottomWidth'].reduce(
          (n, k) => n + parseFloat(style[k as 'paddingTop']),
          0,
        );
        return Math.round(card.getBoundingClientRect().height - content - frame);
      }),
    );
    expect(slack.every((s) => Math.abs(s) <= 1)).toBe(true);
    expect(await overflowing(page)).toEqual([]);
    await settled(page);
    await screenshot(page, 'console-editor-overview-phone');
    expect(await seriousViolations(page)).toEqual([]);

    await drafts.click();
    await page.getByRole('heading', { name: 'Build logs', exact: true }).waitFor();
    await page.getByRole('link', { name: `Draft nose cone ${stamp}` }).waitFor();
    expect(await page.getByRole('link', { name: `Scheduled fins ${stamp}` }).count()).toBe(0);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('thanks a sponsor from a dialog that inserts the credit line, sees the whole hint, and quotes are styled', async () => {
    const sponsor = await sponsorWithPromises('Dialogue Doodads', [
      { kind: 'build_log_credit', quantity: 3, dueOn: `${year + 1}-03-31` },
    ]);
    const editor = await createUser(t.deps.db, ['fan', 'editor'], 'Edda Dialog');
    const { page, context, errors } = await phonePage(editor);
    await page.goto(`${site.baseUrl}/console/posts/new`);
    await page.getByRole('heading', { name: 'New build log' }).waitFor();
    await page.getByRole('textbox', { name: 'Title' }).fill(`Quotes and thanks ${stamp}`);
    await page.getByRole('textbox', { name: 'Markdown' }).fill('> Measure twice, print once.\n\nThen we sanded.\n');

    const hint = page.locator('.markdown-hint');
    await hint.waitFor();
    expect(
      await hint.evaluate((el) => el.scrollWidth <= el.clientWidth && el.scrollHeight <= el.clientHeight + 1),
    ).toBe(true);
    expect(await hint.textContent()).toContain('publishing the post credits that sponsor');

    const preview = page.getByRole('region', { name: 'Preview' });
    const quote = preview.locator('blockquote');
    await quote.waitFor();
    expect(await quote.evaluate((el) => getComputedStyle(el).borderLeftWidth)).toBe('4px');

    await page.getByRole('button', { name: 'Thank a sponsor…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Thank a sponsor' });
    await dialog.getByRole('button', { name: 'Insert thank-you card' }).click();
    await dialog.getByText('Choose the sponsor to thank.').waitFor();
    await dialog.getByLabel('Sponsor').click();
    await page.getByRole('option', { name: sponsor.name }).click();
    // The only open promise is offered and preselected, as the server would pick it.
    await dialog
      .getByRole('radio', {
        name: `${year} build log credits: 0 of 3 delivered, due Mar 31, ${year + 1}`,
        checked: true,
      })
      .waitFor();
    await dialog.getByLabel('Note on the card (optional)').fill('Fin jigs and a spare hand');
    await settled(page);
    await screenshot(page, 'post-editor-credit-dialog-phone');
    expect(await seriousViolations(page)).toEqual([]);
    await dialog.getByRole('button', { name: 'Insert thank-you card' }).click();
    await dialog.waitFor({ state: 'detached' });
    expect(await page.getByRole('textbox', { name: 'Markdown' }).inputValue()).toMatch(
      new RegExp(`\\n%thanks ${sponsor.slug} #[1-9][0-9]* \\| Fin jigs and a spare hand\\n`),
    );
    await preview.getByText(sponsor.name).waitFor();
    await settled(page);
    await screenshot(page, 'post-editor-phone');
    expect(await seriousViolations(page)).toEqual([]);

    await page.getByRole('button', { name: 'Publish now' }).click();
    await page.getByText('Published.').waitFor();
    await page.getByRole('link', { name: 'view the public page' }).click();
    await page.waitForURL(/\/build-logs\/quotes-and-thanks/);
    await page.getByRole('heading', { level: 1, name: `Quotes and thanks ${stamp}` }).waitFor();
    const publicQuote = page.locator('article .body blockquote, .post .body blockquote').first();
    await publicQuote.waitFor();
    expect(await publicQuote.evaluate((el) => getComputedStyle(el).borderLeftWidth)).toBe('4px');
    await settled(page);
    await screenshot(page, 'build-log-quote-phone');
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe('the accounts page on a phone', () => {
  it('filters by role, keeps the roles on one line, asks before granting treasurer, keeps the history and disables an account', async () => {
    const me = await createUser(t.deps.db, ['fan', 'admin'], 'Adaeze Accounts');
    const target = await createUser(t.deps.db, ['fan', 'editor'], `Tamsin Target ${stamp}`);
    await createUser(t.deps.db, ['fan'], `Tamsin Fan ${stamp}`);
    const { page, context, errors } = await phonePage(me);
    await page.goto(`${site.baseUrl}/console/users`);
    await page.getByRole('heading', { name: 'Accounts' }).waitFor();
    await page.getByLabel('Search name or e-mail').fill(`Tamsin`);
    await page.getByLabel('Role', { exact: true }).click();
    await page.getByRole('option', { name: 'editor' }).click();
    const row = page.getByRole('row', { name: new RegExp(`Tamsin Target ${stamp}`) });
    await row.waitFor();
    await page.waitForFunction((s) => !document.body.textContent!.includes(`Tamsin Fan ${s}`), stamp);

    const group = row.getByRole('group', { name: `Roles of Tamsin Target ${stamp}` });
    const oneLine = await group.evaluate((el) => {
      const tops = [...el.querySelectorAll('mat-button-toggle')].map((b) => Math.round(b.getBoundingClientRect().top));
      return new Set(tops).size;
    });
    expect(oneLine).toBe(1);
    expect(await overflowing(page)).toEqual([]);

    // Going back leaves the roles as they were.
    await group.getByRole('button', { name: 'treasurer' }).click();
    const confirm = page.getByRole('dialog', { name: `Make Tamsin Target ${stamp} treasurer?` });
    await confirm.waitFor();
    await settled(page);
    await screenshot(page, 'accounts-confirm-treasurer-phone');
    expect(await seriousViolations(page)).toEqual([]);
    await confirm.getByRole('button', { name: 'Go back' }).click();
    await confirm.waitFor({ state: 'detached' });
    expect((await t.deps.db('users').where('id', target.id).first()).roles).toEqual(['fan', 'editor']);

    await group.getByRole('button', { name: 'treasurer' }).click();
    await confirm.getByRole('button', { name: 'Grant treasurer' }).click();
    await page.getByText(`Roles saved for Tamsin Target ${stamp}.`).waitFor();
    expect((await t.deps.db('users').where('id', target.id).first()).roles.sort()).toEqual([
      'editor',
      'fan',
      'treasurer',
    ]);

    await row.getByRole('button', { name: `Disable the account of Tamsin Target ${stamp}` }).click();
    const disable = page.getByRole('dialog', { name: `Disable Tamsin Target ${stamp}?` });
    await disable.getByRole('button', { name: 'Disable account' }).click();
    await row.getByText('Disabled', { exact: true }).waitFor();
    await row.getByRole('button', { name: `Enable the account of Tamsin Target ${stamp}` }).waitFor();
    expect(
      (await new Client(t.app).post('/api/auth/login', { email: target.email, password: target.password })).status,
    ).toBe(403);

    await row.getByRole('button', { name: `History of Tamsin Target ${stamp}` }).click();
    const history = page.getByRole('dialog', { name: `History of Tamsin Target ${stamp}` });
    await history.getByText('Disabled the account').waitFor();
    await history.getByText('Granted treasurer').waitFor();
    expect(await history.getByText('Adaeze Accounts').count()).toBe(2);
    await settled(page);
    await screenshot(page, 'accounts-history-phone');
    expect(await seriousViolations(page)).toEqual([]);
    await history.getByRole('button', { name: 'Close' }).click();

    // Your own row offers no Disable button.
    await page.getByLabel('Search name or e-mail').fill('Adaeze Accounts');
    await page.getByLabel('Role', { exact: true }).click();
    await page.getByRole('option', { name: 'Any role' }).click();
    const mine = page.getByRole('row', { name: /Adaeze Accounts/ });
    await mine.getByText('Your account').waitFor();
    expect(await mine.getByRole('button', { name: /^Disable the account/ }).count()).toBe(0);
    await settled(page);
    await screenshot(page, 'accounts-phone');
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe('the shop console on a phone', () => {
  it('scrolls the orders table inside its card, not the page', async () => {
    const treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Tove Orders');
    const staffApi = new Client(t.app);
    await staffApi.signIn(treasurer);
    const sticker = await stockSticker(staffApi, 5);
    const buyer = new Client(t.app);
    const email = `orders-card-${stamp}@example.test`;
    expect(
      (
        await buyer.post('/api/orders', {
          items: [{ variantId: sticker.variants[0].id, quantity: 1 }],
          shipTo: MB_ADDRESS,
          shippingMethodId: await methodId(buyer, 'canada'),
          email,
          paymentToken: 'tok_visa',
        })
      ).status,
    ).toBe(201);

    const { page, context, errors } = await phonePage(treasurer);
    await page.goto(`${site.baseUrl}/console/orders`);
    await page.getByRole('heading', { name: 'Orders' }).waitFor();
    const card = page.getByTestId('orders-card');
    await card.waitFor();
    expect(
      await card.evaluate((el) => el.scrollWidth > el.clientWidth && getComputedStyle(el).overflowX === 'auto'),
    ).toBe(true);
    expect(await overflowing(page)).toEqual([]);
    await settled(page);
    await screenshot(page, 'console-orders-phone');
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('sets a product’s per-order limit, with the problem shown beside the field', async () => {
    const treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Tuva Limits');
    const staffApi = new Client(t.app);
    await staffApi.signIn(treasurer);
    const sticker = await stockSticker(staffApi, 5);
    const name = (await staffApi.get(`/api/admin/products`)).body.items.find((p: { id: number }) => p.id === sticker.id)
      .name as string;

    const { page, context, errors } = await phonePage(treasurer);
    await page.goto(`${site.baseUrl}/console/products`);
    await page.getByRole('heading', { name: 'Products' }).waitFor();
    expect(await overflowing(page)).toEqual([]);
    const field = page.getByRole('spinbutton', { name: `Most units per order: ${name}` });
    await field.fill('0');
    await field.press('Enter');
    await page.getByText('Must be at least 1.').waitFor();
    await field.fill('101');
    await field.press('Tab');
    await page.getByText('Must be at most 100.').waitFor();
    await field.fill('4');
    await field.press('Enter');
    await page.getByText(`${name}: at most 4 per order.`).waitFor();
    expect(
      (await staffApi.get('/api/admin/products')).body.items.find((p: { id: number }) => p.id === sticker.id)
        .maxPerOrder,
    ).toBe(4);

    const form = page.getByRole('spinbutton', { name: 'Most units per order', exact: true });
    expect(await form.inputValue()).toBe('20');
    await form.fill('0');
    await page.getByRole('button', { name: 'Create product' }).click();
    await page.getByText('Must be at least 1.').first().waitFor();
    await settled(page);
    await screenshot(page, 'console-products-limit-phone');
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe('the sponsor portal on a phone', () => {
  it('shows a standing listing as delivered and the cash received as the PDF does', async () => {
    const s = await sponsorWithPromises('Listingly Sprockets', [
      { kind: 'sponsors_page', quantity: 1, dueOn: `${year}-01-31` },
    ]);
    const contact = await createUser(t.deps.db, ['fan', 'sponsor'], 'Zoë Ørsted-Nguyễn');
    expect((await admin.post(`/api/admin/sponsors/${s.id}/contacts`, { email: contact.email })).status).toBe(201);
    const { page, context, errors } = await phonePage(contact);
    await page.goto(`${site.baseUrl}/sponsors/portal`);
    await page.getByRole('heading', { name: 'Sponsor portal' }).waitFor();
    await page.getByText('Listed on the sponsors page now').waitFor();
    expect(await page.getByText('Late — we owe you this').count()).toBe(0);
    await page.getByText('Cash received: $0.00 of $250.00 (not received yet)').waitFor();
    expect(await overflowing(page)).toEqual([]);
    await settled(page);
    await screenshot(page, 'sponsor-portal-listing-phone');
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });
});
