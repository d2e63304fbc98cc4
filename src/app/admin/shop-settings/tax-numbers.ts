/** Provinces with their own sales tax (the others are GST or HST only). */
export const OWN_TAX = ['BC', 'MB', 'QC', 'SK'] as const;
export type OwnTaxProvince = (typeof OWN_TAX)[number];

/** The form's one field per province, as the API's record: blank numbers are left out. */
export function taxNumbersFromForm(fields: Record<OwnTaxProvince, string>): Record<string, string> {
  return Object.fromEntries(OWN_TAX.map((p) => [p, fields[p].trim()] as const).filter(([, n]) => n !== ''));
}

/** The API's field names (`provincialTaxNumbers.MB`) onto the controls that edit them (`taxNumberMB`). */
export const TAX_NUMBER_FIELDS: Record<string, string> = Object.fromEntries(
  OWN_TAX.map((p) => [`provincialTaxNumbers.${p}`, `taxNumber${p}`]),
);
