import { createHash } from 'node:crypto';
import type { OrderBundle } from './order-rows';
import type { RefundableOrder, RefundAsk } from './refund-arithmetic';
import type { RefundedSoFar } from './refund-repository';

/** A staff refund request: what to give back, whether the units go back on sale, and why. */
export interface RefundRequest extends RefundAsk {
  restock: boolean;
  reason: string | null;
}

/** The order's figures and what refunds in `soFar` took, for the pure refund arithmetic. */
export function refundableOrder(b: OrderBundle, soFar: RefundedSoFar): RefundableOrder {
  const o = b.order;
  const goods = o.subtotal_cents - o.discount_cents;
  return {
    discountPercent: o.discount_percent,
    goodsCents: goods,
    shippingCents: o.shipping_cents,
    items: b.items.map((i) => ({
      id: i.id,
      unitPriceCents: i.unit_price_cents,
      quantity: i.quantity,
      refundedQuantity: soFar.quantities.get(i.id) ?? 0,
    })),
    taxes: b.taxes.map((t) => ({
      code: t.code,
      jurisdiction: t.jurisdiction,
      ratePercent: t.rate_percent,
      taxableCents: t.taxable_cents,
      amountCents: t.amount_cents,
      onShipping: o.shipping_cents > 0 && t.taxable_cents > goods,
    })),
    refunded: soFar,
  };
}

/** A fingerprint of what a request asks, so a reused Idempotency-Key with a different request is caught. */
export const requestHash = (r: RefundRequest): string =>
  createHash('sha256')
    .update(
      JSON.stringify({
        l: [...r.lines].sort((a, b) => a.orderItemId - b.orderItemId),
        s: r.shipping,
        a: r.amountCents ?? null,
        r: r.restock,
      }),
    )
    .digest('hex');
