import { z } from 'zod';
import { RunFieldsSchema } from '../../contracts/shop/staff-shop-schemas';
import { refuseUnrenderable } from '../markdown/markdown-field';
import { fields } from '../platform/validate';

// The product bodies stay beside the server: their descriptions carry the Markdown render check only the server makes.

const name = z
  .string({ error: 'Name is required.' })
  .trim()
  .min(2, 'Use at least 2 characters.')
  .max(120, 'At most 120 characters.');
/** POST /api/admin/products: a product with its variants and, optionally, its first limited run. */
export const ProductBody = z.object({
  name,
  description: z.string().max(20000, 'At most 20,000 characters.').superRefine(refuseUnrenderable).default(''),
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
export const ProductPatch = z.object({
  name: name.optional(),
  description: z.string().max(20000, 'At most 20,000 characters.').superRefine(refuseUnrenderable).optional(),
  priceCents: fields.cents.min(50).optional(),
  active: z.boolean().optional(),
  sizeChart: ProductBody.shape.sizeChart.optional(),
  images: ProductBody.shape.images.optional(),
  maxPerOrder: ProductBody.shape.maxPerOrder.unwrap().optional(),
});

/** A new product as parsed. */
export type ProductInput = z.infer<typeof ProductBody>;
/** A product edit as parsed. */
export type ProductEdit = z.infer<typeof ProductPatch>;
