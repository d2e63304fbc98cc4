/** A shop refund's state (the `shop_refunds.state` codes). */
export type RefundState = 'requested' | 'succeeded' | 'failed';

export const REFUND_STATE_LABELS: Readonly<Record<RefundState, string>> = {
  requested: 'Waiting for the processor',
  succeeded: 'Refunded',
  failed: 'Not refunded',
};

/** Who started a refund (the `shop_refunds.origin` codes). */
export type RefundOrigin = 'staff' | 'processor';

export const REFUND_ORIGIN_LABELS: Readonly<Record<RefundOrigin, string>> = {
  staff: 'Staff',
  processor: 'Card processor',
};
