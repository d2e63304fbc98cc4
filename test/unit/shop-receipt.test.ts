import { receiptFor, type ReceiptInput } from '../../server/shop/receipt';

// Input Tax Credit Information (GST/HST) Regulations, amended 2021 (from memory): thresholds C$100 and C$500.
const seller = { name: 'Demo Seller', gstHstNumber: '000000000 RT0001', provincialTaxNumbers: { MB: '000000-0' } };
const input = (totalCents: number): ReceiptInput => ({
  date: '2026-06-01',
  totalCents,
  taxes: [
    { code: 'GST', jurisdiction: 'MB', ratePercent: '5.0000', amountCents: 1 },
    { code: 'RST', jurisdiction: 'MB', ratePercent: '7.0000', amountCents: 1 },
  ],
  buyerName: 'A Buyer',
  items: [{ description: 'Shirt (M)', quantity: 1, lineCents: totalCents }],
  paymentTerms: 'Paid in full by card',
});

describe('receiptFor', () => {
  it('adds the buyer’s name and terms from C$500.00, not at C$499.99', () => {
    expect(receiptFor(input(49_999), seller)).toMatchObject({ buyerName: null, paymentTerms: null });
    expect(receiptFor(input(50_000), seller)).toMatchObject({
      buyerName: 'A Buyer',
      paymentTerms: 'Paid in full by card',
    });
  });

  it('prints each tax with its rate and the numbers for the taxes charged', () => {
    const r = receiptFor(input(9_999), seller);
    expect(r.taxes.map((x) => x.label)).toEqual(['GST 5%', 'RST 7%']);
    expect(r.gstHstNumber).toBe('000000000 RT0001');
    expect(r.provincialTaxNumbers).toEqual([{ code: 'RST', jurisdiction: 'MB', number: '000000-0' }]);
  });

  it('flags a missing GST/HST number from C$100.00, not below', () => {
    const none = { ...seller, gstHstNumber: '' };
    expect(receiptFor(input(9_999), none).missing).toEqual([]);
    expect(receiptFor(input(10_000), none).missing).toEqual(['gstHstNumber']);
  });

  it('prints no GST/HST number on an order without GST/HST (outside Canada)', () => {
    expect(receiptFor({ ...input(20_000), taxes: [] }, seller)).toMatchObject({
      gstHstNumber: null,
      provincialTaxNumbers: [],
    });
  });
});
