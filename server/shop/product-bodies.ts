import type { z } from 'zod';
import { NewProductBody, ProductDescription, ProductPatchBody } from '../../contracts/shop/staff-shop-schemas';
import { refuseUnrenderable } from '../markdown/markdown-field';

// The contract's product bodies with the Markdown render check on the description, which only the server can make.
const description = ProductDescription.superRefine(refuseUnrenderable);

/** POST /api/admin/products: a product with its variants and, optionally, its first limited run. */
export const ProductBody = NewProductBody.extend({ description: description.default('') });

/** PATCH /api/admin/products/:id: the product fields sent change, the rest stay. */
export const ProductPatch = ProductPatchBody.extend({ description: description.optional() });

/** A new product as parsed. */
export type ProductInput = z.infer<typeof ProductBody>;
/** A product edit as parsed. */
export type ProductEdit = z.infer<typeof ProductPatch>;
