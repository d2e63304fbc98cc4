/** Queries and bodies of the treasurer's report and settings routes: the server parses with them; the console takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';

/** A report period: whole days from `from` to `to` inclusive, in the club's time zone. */
export const DateRangeQuery = z.object({ from: fields.date, to: fields.date });

/** A percentage as people type it: 0 to 100 with at most two decimals (2.9 for 2.9 %), stored as basis points. */
const percent = (what: string) =>
  z
    .number({ error: `Enter the ${what} as a percentage, like 2.9.` })
    .min(0, 'At least 0 %.')
    .max(100, 'At most 100 %.')
    .refine((v) => Math.abs(v * 100 - Math.round(v * 100)) < 1e-6, 'Use at most two decimals, like 2.95.');

/** PUT /api/admin/settings/processor-fees: the card-fee estimate as percentages, and the fixed part in cents. */
export const FeePercentBody = z.object({
  percent: percent('percentage'),
  fixedCents: z
    .number({ error: 'Enter the fixed part in cents, like 30.' })
    .int('Whole cents only.')
    .min(0, 'At least 0 cents.')
    .max(10000, 'At most 10000 cents.'),
  internationalExtraPercent: percent('extra for cards from abroad'),
});

/** A report period. */
export type DateRange = z.infer<typeof DateRangeQuery>;
/** The card-fee estimate as the console reads and writes it (GET answers the same shape). */
export type FeePercent = z.infer<typeof FeePercentBody>;
