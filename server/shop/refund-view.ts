import type { RefundPreview, StaffOrder, StaffRefund } from '../../contracts/shop/staff-order-answers';
import type { OrderRepository } from './order-repository';
import type { OrderBundle } from './order-rows';
import { orderJson } from './order-view';
import type { RefundBreakdown } from './refund-arithmetic';
import type { RefundLineRow, RefundRepository, RefundTaxRow, ShopRefundRow } from './refund-repository';
import { formatRate } from './tax';

const taxLabel = (t: { code: string; ratePercent: string }) => `${t.code} ${formatRate(t.ratePercent)}%`;

/** A computed refund (a preview, or what a claim holds) as the console shows it. */
export function breakdownJson(b: RefundBreakdown): RefundPreview {
  return {
    lines: b.lines,
    goodsCents: b.goodsCents,
    shippingCents: b.shippingCents,
    taxLines: b.taxes.map((t) => ({
      code: t.code,
      jurisdiction: t.jurisdiction,
      label: taxLabel(t),
      ratePercent: formatRate(t.ratePercent),
      taxableCents: t.taxableCents,
      taxCents: t.taxCents,
    })),
    taxCents: b.taxCents,
    totalCents: b.totalCents,
    closesOrder: b.closesOrder,
  };
}

/** One refund with its parts, lines and tax lines. */
export function refundJson(r: ShopRefundRow, lines: RefundLineRow[], taxes: RefundTaxRow[]): StaffRefund {
  const mine = lines.filter((l) => l.refund_id === r.id);
  return {
    id: r.id,
    state: r.state,
    origin: r.origin,
    amountCents: r.amount_cents,
    goodsCents: r.goods_cents,
    shippingCents: r.shipping_cents,
    taxCents: r.tax_cents,
    taxLines: taxes
      .filter((t) => t.refund_id === r.id)
      .map((t) => ({
        code: t.code,
        jurisdiction: t.jurisdiction,
        label: taxLabel({ code: t.code, ratePercent: t.rate_percent }),
        ratePercent: formatRate(t.rate_percent),
        taxableCents: t.taxable_cents,
        taxCents: t.tax_cents,
      })),
    lines: mine.map((l) => ({ orderItemId: l.order_item_id, quantity: l.quantity, goodsCents: l.goods_cents })),
    restocked: r.restocked,
    unitsBackOnSale: r.restocked && r.state === 'succeeded' ? mine.reduce((s, l) => s + l.quantity, 0) : 0,
    reason: r.reason,
    failureMessage: r.failure_message,
    createdAt: r.created_at.toISOString(),
  };
}

/** The staff view of an order: lines with their refunded units, the print runs it waits for, every refund with its parts. */
export async function staffOrderJson(
  b: OrderBundle,
  refunds: RefundRepository,
  orders: OrderRepository,
): Promise<StaffOrder> {
  const rows = await refunds.forOrder(b.order.id);
  const ids = rows.map((r) => r.id);
  const [lines, taxes] = [await refunds.lines(ids), await refunds.taxes(ids)];
  const live = new Set(rows.filter((r) => r.state !== 'failed').map((r) => r.id));
  const refundedUnits = (itemId: number) =>
    lines.filter((l) => l.order_item_id === itemId && live.has(l.refund_id)).reduce((s, l) => s + l.quantity, 0);
  const base = orderJson(b);
  const o = b.order;
  return {
    ...base,
    weightGrams: o.weight_grams,
    pricedOn: o.priced_on,
    chargeId: o.charge_id,
    paidOutsideProcessor: o.paid_outside_processor,
    paymentAttempts: o.payment_attempts,
    disputedAt: o.disputed_at?.toISOString() ?? null,
    disputeReason: o.dispute_reason,
    items: base.items.map((i) => ({
      ...i,
      refundedQuantity: refundedUnits(i.id),
      unitsToPack: i.quantity - refundedUnits(i.id),
    })),
    awaitingPrint: await orders.unprintedRuns(b.order.id),
    shippingRefundedCents: rows.filter((r) => live.has(r.id)).reduce((s, r) => s + r.shipping_cents, 0),
    refunds: rows.map((r) => refundJson(r, lines, taxes)),
  };
}
