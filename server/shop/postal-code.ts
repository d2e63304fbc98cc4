import type { Province } from './tax';

/**
 * The first letter of a Canadian postal code names its province or territory (Canada Post, from memory). Tax
 * depends on the province, so a code from elsewhere means the address is wrong somewhere.
 */
const FIRST_LETTERS: Record<Province, string> = {
  NL: 'A',
  NS: 'B',
  PE: 'C',
  NB: 'E',
  QC: 'GHJ',
  ON: 'KLMNP',
  MB: 'R',
  SK: 'S',
  AB: 'T',
  BC: 'V',
  NT: 'X',
  NU: 'X',
  YT: 'Y',
};

/** Whether a postal code's first letter belongs to the province; case and spaces do not matter. */
export function postalCodeFitsProvince(postalCode: string, province: Province): boolean {
  const first = postalCode.trim().charAt(0).toUpperCase();
  return first !== '' && FIRST_LETTERS[province].includes(first);
}

/** The first letters that a province's postal codes start with, for the error message. */
export function postalLettersOf(province: Province): string[] {
  return FIRST_LETTERS[province].split('');
}
