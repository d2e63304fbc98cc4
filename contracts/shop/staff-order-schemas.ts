/** Queries and bodies of the staff order routes (/api/admin/orders): the server parses with them; the console takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';

/** The columns the staff order table sorts by. */
export const ORDER_SORT_KEYS = ['created', 'number', 'email', 'total', 'status'] as const;
export type OrderSortKey = (typeof ORDER_SORT_KEYS)[number];

// Strict: the same filters choose what the CSV export holds, so a misspelt key must not widen it to every order.
/** GET /api/admin/orders and its CSV export. */
export const OrderQuery = z.strictObject({
  page: fields.page,
  pageSize: fields.pageSize,
  sort: z.enum(ORDER_SORT_KEYS, { error: 'Sort by created, number, email, total or status.' }).default('created'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  // `placed`: every order but never-paid attempts (status failed), the console's default view.
  status: z
    .enum(['placed', 'pending', 'paid', 'failed', 'packed', 'shipped'], { error: 'Choose placed or an order status.' })
    .optional(),
  runId: fields.id.optional(),
  from: fields.date.optional(),
  to: fields.date.optional(),
  q: z.string().trim().max(100).optional(),
});

/** POST /api/admin/orders/:id/ship. */
export const ShipBody = z.object({
  carrier: z
    .string({ error: 'Carrier is required.' })
    .trim()
    .min(2, 'Carrier is required.')
    .max(60, 'At most 60 characters.'),
  trackingNumber: z
    .string({ error: 'Tracking number is required.' })
    .trim()
    .min(4, 'Tracking number is required.')
    .max(80, 'At most 80 characters.')
    .regex(/^[A-Za-z0-9 -]+$/, 'Letters, digits, spaces and dashes only.'),
});

/** POST /api/admin/orders/:id/refund and its preview: what the treasurer asks to refund. */
export const RefundBody = z.object({
  lines: z
    .array(
      z.object({
        orderItemId: fields.id,
        quantity: z.number({ error: 'Enter a quantity.' }).int('Whole units only.').min(1, 'At least 1.').max(10000),
      }),
      { error: 'Lines must be a list.' },
    )
    .max(100)
    .default([]),
  shipping: z.boolean({ error: 'Shipping is yes or no.' }).default(false),
  amountCents: fields.cents.min(1, 'Enter an amount.').optional(),
  restock: z.boolean({ error: 'Restock is yes or no.' }).default(false),
  reason: z.string({ error: 'Reason must be text.' }).trim().max(400, 'At most 400 characters.').optional(),
});

/** The staff order table's query as the console holds it: every paging and sort field set. */
export type OrderListQuery = z.infer<typeof OrderQuery>;
/** Which orders a staff query chooses: the query without its paging and sort. */
export type OrderFilter = Omit<z.infer<typeof OrderQuery>, 'page' | 'pageSize' | 'sort' | 'dir'>;
/** A shipment as the console records it. */
export type ShipInput = z.input<typeof ShipBody>;
/** A refund as the console asks for it. */
export type RefundInput = z.input<typeof RefundBody>;
