/** Order arithmetic before tax: pure, every price and rule passed in (the shipping rule is contracts/shop/shipping-price.ts). */

/** A percentage of an amount, rounded half-up to the cent. */
export function percentOf(cents: number, percent: number): number {
  return Math.floor((cents * percent + 50) / 100);
}

/** Shares `amount` across `parts` in proportion to their weights, so the shares add up exactly (largest remainder). */
export function shareProportionally(amount: number, parts: number[]): number[] {
  const total = parts.reduce((s, p) => s + p, 0);
  if (total === 0) return parts.map(() => 0);
  const raw = parts.map((p) => (amount * p) / total);
  const shares = raw.map(Math.floor);
  let left = amount - shares.reduce((s, p) => s + p, 0);
  const order = raw.map((r, i) => ({ i, rest: r - Math.floor(r) })).sort((a, b) => b.rest - a.rest);
  for (const { i } of order) {
    if (left <= 0) break;
    shares[i]++;
    left--;
  }
  return shares;
}
