/** What the staff order routes answer (/api/admin/orders): the server types its views with these; the console reads them. */
import type { OrderStatus } from '../labels/order-statuses';
import type { RefundOrigin, RefundState } from '../labels/refund-states';
import type { Order, OrderItem } from './shop-answers';

/** One row of the staff order table. */
export interface StaffOrderRow {
  id: number;
  number: string;
  status: OrderStatus;
  email: string;
  shipName: string;
  units: number;
  totalCents: number;
  refundedCents: number;
  shippingName: string;
  createdAt: string;
  disputed: boolean;
}

/** GET /api/admin/orders. */
export interface StaffOrderPage {
  items: StaffOrderRow[];
  total: number;
  page: number;
  pageSize: number;
}

/** One tax reversed by a refund. */
export interface RefundTaxLine {
  code: string;
  jurisdiction: string;
  label: string;
  ratePercent: string;
  taxableCents: number;
  taxCents: number;
}

/** POST /api/admin/orders/:id/refund-preview: what a refund comes to, before anything moves. */
export interface RefundPreview {
  lines: { orderItemId: number; quantity: number; goodsCents: number }[];
  goodsCents: number;
  shippingCents: number;
  taxLines: RefundTaxLine[];
  taxCents: number;
  totalCents: number;
  closesOrder: boolean;
}

/** A refund on record, from the console or from the processor. */
export interface StaffRefund extends Omit<RefundPreview, 'totalCents' | 'closesOrder'> {
  id: number;
  state: RefundState;
  origin: RefundOrigin;
  amountCents: number;
  restocked: boolean;
  unitsBackOnSale: number;
  reason: string | null;
  failureMessage: string | null;
  createdAt: string;
}

/** An order as staff see it: the buyer's view with payment, dispute, packing and refund facts. */
export interface StaffOrder extends Omit<Order, 'items'> {
  items: (OrderItem & { refundedQuantity: number; unitsToPack: number })[];
  weightGrams: number;
  pricedOn: string;
  chargeId: string | null;
  paidOutsideProcessor: boolean;
  paymentAttempts: number;
  disputedAt: string | null;
  disputeReason: string | null;
  /** Print runs this order waits for; it cannot ship before they are printed. */
  awaitingPrint: string[];
  shippingRefundedCents: number;
  refunds: StaffRefund[];
}
