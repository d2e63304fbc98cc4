import { normalisePostalCode } from '../../contracts/shop/postal-code';

describe('normalisePostalCode', () => {
  // Canada Post addressing guidelines: the postal code is six characters, A9A 9A9, one space between the halves (from memory).
  it.each([
    ['m5b2h1', 'M5B 2H1'],
    [' M5B  2H1 ', 'M5B 2H1'],
    ['r0k-1a0', 'R0K 1A0'],
    ['R0K 1A0', 'R0K 1A0'],
  ])('writes the Canadian code %j as %j', (typed, stored) => {
    expect(normalisePostalCode('CA', typed)).toBe(stored);
  });

  it('leaves a Canadian code of the wrong length for the validator to refuse, upper-cased', () => {
    expect(normalisePostalCode('ca', 'm5b2h')).toBe('M5B2H');
  });

  it('trims other countries’ codes and makes inner spaces single', () => {
    expect(normalisePostalCode('US', ' 58501-1234 ')).toBe('58501-1234');
    expect(normalisePostalCode('GB', 'sw1a   1aa')).toBe('SW1A 1AA');
  });
});
