/** The console's product, run and shipping-method bodies (/api/admin/products, /api/admin/runs, /api/admin/shop): the
 * server parses with them (adding its Markdown render check to product descriptions); the console takes their types. */
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

/** A product's description as staff write it, in Markdown (the server adds its render check). */
export const ProductDescription = z.string().max(20000, 'At most 20,000 characters.');

const name = z
  .string({ error: 'Name is required.' })
  .trim()
  .min(2, 'Use at least 2 characters.')
  .max(120, 'At most 120 characters.');
/** POST /api/admin/products: a product with its variants and, optionally, its first limited run. */
export const NewProductBody = z.object({
  name,
  description: ProductDescription.default(''),
  priceCents: fields.cents.min(50, 'At least $0.50 (the card processor minimum).'),
  weightGrams: z
    .number({ error: 'Enter a weight in grams.' })
    .int('Whole grams.')
    .min(1, 'At least 1 g.')
    .max(20000, 'At most 20 kg.'),
  sizeChart: z
    .object({
      columns: z.array(z.string().max(40)).min(1).max(10),
      rows: z.array(z.array(z.string().max(40)).max(10)).max(20),
    })
    .nullable()
    .default(null),
  maxPerOrder: z
    .number({ error: 'Enter a number of units.' })
    .int('Whole units only.')
    .min(1, 'At least 1.')
    .max(100, 'At most 100.')
    .default(20),
  images: z
    .array(
      z.object({
        url: z.string().regex(/^\/uploads\/[a-z0-9-]+\.(jpg|png|webp|gif)$/, 'Use an uploaded image.'),
        thumbnailUrl: z.string().regex(/^\/uploads\/[a-z0-9-]+\.(jpg|png|webp|gif)$/, 'Use an uploaded image.'),
        alt: z.string().trim().max(200),
        width: z.number().int().min(1).max(20000).optional(),
        height: z.number().int().min(1).max(20000).optional(),
      }),
    )
    .max(8)
    .default([]),
  variants: z
    .array(
      z.object({
        label: z.string({ error: 'Label is required.' }).trim().min(1, 'Label is required.').max(60),
        sku: z
          .string()
          .trim()
          .regex(/^[A-Z0-9-]{2,60}$/i, 'Letters, digits and dashes.')
          .optional(),
        weightGrams: z.number().int().min(1).max(20000).optional(),
        priceCents: fields.cents.optional(),
        stock: z.number().int().min(0).max(100000).optional(),
      }),
    )
    .min(1, 'Add at least one variant.')
    .max(30),
  run: RunFieldsSchema.extend({ variantCaps: z.record(z.string(), z.number().int().min(0)).optional() }).optional(),
});

/** PATCH /api/admin/products/:id: the product fields sent change, the rest stay. */
export const ProductPatchBody = z.object({
  name: name.optional(),
  description: ProductDescription.optional(),
  priceCents: fields.cents.min(50).optional(),
  active: z.boolean().optional(),
  sizeChart: NewProductBody.shape.sizeChart.optional(),
  images: NewProductBody.shape.images.optional(),
  maxPerOrder: NewProductBody.shape.maxPerOrder.unwrap().optional(),
});

/** A new product as the console sends it. */
export type NewProduct = z.input<typeof NewProductBody>;
/** A product edit as the console sends it. */
export type ProductChanges = z.input<typeof ProductPatchBody>;
/** A further run as the console sends it. */
export type NewRun = z.input<typeof NewRunBody>;
/** A further run as parsed (size caps filled in). */
export type NewRunInput = z.infer<typeof NewRunBody>;
/** The run-state body. */
export type RunStateInput = z.input<typeof RunStateBody>;
/** A shipping method as the console saves it. */
export type ShippingMethodInput = z.input<typeof ShippingMethodBody>;
