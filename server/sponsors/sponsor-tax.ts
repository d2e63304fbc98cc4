import { computeTaxes, type Province, type TaxLine, type TaxRate } from '../shop/tax';

/** How an agreement is taxed: promotion bought (a taxable supply) or a gift with nothing in return (no tax). */
export const TAX_TREATMENTS = ['promotion', 'gift'] as const;
export type TaxTreatment = (typeof TAX_TREATMENTS)[number];

/**
 * GST/HST on a sponsorship that buys promotion, at the rate of the sponsor's province on `date` (CRA guidance on
 * sponsorship, from memory: the treasurer confirms). Only GST/HST: provincial sales taxes are left out, as the
 * promotion is a service Padside does not sort by province rules. A gift, or a team not registered, charges none.
 */
export function sponsorshipTaxes(input: { treatment: TaxTreatment; province: Province | null; cashCents: number; date: string }, rates: TaxRate[], gstHstRegistered: boolean): TaxLine[] {
  if (input.treatment !== 'promotion' || !input.province || input.cashCents <= 0) return [];
  return computeTaxes({ goodsCents: input.cashCents, shippingCents: 0, province: input.province, date: input.date }, rates, { gstHstRegistered, provincialRegistrations: [], provincialTaxOnShipping: {} });
}
