/**
 * A postal code as Padside stores it: Canadian codes upper-case with one space (`m5b2h1` -> `M5B 2H1`), the format
 * Canada Post prints; other countries' codes trimmed and upper-cased with runs of spaces made single. The checkout
 * tidies the field with it as the buyer leaves it; the quote body stores what it gives.
 */
export function normalisePostalCode(country: string, code: string): string {
  const trimmed = code.trim().toUpperCase();
  if (country.trim().toUpperCase() === 'CA') {
    const compact = trimmed.replace(/[\s-]+/g, '');
    return compact.length === 6 ? `${compact.slice(0, 3)} ${compact.slice(3)}` : trimmed;
  }
  return trimmed.replace(/\s+/g, ' ');
}
