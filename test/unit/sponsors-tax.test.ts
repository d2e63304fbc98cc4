import type { TaxRate } from '../../server/shop/tax';
import { sponsorshipTaxes } from '../../server/sponsors/sponsor-tax';

const RATES: TaxRate[] = [
  { jurisdiction: 'MB', code: 'GST', ratePercent: '5.0000', effectiveFrom: '2008-01-01' },
  { jurisdiction: 'MB', code: 'RST', ratePercent: '7.0000', effectiveFrom: '2019-07-01' },
  { jurisdiction: 'NS', code: 'HST', ratePercent: '15.0000', effectiveFrom: '2010-07-01' },
  { jurisdiction: 'NS', code: 'HST', ratePercent: '14.0000', effectiveFrom: '2025-04-01' },
];
const taxes = (treatment: 'promotion' | 'gift', province: 'MB' | 'NS', date = '2026-06-01', registered = true) =>
  sponsorshipTaxes({ treatment, province, cashCents: 100_000, date }, RATES, registered).map(
    (l) => `${l.code} ${l.ratePercent}% ${l.amountCents}`,
  );

describe('sponsorshipTaxes (CRA guidance on sponsorship, from memory: promotion bought is a taxable supply)', () => {
  it('charges the sponsor province’s GST or HST on promotion, never a provincial tax', () => {
    expect(taxes('promotion', 'MB')).toEqual(['GST 5% 5000']); // CRA rate page: 5%
    expect(taxes('promotion', 'NS')).toEqual(['HST 14% 14000']); // Canada Gazette II, SOR/2025-77: NS 14%
  });
  it('uses the rate of the day (CRA GST/HST Notice 342 [2nd]: NS 15% until 2025-03-31)', () => {
    expect(taxes('promotion', 'NS', '2025-03-31')).toEqual(['HST 15% 15000']);
  });
  it('charges nothing on a gift or for a team not registered (small supplier)', () => {
    expect(taxes('gift', 'MB')).toEqual([]);
    expect(taxes('promotion', 'MB', '2026-06-01', false)).toEqual([]);
  });
});
