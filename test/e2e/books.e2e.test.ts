import type { Browser } from 'playwright-core';
import { recordMovement } from '../../server/books/ledger-writer';
import { browserSuite, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';

// January 2034: no other suite records money then, so the page shows this file's figures alone.
let t: TestApp;
let browser: Browser;
let site: Site;

browserSuite({}, async (s) => {
  ({ t, site, browser } = s);
  await t.deps
    .db('money_movements')
    .where('occurred_at', '>=', '2034-01-01')
    .andWhere('occurred_at', '<', '2034-02-02')
    .delete();
  // C$100 to Manitoba + GST 5% 5.00 + RST 7% 7.00 (CRA rate page; Manitoba Finance) = C$112.00.
  await t.deps.db.transaction((trx) =>
    recordMovement(trx, {
      occurredAt: new Date('2034-01-15T18:00:00Z'),
      kind: 'order_payment',
      source: 'merch',
      reference: 'E2E-BOOKS',
      counterparty: 'Browser Buyer',
      grossCents: 11200,
      method: 'card',
      taxes: [
        { code: 'GST', jurisdiction: 'MB', ratePercent: '5', taxableCents: 10000, taxCents: 500 },
        { code: 'RST', jurisdiction: 'MB', ratePercent: '7', taxableCents: 10000, taxCents: 700 },
      ],
    }),
  );
});

describe('the treasurer’s books in a browser', () => {
  it('shows tax per authority with the input-tax-credit note, and income net of tax', async () => {
    const treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Tamsin Ledger');
    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, treasurer.email, treasurer.password);
    await page.goto(`${site.baseUrl}/console/books`);
    await page.getByRole('heading', { name: 'Books' }).waitFor();
    await page.getByLabel('From', { exact: true }).fill('2034-01-01');
    await page.getByLabel('To (inclusive)').fill('2034-01-31');
    await page.getByRole('button', { name: 'Show period' }).click();
    await page.getByRole('heading', { name: 'Canada Revenue Agency' }).waitFor();
    await page.getByRole('heading', { name: 'Manitoba Finance' }).waitFor();
    await page.getByText(/Input tax credits .* are not in Padside/).waitFor();
    const income = page.getByRole('table', { name: 'Income by month and source' });
    await income.getByRole('columnheader', { name: 'Income net of tax' }).waitFor();
    // Gross C$112.00, tax C$12.00, income C$100.00.
    await income.getByRole('row', { name: /Jan 2034 Merch \$112\.00 \$12\.00 \$100\.00/ }).waitFor();
    await screenshot(page, 'books-tax-per-authority');
    await page.close();
  });

  it('sets a sponsor agreement to promotion on the sponsor page and offers its invoice', async () => {
    const treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Tamsin Ledger');
    const api = new Client(t.app);
    await api.signIn(treasurer);
    const sponsor = await api.post('/api/admin/sponsors', {
      name: `Browser Promo Supply ${Date.now()}`,
      website: 'https://example.test',
      blurb: 'Invented for a test.',
    });
    const agreement = await api.post(`/api/admin/sponsors/${sponsor.body.id}/agreements`, {
      season: '2034',
      cashCents: 50_000,
      deliverables: [{ kind: 'video_mention', quantity: 1, dueOn: '2034-09-30' }],
    });
    expect(agreement.status).toBe(201);

    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, treasurer.email, treasurer.password);
    await page.goto(`${site.baseUrl}/console/sponsors/${sponsor.body.id}`);
    await page.getByText('Tax treatment: gift, no tax').waitFor();
    const form = page.getByRole('form', { name: 'Tax treatment for season 2034' });
    await form.getByRole('combobox', { name: 'Tax treatment' }).click();
    await page.getByRole('option', { name: 'Promotion bought (taxed)' }).click();
    await form.getByRole('combobox', { name: "Sponsor's province" }).click();
    await page.getByRole('option', { name: 'ON', exact: true }).click();
    await form.getByRole('button', { name: 'Save tax treatment' }).click();
    await page.getByText('Tax treatment: promotion, GST/HST at the rate for ON').waitFor();
    await page.getByRole('link', { name: 'Download the invoice (PDF)' }).waitFor();
    await screenshot(page, 'sponsor-tax-treatment');
    expect((await t.deps.db('sponsor_agreements').where('id', agreement.body.id).first()).tax_treatment).toBe(
      'promotion',
    );
    await page.close();
  });
});
