/** The shipping price rule, pure: the checkout shows it as the buyer types, the server's quote charges it. */

/** One weight bracket of a shipping method: up to `maxGrams` (null = any weight) costs `priceCents`. */
export interface WeightBracket {
  maxGrams: number | null;
  priceCents: number;
}

/** The price of shipping `grams` (the first bracket the parcel fits), or null when it is heavier than every bracket. */
export function shippingFor(grams: number, brackets: readonly WeightBracket[]): number | null {
  const sorted = [...brackets].sort((a, b) => (a.maxGrams ?? Infinity) - (b.maxGrams ?? Infinity));
  return sorted.find((b) => b.maxGrams === null || grams <= b.maxGrams)?.priceCents ?? null;
}
