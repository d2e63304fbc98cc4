import type { Order } from '../../contracts/shop/shop-answers';
import { formatRate } from './tax';
import type { OrderBundle } from './order-rows';

/** An order as its buyer sees it; staff views add `staffOrderFields`. */
export function orderJson(b: OrderBundle): Order {
  const o = b.order;
  return {
    id: o.id,
    number: o.number,
    status: o.status,
    email: o.email,
    createdAt: o.created_at.toISOString(),
    paidAt: o.paid_at?.toISOString() ?? null,
    packedAt: o.packed_at?.toISOString() ?? null,
    shippedAt: o.shipped_at?.toISOString() ?? null,
    shipTo: {
      name: o.ship_name,
      line1: o.ship_line1,
      line2: o.ship_line2,
      city: o.ship_city,
      province: o.ship_province,
      postalCode: o.ship_postal_code,
      country: o.ship_country,
    },
    shippingMethod: { code: o.shipping_code, name: o.shipping_name },
    carrier: o.carrier,
    trackingNumber: o.tracking_number,
    items: b.items.map((i) => ({
      id: i.id,
      variantId: i.variant_id,
      runId: i.run_id,
      productName: i.product_name,
      variantLabel: i.variant_label,
      sku: i.sku,
      unitPriceCents: i.unit_price_cents,
      quantity: i.quantity,
      lineCents: i.unit_price_cents * i.quantity,
      restockedQuantity: i.restocked_quantity,
    })),
    discountPercent: o.discount_percent,
    subtotalCents: o.subtotal_cents,
    discountCents: o.discount_cents,
    shippingCents: o.shipping_cents,
    taxLines: b.taxes.map((t) => ({
      code: t.code,
      label: `${t.code} ${formatRate(t.rate_percent)}%`,
      ratePercent: formatRate(t.rate_percent),
      amountCents: t.amount_cents,
    })),
    taxCents: o.tax_cents,
    totalCents: o.total_cents,
    refundedCents: o.refunded_cents,
    currency: 'CAD',
    paymentMessage: o.status === 'pending' || o.status === 'failed' ? o.payment_message : null,
  };
}
