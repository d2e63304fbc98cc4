import { computeTaxes, type Province, type TaxLine, type TaxRate } from '../shop/tax';
import { TAX_TREATMENTS, type TaxTreatment } from '../../contracts/sponsors/tax-treatments';

export { TAX_TREATMENTS, type TaxTreatment };

/**
 * GST/HST on a sponsorship that buys promotion, at the rate of the sponsor's province on `date` (CRA guidance on
 * sponsorship, from memory: the treasurer confirms). Only GST/HST: provincial sales taxes are left out, as the
 * promotion is a service Padside does not sort by province rules. A gift, or a team not registered, charges none.
 */
export function sponsorshipTaxes(
  input: { treatment: TaxTreatment; province: Province | null; cashCents: number; date: string },
  rates: TaxRate[],
  gstHstRegistered: boolean,
): TaxLine[] {
  if (input.treatment !== 'promotion' || !input.province || input.cashCents <= 0) return [];
  return computeTaxes(
    { goodsCents: input.cashCents, shippingCents: 0, province: input.province, date: input.date },
    rates,
    { gstHstRegistered, provincialRegistrations: [], provincialTaxOnShipping: {} },
  );
}
