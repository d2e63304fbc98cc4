/** Canadian sales tax on one order: pure arithmetic, every rate and rule passed in. */

import { PROVINCES, type Province } from '../../contracts/shop/provinces';

export { PROVINCES, type Province };
export type TaxCode = 'GST' | 'HST' | 'PST' | 'QST' | 'RST';

/** One row of the rate table: `ratePercent` is an exact decimal string such as "9.975". */
export interface TaxRate {
  jurisdiction: Province;
  code: TaxCode;
  ratePercent: string;
  effectiveFrom: string;
}

/** Who the seller is registered with and how provincial taxes treat shipping. */
export interface TaxRules {
  /** Registered for GST/HST (false = small supplier: none charged). */
  gstHstRegistered: boolean;
  /** Provinces whose own sales tax the seller is registered to collect. */
  provincialRegistrations: Province[];
  /** Whether a province's own tax applies to shipping the seller charges. */
  provincialTaxOnShipping: Partial<Record<Province, boolean>>;
}

/** One tax on an order, rounded half-up at the cent. */
export interface TaxLine {
  code: TaxCode;
  jurisdiction: Province;
  label: string;
  ratePercent: string;
  taxableCents: number;
  amountCents: number;
}

const NAMES: Record<TaxCode, string> = { GST: 'GST', HST: 'HST', PST: 'PST', QST: 'QST', RST: 'RST' };
const FEDERAL: TaxCode[] = ['GST', 'HST'];

/** A decimal percent as an integer count of 1/10000 %: "9.975" -> 99750. Rejects anything but plain decimals. */
export function rateUnits(ratePercent: string): number {
  const m = /^(\d{1,3})(?:\.(\d{1,4}))?$/.exec(ratePercent.trim());
  if (!m) throw new Error(`not a decimal percent: ${ratePercent}`);
  return Number(m[1]) * 10000 + Number((m[2] ?? '').padEnd(4, '0'));
}

/** The shortest decimal form of a rate: "9.9750" -> "9.975", "5.0000" -> "5". */
export function formatRate(ratePercent: string): string {
  const units = rateUnits(ratePercent);
  const whole = Math.floor(units / 10000);
  const frac = String(units % 10000)
    .padStart(4, '0')
    .replace(/0+$/, '');
  return frac ? `${whole}.${frac}` : String(whole);
}

/** numerator / denominator rounded half-up (both non-negative integers): Padside's one rounding rule for money. */
export function divideHalfUp(numerator: bigint, denominator: bigint): number {
  return Number((2n * numerator + denominator) / (2n * denominator));
}

/** cents x rate, rounded half-up to the cent, in integers only (1 % = 10000 units, so divide by 1,000,000). */
export function taxOn(cents: number, ratePercent: string): number {
  return divideHalfUp(BigInt(cents) * BigInt(rateUnits(ratePercent)), 1000000n);
}

/** The rates in force on `date` (YYYY-MM-DD) in one province: the newest row per tax not after the date. */
export function ratesInForce(rates: TaxRate[], province: Province, date: string): TaxRate[] {
  const best = new Map<TaxCode, TaxRate>();
  for (const r of rates) {
    if (r.jurisdiction !== province || r.effectiveFrom > date) continue;
    const seen = best.get(r.code);
    if (!seen || seen.effectiveFrom < r.effectiveFrom) best.set(r.code, r);
  }
  return [...best.values()].sort((a, b) => Number(FEDERAL.includes(b.code)) - Number(FEDERAL.includes(a.code)));
}

export interface TaxInput {
  /** Goods after any discount. */
  goodsCents: number;
  shippingCents: number;
  /** Place of supply: the province delivered to (the seller's for pickup), or null outside Canada. */
  province: Province | null;
  date: string;
}

/** Each tax charged on an order, by the rules of its place of supply. */
export function computeTaxes(input: TaxInput, rates: TaxRate[], rules: TaxRules): TaxLine[] {
  if (!input.province) return [];
  const province = input.province;
  const lines: TaxLine[] = [];
  for (const rate of ratesInForce(rates, province, input.date)) {
    const federal = FEDERAL.includes(rate.code);
    if (federal ? !rules.gstHstRegistered : !rules.provincialRegistrations.includes(province)) continue;
    // GST/HST: shipping charged by the seller follows the goods it carries; provincial taxes follow their own rule.
    const withShipping = federal || rules.provincialTaxOnShipping[province] === true;
    const taxableCents = input.goodsCents + (withShipping ? input.shippingCents : 0);
    const shown = formatRate(rate.ratePercent);
    lines.push({
      code: rate.code,
      jurisdiction: province,
      label: `${NAMES[rate.code]} ${shown}%`,
      ratePercent: shown,
      taxableCents,
      amountCents: taxOn(taxableCents, rate.ratePercent),
    });
  }
  return lines;
}
