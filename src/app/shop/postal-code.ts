/** A Canadian postal code as it is printed (`r0k1a0` -> `R0K 1A0`); the server stores it the same way. */
export function tidyPostalCode(country: string, code: string): string {
  const trimmed = code.trim().toUpperCase();
  if (country !== 'CA') return trimmed.replace(/\s+/g, ' ');
  const compact = trimmed.replace(/[\s-]+/g, '');
  return compact.length === 6 ? `${compact.slice(0, 3)} ${compact.slice(3)}` : trimmed;
}
