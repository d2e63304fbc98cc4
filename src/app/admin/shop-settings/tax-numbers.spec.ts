import { TAX_NUMBER_FIELDS, taxNumbersFromForm } from './tax-numbers';

describe('taxNumbersFromForm', () => {
  it('should keep the numbers entered, trimmed, and leave blank provinces out', () => {
    expect(taxNumbersFromForm({ BC: '', MB: ' 000000-0 ', QC: '', SK: '   ' })).toEqual({ MB: '000000-0' });
  });
});

describe('TAX_NUMBER_FIELDS', () => {
  it('should map a server field error onto the control of its province', () => {
    expect(TAX_NUMBER_FIELDS['provincialTaxNumbers.QC']).toBe('taxNumberQC');
  });
});
