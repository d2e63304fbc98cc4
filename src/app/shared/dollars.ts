/** A dollar amount typed in a form ("12.5", "0.29") as integer cents; rounding absorbs binary fractions (0.29 * 100). */
export function dollarsToCents(text: string | number): number {
  return Math.round(Number(text) * 100);
}

/** Cents as the plain amount a form field shows: 1250 -> "12.50". */
export function centsToDollars(cents: number): string {
  return (cents / 100).toFixed(2);
}
