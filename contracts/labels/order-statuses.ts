/** A shop order's status (the `shop_orders.status` codes). */
export type OrderStatus = 'pending' | 'paid' | 'failed' | 'packed' | 'shipped';

export const ORDER_STATUS_LABELS: Readonly<Record<OrderStatus, string>> = {
  pending: 'Payment unconfirmed',
  paid: 'Paid',
  failed: 'Not paid',
  packed: 'Packed',
  shipped: 'Shipped',
};
