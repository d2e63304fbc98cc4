import { formatRate } from './tax';
import type { OrderBundle } from './order-repository';

/** An order as its buyer sees it. */
export function orderJson(b: OrderBundle) {
  const o = b.order;
  return {
    id: o.id,
    number: o.number,
    status: o.status,
    email: o.email,
    createdAt: o.created_at,
    paidAt: o.paid_at,
    packedAt: o.packed_at,
    shippedAt: o.shipped_at,
    shipTo: { name: o.ship_name, line1: o.ship_line1, line2: o.ship_line2, city: o.ship_city, province: o.ship_province, postalCode: o.ship_postal_code, country: o.ship_country },
    shippingMethod: { code: o.shipping_code, name: o.shipping_name },
    carrier: o.carrier,
    trackingNumber: o.tracking_number,
    items: b.items.map((i) => ({ id: i.id, variantId: i.variant_id, runId: i.run_id, productName: i.product_name, variantLabel: i.variant_label, sku: i.sku, unitPriceCents: i.unit_price_cents, quantity: i.quantity, lineCents: i.unit_price_cents * i.quantity, restockedQuantity: i.restocked_quantity })),
    discountPercent: o.discount_percent,
    subtotalCents: o.subtotal_cents,
    discountCents: o.discount_cents,
    shippingCents: o.shipping_cents,
    taxLines: b.taxes.map((t) => ({ code: t.code, label: `${t.code} ${formatRate(t.rate_percent)}%`, ratePercent: formatRate(t.rate_percent), amountCents: t.amount_cents })),
    taxCents: o.tax_cents,
    totalCents: o.total_cents,
    refundedCents: o.refunded_cents,
    currency: 'CAD' as const,
    paymentMessage: o.status === 'pending' || o.status === 'failed' ? o.payment_message : null,
  };
}

/** The same order with what staff need besides: weight, pricing day, the charge, disputes and refunds. */
export function orderJsonForStaff(b: OrderBundle) {
  const o = b.order;
  return {
    ...orderJson(b),
    weightGrams: o.weight_grams,
    pricedOn: o.priced_on,
    chargeId: o.charge_id,
    paidOutsideProcessor: o.paid_outside_processor,
    paymentAttempts: o.payment_attempts,
    disputedAt: o.disputed_at,
    disputeReason: o.dispute_reason,
    refunds: b.refunds.map((r) => ({ id: r.id, amountCents: r.amount_cents, restocked: r.restocked, origin: r.origin, createdAt: r.created_at })),
  };
}
