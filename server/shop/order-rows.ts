import type { OrderStatus } from '../../contracts/labels/order-statuses';

/** An order as stored. */
export interface OrderRow {
  id: number;
  number: string;
  user_id: number | null;
  email: string;
  status: OrderStatus;
  ship_name: string;
  ship_line1: string | null;
  ship_line2: string | null;
  ship_city: string | null;
  ship_province: string | null;
  ship_postal_code: string | null;
  ship_country: string;
  shipping_code: string;
  shipping_name: string;
  tax_jurisdiction: string | null;
  priced_on: string;
  weight_grams: number;
  discount_percent: number;
  subtotal_cents: number;
  discount_cents: number;
  shipping_cents: number;
  tax_cents: number;
  total_cents: number;
  refunded_cents: number;
  payment_attempts: number;
  charge_id: string | null;
  paid_outside_processor: boolean;
  payment_message: string | null;
  carrier: string | null;
  tracking_number: string | null;
  paid_at: Date | null;
  packed_at: Date | null;
  shipped_at: Date | null;
  disputed_at: Date | null;
  dispute_reason: string | null;
  last_attempt_at: Date | null;
  created_at: Date;
}
export interface OrderItemRow {
  id: number;
  order_id: number;
  variant_id: number;
  run_id: number | null;
  product_name: string;
  variant_label: string;
  sku: string;
  unit_price_cents: number;
  quantity: number;
  restocked_quantity: number;
}
export interface OrderTaxRow {
  code: 'GST' | 'HST' | 'PST' | 'QST' | 'RST';
  jurisdiction: string;
  rate_percent: string;
  taxable_cents: number;
  amount_cents: number;
}
export interface RefundRow {
  id: number;
  order_id: number;
  amount_cents: number;
  restocked: boolean;
  processor_refund_id: string | null;
  origin: 'staff' | 'processor';
  created_at: Date;
}

/** An order with its lines, taxes and refunds. */
export interface OrderBundle {
  order: OrderRow;
  items: OrderItemRow[];
  taxes: OrderTaxRow[];
  refunds: RefundRow[];
}

/** An order row as read, its pricing day as the text `to_char` gave (no time zone shifts it). */
export const orderOf = (r: Record<string, unknown>): OrderRow => ({
  ...(r as unknown as OrderRow),
  priced_on: r.priced_on_text as string,
});
