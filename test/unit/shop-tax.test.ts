import {
  computeTaxes,
  formatRate,
  rateUnits,
  taxOn,
  type Province,
  type TaxRate,
  type TaxRules,
} from '../../server/shop/tax';

// The rate table as the migration seeds it; each value is checked against its source below.
const CRA = 'CRA rate page';
const RATES: TaxRate[] = [
  ...(['AB', 'NT', 'NU', 'YT', 'BC', 'MB', 'QC', 'SK'] as Province[]).map((p) => ({
    jurisdiction: p,
    code: 'GST' as const,
    ratePercent: '5.0000',
    effectiveFrom: '2008-01-01',
  })),
  { jurisdiction: 'ON', code: 'HST', ratePercent: '13.0000', effectiveFrom: '2010-07-01' },
  { jurisdiction: 'NB', code: 'HST', ratePercent: '15.0000', effectiveFrom: '2016-07-01' },
  { jurisdiction: 'NL', code: 'HST', ratePercent: '15.0000', effectiveFrom: '2016-07-01' },
  { jurisdiction: 'PE', code: 'HST', ratePercent: '15.0000', effectiveFrom: '2016-10-01' },
  { jurisdiction: 'NS', code: 'HST', ratePercent: '15.0000', effectiveFrom: '2010-07-01' },
  { jurisdiction: 'NS', code: 'HST', ratePercent: '14.0000', effectiveFrom: '2025-04-01' },
  { jurisdiction: 'BC', code: 'PST', ratePercent: '7.0000', effectiveFrom: '2013-04-01' },
  { jurisdiction: 'MB', code: 'RST', ratePercent: '8.0000', effectiveFrom: '2013-07-01' },
  { jurisdiction: 'MB', code: 'RST', ratePercent: '7.0000', effectiveFrom: '2019-07-01' },
  { jurisdiction: 'QC', code: 'QST', ratePercent: '9.9750', effectiveFrom: '2013-01-01' },
  { jurisdiction: 'SK', code: 'PST', ratePercent: '6.0000', effectiveFrom: '2017-03-23' },
];

/** A seller registered for everything, no provincial tax on shipping: shows each province's published rates. */
const ALL: TaxRules = {
  gstHstRegistered: true,
  provincialRegistrations: ['BC', 'MB', 'QC', 'SK'],
  provincialTaxOnShipping: {},
};
const on = (province: Province, goodsCents: number, date = '2026-06-01', shippingCents = 0, rules = ALL) =>
  computeTaxes({ goodsCents, shippingCents, province, date }, RATES, rules);
const summary = (lines: ReturnType<typeof on>) => lines.map((l) => `${l.code} ${l.ratePercent}% ${l.amountCents}`);

describe('sales tax on C$100.00 of goods, by province and territory (2026)', () => {
  it.each([
    ['AB', ['GST 5% 500'], `${CRA}: AB 5% GST`],
    ['NT', ['GST 5% 500'], `${CRA}: NT 5% GST`],
    ['NU', ['GST 5% 500'], `${CRA}: NU 5% GST`],
    ['YT', ['GST 5% 500'], `${CRA}: YT 5% GST`],
    [
      'BC',
      ['GST 5% 500', 'PST 7% 700'],
      'CRA rate page (GST); Government of British Columbia, "B.C. provincial sales tax (PST)" 7%',
    ],
    ['MB', ['GST 5% 500', 'RST 7% 700'], 'CRA rate page (GST); Manitoba Finance, "Retail Sales Tax" 7%'],
    ['SK', ['GST 5% 500', 'PST 6% 600'], 'CRA rate page (GST); Government of Saskatchewan, "Provincial Sales Tax" 6%'],
    ['QC', ['GST 5% 500', 'QST 9.975% 998'], 'Revenu Québec worked example: C$100 -> GST C$5.00 + QST C$9.98'],
    ['ON', ['HST 13% 1300'], `${CRA}: ON 13% HST`],
    ['NB', ['HST 15% 1500'], 'CRA rate page, previous-rates table: NB 15% from 2016-07-01'],
    ['NL', ['HST 15% 1500'], 'CRA rate page, previous-rates table: NL 15% from 2016-07-01'],
    ['PE', ['HST 15% 1500'], `${CRA}: PE 15% from 2016-10-01`],
    ['NS', ['HST 14% 1400'], 'Canada Gazette II, SOR/2025-77: NS 14% from 2025-04-01'],
  ] as [Province, string[], string][])('%s', (province, expected, _source) => {
    expect(summary(on(province, 10000))).toEqual(expected);
  });
});

describe('Nova Scotia on both sides of 2025-04-01 (CRA GST/HST Notice 342 [2nd]: C$100 -> C$15.00, then C$14.00)', () => {
  it('charges 15% on 2025-03-31', () => expect(summary(on('NS', 10000, '2025-03-31'))).toEqual(['HST 15% 1500']));
  it('charges 14% on 2025-04-01', () => expect(summary(on('NS', 10000, '2025-04-01'))).toEqual(['HST 14% 1400']));
});

describe('Manitoba RST on both sides of 2019-07-01 (Manitoba Finance, from memory: 8% until 2019-06-30, 7% from 2019-07-01)', () => {
  it('charges RST 8% on 2019-06-30', () =>
    expect(summary(on('MB', 10000, '2019-06-30'))).toEqual(['GST 5% 500', 'RST 8% 800']));
  it('charges RST 7% on 2019-07-01', () =>
    expect(summary(on('MB', 10000, '2019-07-01'))).toEqual(['GST 5% 500', 'RST 7% 700']));
});

describe('registrations', () => {
  it('charges no GST/HST for an unregistered small supplier (Revenu Québec, "Details Concerning Small Suppliers")', () => {
    expect(on('ON', 10000, '2026-06-01', 0, { ...ALL, gstHstRegistered: false })).toEqual([]);
  });
  it('charges only GST in B.C. when the seller is not registered for B.C. PST (the demo seller: MB only)', () => {
    expect(summary(on('BC', 10000, '2026-06-01', 0, { ...ALL, provincialRegistrations: ['MB'] }))).toEqual([
      'GST 5% 500',
    ]);
  });
});

describe('shipping', () => {
  it('taxes shipping with the goods for GST/HST (CRA interpretations: shipping is part of the single supply)', () => {
    expect(summary(on('ON', 10000, '2026-06-01', 1000))).toEqual(['HST 13% 1430']);
  });
  it('adds shipping to the provincial base only where the province setting says so (each province its own rule)', () => {
    expect(summary(on('MB', 10000, '2026-06-01', 1000))).toEqual(['GST 5% 550', 'RST 7% 700']);
    expect(summary(on('MB', 10000, '2026-06-01', 1000, { ...ALL, provincialTaxOnShipping: { MB: true } }))).toEqual([
      'GST 5% 550',
      'RST 7% 770',
    ]);
  });
  it('charges no Canadian tax outside Canada (the issue’s rule; exports zero-rated: from memory)', () => {
    expect(
      computeTaxes({ goodsCents: 10000, shippingCents: 2000, province: null, date: '2026-06-01' }, RATES, ALL),
    ).toEqual([]);
  });
});

describe('rounding half-up at the cent, in integers (common practice, no source)', () => {
  it('rounds 0.5 cent up and 0.49 down', () => {
    expect(taxOn(10, '5')).toBe(1); // 0.50 cent -> 1
    expect(taxOn(9, '5')).toBe(0); // 0.45 cent -> 0
    expect(taxOn(1990, '9.975')).toBe(199); // 198.5025 -> 199
    expect(taxOn(1000, '9.975')).toBe(100); // 99.75 -> 100
  });
  it('reads and writes exact decimal rates', () => {
    expect(rateUnits('9.975')).toBe(99750);
    expect(rateUnits('14.0000')).toBe(140000);
    expect(formatRate('9.9750')).toBe('9.975');
    expect(() => rateUnits('1e2')).toThrow();
  });
});
