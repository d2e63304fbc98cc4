/** One weight bracket of a shipping method, as the server lists it. */
export interface WeightBracket {
  maxGrams: number | null;
  priceCents: number;
}

/**
 * The price of shipping `grams` by a method's brackets (the first bracket the parcel fits), or null when it is
 * heavier than all of them. The same rule as the server's quote, which stays the figure that is charged.
 */
export function shippingPrice(grams: number, brackets: WeightBracket[]): number | null {
  const sorted = [...brackets].sort((a, b) => (a.maxGrams ?? Infinity) - (b.maxGrams ?? Infinity));
  return sorted.find((b) => b.maxGrams === null || grams <= b.maxGrams)?.priceCents ?? null;
}
