import { postalCodeFitsProvince, postalLettersOf } from '../../server/shop/postal-code';
import type { Province } from '../../server/shop/tax';

// First letter of a Canadian postal code by province or territory (Canada Post, from memory):
// A NL, B NS, C PE, E NB, G H J QC, K L M N P ON, R MB, S SK, T AB, V BC, X NT and NU, Y YT.
const CANADA_POST: [Province, string][] = [
  ['NL', 'A'],
  ['NS', 'B'],
  ['PE', 'C'],
  ['NB', 'E'],
  ['QC', 'GHJ'],
  ['ON', 'KLMNP'],
  ['MB', 'R'],
  ['SK', 'S'],
  ['AB', 'T'],
  ['BC', 'V'],
  ['NT', 'X'],
  ['NU', 'X'],
  ['YT', 'Y'],
];
const LETTERS = 'ABCEGHJKLMNPRSTVXY';

describe('postalCodeFitsProvince (Canada Post first letters, from memory)', () => {
  it.each(CANADA_POST)('%s takes exactly the codes starting with %s', (province, letters) => {
    for (const l of LETTERS)
      expect([l, postalCodeFitsProvince(`${l}0A 0A0`, province)]).toEqual([l, letters.includes(l)]);
    expect(postalLettersOf(province).join('')).toBe(letters);
  });

  it('ignores case and leading spaces, and refuses an empty code', () => {
    expect(postalCodeFitsProvince(' r0k 1a0', 'MB')).toBe(true);
    expect(postalCodeFitsProvince('', 'MB')).toBe(false);
  });
});
