import { z } from 'zod';
import { defineSetting } from '../settings/settings-service';

/** One tier: a sponsor whose season total (cash + declared in-kind value) reaches `minCents` holds it. */
export interface Tier {
  name: string;
  minCents: number;
}

export const TiersSchema = z.object({
  tiers: z
    .array(
      z.object({
        name: z.string().trim().min(1, 'Name the tier.').max(40, 'Use at most 40 characters.'),
        minCents: z.number().int('Whole cents.').min(0, 'Cannot be negative.').max(100_000_000),
      }),
    )
    .min(1, 'Keep at least one tier.')
    .max(8, 'At most 8 tiers.')
    .refine((ts) => new Set(ts.map((t) => t.minCents)).size === ts.length, 'Each tier needs its own threshold.')
    .refine((ts) => new Set(ts.map((t) => t.name.toLowerCase())).size === ts.length, 'Each tier needs its own name.'),
});

/** Staff-set thresholds; the defaults are Padside's starting point, not a rule from anywhere. */
export const SPONSOR_TIERS = defineSetting('sponsor_tiers', TiersSchema, {
  tiers: [
    { name: 'Launch Pad', minCents: 0 },
    { name: 'Boost Phase', minCents: 50_000 },
    { name: 'Apogee', minCents: 150_000 },
  ],
});

/** The highest tier whose threshold the total reaches; null below the lowest threshold. */
export function tierFor(totalCents: number, tiers: readonly Tier[]): Tier | null {
  let best: Tier | null = null;
  for (const t of tiers) if (totalCents >= t.minCents && (!best || t.minCents > best.minCents)) best = t;
  return best;
}

/** The season an agreement date falls in: Padside's seasons are calendar years. */
export function seasonOf(today: string): string {
  return today.slice(0, 4);
}
