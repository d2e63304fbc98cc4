import { DEMO_SELLER } from '../../seeds/02_shop';
import { dateInZone } from '../../server/platform/clock';
import { waitForEmails } from '../helpers/maildev';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

// Receipts for input tax credits (Input Tax Credit Information (GST/HST) Regulations, amended 2021, from memory):
// under C$100 the seller's name, date and total; from C$100 the GST/HST number and each tax with its rate; from
// C$500 the buyer's name, the terms of payment and a description of each supply.
let t: TestApp;
let staff: Client;
// The demo seed's invented, format-valid-looking seller details; no real business has them.
const DEMO = DEMO_SELLER;

beforeAll(async () => {
  t = buildTestApp();
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
  // Only the receipt fields change, to the demo seed's values; no other suite reads them.
  const current = (await staff.get('/api/admin/shop/settings')).body.settings;
  const saved = await staff.put('/api/admin/shop/settings', { ...current, ...DEMO });
  expect(saved.status).toBe(200);
});
afterAll(() => t.close());

const buy = async (quantity: number) => {
  const shirt = await openShirt(staff, { cap: 30, priceCents: 3500 });
  const c = new Client(t.app);
  const email = `receipt-${Date.now()}-${quantity}@example.test`;
  const res = await c.post('/api/orders', {
    items: [{ variantId: shirt.variants[0].id, quantity }],
    shipTo: MB_ADDRESS,
    shippingMethodId: await methodId(c, 'canada'),
    email,
    paymentToken: 'tok_visa',
  });
  expect(res.status).toBe(201);
  await t.deps.mail.deliverDue();
  const [mail] = await waitForEmails(email, /Thrust & Filament order PS-/);
  return { order: res.body.order, mail, c };
};

describe('the receipt on GET /api/orders/:id and in the confirmation e-mail', () => {
  it('under C$100: seller, date, total, each tax with its rate and the registration numbers; no buyer name', async () => {
    const { order, mail, c } = await buy(1);
    // 35.00 + 9.00 shipping = 44.00; GST 5% 2.20 (CRA rate page); RST 7% 3.08 (Manitoba Finance); total 49.28.
    expect(order.totalCents).toBe(4928);
    const shown = (await c.get(`/api/orders/${order.id}`)).body.order.receipt;
    expect(shown).toMatchObject({
      sellerName: DEMO.sellerName,
      date: dateInZone(new Date(), 'America/Winnipeg'),
      totalCents: 4928,
      gstHstNumber: '000000000 RT0001',
      provincialTaxNumbers: [{ code: 'RST', jurisdiction: 'MB', number: '000000-0' }],
      buyerName: null,
      paymentTerms: null,
    });
    expect(shown.taxes.map((x: { label: string; amountCents: number }) => [x.label, x.amountCents])).toEqual([
      ['GST 5%', 220],
      ['RST 7%', 308],
    ]);
    expect(mail.text).toContain(`Seller: ${DEMO.sellerName}`);
    expect(mail.text).toContain('GST/HST registration number: 000000000 RT0001');
    expect(mail.text).toContain('RST number (MB): 000000-0');
    expect(mail.text).toContain('GST 5%: $2.20');
    expect(mail.text).not.toContain('Sold to:');
  });

  it('from C$500: also the buyer’s name, the terms of payment and a description of each item', async () => {
    const { order, mail, c } = await buy(15);
    // 15 x 35.00 = 525.00 + 22.00 shipping (3 kg bracket) = 547.00; GST 5% 27.35; RST 7% 38.29; total 612.64.
    expect(order.totalCents).toBe(61264);
    const shown = (await c.get(`/api/orders/${order.id}`)).body.order.receipt;
    expect(shown).toMatchObject({ buyerName: 'Priya Test', paymentTerms: 'Paid in full by card', totalCents: 61264 });
    expect(shown.items).toEqual([
      { description: expect.stringMatching(/^Test shirt .* \(M\), SKU T-/), quantity: 15, lineCents: 52500 },
    ]);
    expect(mail.text).toContain('Sold to: Priya Test');
    expect(mail.text).toContain('Terms: Paid in full by card');
  });
});

describe('PUT /api/admin/shop/settings with receipt details', () => {
  it('refuses a GST/HST number that is not nine digits, RT and four digits, naming the field', async () => {
    const current = (await staff.get('/api/admin/shop/settings')).body.settings;
    const res = await staff.put('/api/admin/shop/settings', { ...current, gstHstNumber: '12345' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['gstHstNumber']);
  });
});
