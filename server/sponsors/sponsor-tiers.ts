import { TiersSchema, type Tier } from '../../contracts/sponsors/sponsor-schemas';
import { defineSetting } from '../settings/settings-service';

export { TiersSchema, type Tier };

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
