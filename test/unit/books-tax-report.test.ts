import { incomeRows, incomeTotals } from '../../server/books/income';
import { authorityOf, byAuthority, reportLines, unregisteredProvinceNotes } from '../../server/books/tax-report';

describe('authorityOf', () => {
  it('sends GST and HST to the federal agency and RST, PST, QST to their province (the issue; CRA administers GST/HST)', () => {
    expect(authorityOf('GST', 'MB').authority).toBe('CA');
    expect(authorityOf('HST', 'ON')).toEqual({ authority: 'CA', name: 'Canada Revenue Agency' });
    expect(authorityOf('RST', 'MB')).toEqual({ authority: 'MB', name: 'Manitoba Finance' });
    expect(authorityOf('QST', 'QC').authority).toBe('QC');
  });
});

describe('reportLines and byAuthority', () => {
  // C$100 to Manitoba at GST 5% + RST 7% (CRA rate page; Manitoba Finance), then C$50 of it refunded with its tax.
  const collected = [
    { code: 'GST', jurisdiction: 'MB', taxableCents: 10000, taxCents: 500 },
    { code: 'RST', jurisdiction: 'MB', taxableCents: 10000, taxCents: 700 },
    { code: 'HST', jurisdiction: 'ON', taxableCents: 10000, taxCents: 1300 }, // CRA rate page: ON 13%
  ];
  const refunded = [
    { code: 'GST', jurisdiction: 'MB', taxableCents: 5000, taxCents: 250 },
    { code: 'RST', jurisdiction: 'MB', taxableCents: 5000, taxCents: 350 },
  ];

  it('nets taxable sales and tax of refunds, per tax and jurisdiction', () => {
    expect(reportLines(collected, refunded)).toEqual([
      { code: 'GST', jurisdiction: 'MB', taxableCents: 5000, taxCents: 500, refundedCents: 250, netCents: 250 },
      { code: 'HST', jurisdiction: 'ON', taxableCents: 10000, taxCents: 1300, refundedCents: 0, netCents: 1300 },
      { code: 'RST', jurisdiction: 'MB', taxableCents: 5000, taxCents: 700, refundedCents: 350, netCents: 350 },
    ]);
  });

  it('never adds two authorities together: GST and HST to the federal agency, RST to Manitoba', () => {
    const blocks = byAuthority(reportLines(collected, refunded));
    expect(blocks.map((b) => [b.authority, b.lines.map((l) => l.code), b.totals.netCents])).toEqual([
      ['CA', ['GST', 'HST'], 1550],
      ['MB', ['RST'], 350],
    ]);
  });

  it('keeps a refund in a period with no sale as a negative line', () => {
    expect(reportLines([], refunded.slice(0, 1))).toEqual([
      { code: 'GST', jurisdiction: 'MB', taxableCents: -5000, taxCents: 0, refundedCents: 250, netCents: -250 },
    ]);
  });
});

describe('unregisteredProvinceNotes', () => {
  it('notes sales into a province with its own sales tax the seller does not collect, not elsewhere', () => {
    const notes = unregisteredProvinceNotes(
      [
        { province: 'MB', orders: 3, salesCents: 9000 },
        { province: 'BC', orders: 1, salesCents: 3200 },
        { province: 'ON', orders: 2, salesCents: 6400 },
      ],
      ['MB'],
    );
    expect(notes.map((n) => [n.province, n.tax, n.salesCents])).toEqual([['BC', 'PST', 3200]]);
    expect(notes[0].threshold).toMatch(/from memory/);
  });
});

describe('incomeRows', () => {
  it('takes tax out of income and out of refunds (common practice, no source: tax collected is a liability)', () => {
    // C$112.00 received = C$100 + GST 5.00 + RST 7.00; C$56.00 refunded with 2.50 + 3.50 of tax; fee 3.55.
    const [row] = incomeRows(
      [{ month: '2019-02', source: 'merch', grossCents: 11200, taxCents: 1200, refundsCents: 5600, feesCents: 355 }],
      [{ month: '2019-02', source: 'merch', taxCents: 600 }],
    );
    expect(row).toMatchObject({
      incomeCents: 10000,
      refundedTaxCents: 600,
      refundsNetCents: 5000,
      netCents: 10000 - 5000 - 355,
    });
    expect(incomeTotals([row, row]).netCents).toBe(2 * 4645);
  });
});
