import { z } from 'zod';
import type { ProcessorFeeSettings } from './processor-fees';

/** A percentage as people type it: 0 to 100 with at most two decimals (2.9 for 2.9 %), stored as basis points. */
const percent = (what: string) =>
  z
    .number({ error: `Enter the ${what} as a percentage, like 2.9.` })
    .min(0, 'At least 0 %.')
    .max(100, 'At most 100 %.')
    .refine((v) => Math.abs(v * 100 - Math.round(v * 100)) < 1e-6, 'Use at most two decimals, like 2.95.');

/** The card-fee estimate as the console reads and writes it: percentages, and the fixed part in cents. */
export const FeePercentBody = z.object({
  percent: percent('percentage'),
  fixedCents: z.number({ error: 'Enter the fixed part in cents, like 30.' }).int('Whole cents only.').min(0, 'At least 0 cents.').max(10000, 'At most 10000 cents.'),
  internationalExtraPercent: percent('extra for cards from abroad'),
});

export type FeePercent = z.infer<typeof FeePercentBody>;

/** Stored basis points (290) to the percentage people read (2.9). */
export function toFeePercent(s: ProcessorFeeSettings): FeePercent {
  return { percent: s.percentBasisPoints / 100, fixedCents: s.fixedCents, internationalExtraPercent: s.internationalExtraBasisPoints / 100 };
}

/** A typed percentage (2.9) to the basis points stored (290); the schema has already allowed two decimals at most. */
export function fromFeePercent(f: FeePercent): ProcessorFeeSettings {
  return { percentBasisPoints: Math.round(f.percent * 100), fixedCents: f.fixedCents, internationalExtraBasisPoints: Math.round(f.internationalExtraPercent * 100) };
}
