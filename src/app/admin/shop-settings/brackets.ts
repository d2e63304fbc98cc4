/** Weight brackets as staff type them: "500 g: 9.00, 1500 g: 14.00, any: 22.00". */
import type { WeightBracket } from '@contracts/shop/shipping-price';
import { centsToDollars, dollarsToCents } from '../../shared/dollars';

/** Brackets to the text form staff edit. */
export function formatBrackets(brackets: WeightBracket[]): string {
  return brackets
    .map((b) => `${b.maxGrams === null ? 'any' : `${b.maxGrams} g`}: ${centsToDollars(b.priceCents)}`)
    .join(', ');
}

/** The text form back to brackets; null when any part does not read. */
export function parseBrackets(text: string): WeightBracket[] | null {
  const parts = text
    .split(',')
    .map((p) => p.trim())
    .filter(Boolean);
  const out: WeightBracket[] = [];
  for (const p of parts) {
    const m = /^(any|(\d{1,6})\s*g?)\s*:\s*\$?(\d{1,5}(?:\.\d{1,2})?)$/i.exec(p);
    if (!m) return null;
    out.push({ maxGrams: m[2] ? Number(m[2]) : null, priceCents: dollarsToCents(m[3]) });
  }
  return out.length ? out : null;
}
