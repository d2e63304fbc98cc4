/** How a sponsorship agreement is taxed: promotion bought (a taxable supply) or a gift with nothing in return (no tax). */
export const TAX_TREATMENTS = ['promotion', 'gift'] as const;
export type TaxTreatment = (typeof TAX_TREATMENTS)[number];
