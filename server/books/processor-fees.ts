import { z } from 'zod';
import { defineSetting } from '../settings/settings-service';

/**
 * Card-fee estimate until the processor reports the real fee. Defaults: Stripe's Canadian standard pricing for a
 * domestic card, 2.9% + C$0.30, and +0.8% for an international card (Stripe Support, October 2023 pricing
 * update; the percentage is from a secondary copy, so it is a setting).
 */
export const PROCESSOR_FEES = defineSetting(
  'processor_fees',
  z.object({
    percentBasisPoints: z.number().int().min(0).max(10000),
    fixedCents: z.number().int().min(0).max(10000),
    internationalExtraBasisPoints: z.number().int().min(0).max(10000),
  }),
  { percentBasisPoints: 290, fixedCents: 30, internationalExtraBasisPoints: 80 },
);

export type ProcessorFeeSettings = z.infer<typeof PROCESSOR_FEES.schema>;

/** The estimated fee on one successful charge, rounded half-up to the cent. */
export function estimateFeeCents(amountCents: number, international: boolean, s: ProcessorFeeSettings): number {
  const bps = s.percentBasisPoints + (international ? s.internationalExtraBasisPoints : 0);
  return Math.floor((amountCents * bps) / 10000 + 0.5) + s.fixedCents;
}
