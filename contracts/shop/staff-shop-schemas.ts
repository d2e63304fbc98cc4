/** The console's run and shipping-method bodies (/api/admin/runs, /api/admin/shop): the server parses with them; the
 * console takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';

const instant = z.iso.datetime({ offset: true, error: 'Use a date and time such as 2026-12-01T09:00:00-06:00.' });

/** A run's own fields, as a product's first run and a further run both carry them. */
export const RunFieldsSchema = z.object({
  name: z.string().trim().max(120).optional(),
  cap: z.number({ error: 'Enter a cap.' }).int().min(1, 'At least 1.').max(100000, 'At most 100,000.'),
  opensAt: instant,
  closesAt: instant,
  unitCostCents: fields.cents.optional(),
});

/** POST /api/admin/runs: a further run of a product that already sells in runs (a new season's batch). */
export const NewRunBody = RunFieldsSchema.extend({
  productId: fields.id,
  variantCaps: z
    .array(
      z.object({
        variantId: fields.id,
        cap: z.number({ error: 'Enter a cap.' }).int().min(0, 'At least 0.').max(100000),
      }),
    )
    .max(30)
    .default([]),
});

/** POST /api/admin/runs/:id/state: the state staff move a run to by hand. */
export const RunStateBody = z.object({
  state: z.enum(['closed', 'in_production', 'shipped'], { error: 'Choose closed, in production or shipped.' }),
});

/** One weight bracket of a shipping method: up to `maxGrams` (null: any weight) for `priceCents`. */
export const ShippingBracketSchema = z.object({
  maxGrams: z.number().int().min(1).max(100000).nullable(),
  priceCents: fields.cents,
});

/** PUT /api/admin/shop/shipping-methods/:id: a method's name, weight brackets and on/off switch. */
export const ShippingMethodBody = z.object({
  name: z.string().trim().min(2, 'Name is required.').max(80),
  brackets: z.array(ShippingBracketSchema).min(1, 'Add at least one weight bracket.').max(20),
  active: z.boolean(),
});

/** A further run as the console sends it. */
export type NewRun = z.input<typeof NewRunBody>;
/** A further run as parsed (size caps filled in). */
export type NewRunInput = z.infer<typeof NewRunBody>;
/** The run-state body. */
export type RunStateInput = z.input<typeof RunStateBody>;
/** A shipping method as the console saves it. */
export type ShippingMethodInput = z.input<typeof ShippingMethodBody>;
