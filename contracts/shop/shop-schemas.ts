/** Request bodies and queries of the shop routes: the server parses with them; the app takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';
import { normalisePostalCode } from './postal-code';

const text = (max: number, label: string) =>
  z
    .string({ error: `${label} is required.` })
    .trim()
    .max(max, `${label} is too long.`);

/** POST /api/checkout/quote: the cart, where it goes and how; an order adds e-mail and payment token. */
export const QuoteBody = z.object({
  items: z
    .array(
      z.object({
        variantId: fields.id,
        quantity: z
          .number({ error: 'Enter a quantity.' })
          .int('Whole units only.')
          .min(1, 'At least 1.')
          .max(100, 'At most 100 of one item.'),
      }),
      { error: 'The cart is empty.' },
    )
    .min(1, 'The cart is empty.')
    .max(30, 'At most 30 different items.'),
  shipTo: z
    .object(
      {
        name: text(120, 'Name').min(1, 'Name is required.'),
        line1: text(200, 'Address').optional().default(''),
        line2: text(200, 'Address line 2').optional().default(''),
        city: text(100, 'City').optional().default(''),
        province: text(40, 'Province or state').optional().default(''),
        postalCode: text(20, 'Postal code').optional().default(''),
        country: z
          .string({ error: 'Country is required.' })
          .trim()
          .toUpperCase()
          .regex(/^[A-Z]{2}$/, 'Use the two-letter country code.'),
      },
      { error: 'Shipping details are required.' },
    )
    .transform((to) => ({ ...to, postalCode: normalisePostalCode(to.country, to.postalCode) })),
  shippingMethodId: fields.id,
});

/** POST /api/orders. */
export const OrderBody = QuoteBody.extend({ email: fields.email, paymentToken: fields.cardToken });

/** POST /api/orders/:id/pay: another attempt with another card. */
export const PayBody = z.object({ paymentToken: fields.cardToken });

/** The cart as the server prices it (the app sends the same fields; defaults fill what it leaves out). */
export type QuoteRequest = z.infer<typeof QuoteBody>;
/** An order as the server places it. */
export type OrderRequest = z.infer<typeof OrderBody>;
/** A quote request as the app writes it. */
export type QuoteInput = z.input<typeof QuoteBody>;
/** An order as the app places it. */
export type OrderInput = z.input<typeof OrderBody>;
