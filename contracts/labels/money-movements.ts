/** What a line of the books is (the `money_movements.kind` codes). */
export type MovementKind =
  'order_payment' | 'refund' | 'dues_payment' | 'manual_payment' | 'sponsor_cash' | 'processor_fee';

export const MOVEMENT_KIND_LABELS: Readonly<Record<MovementKind, string>> = {
  order_payment: 'Order payment',
  refund: 'Refund',
  dues_payment: 'Dues payment',
  manual_payment: 'Dues paid in person',
  sponsor_cash: 'Sponsor cash',
  processor_fee: 'Card processor fee',
};

/** Where the money came from (the `money_movements.source` codes). */
export type MovementSource = 'merch' | 'dues' | 'sponsor';

export const MOVEMENT_SOURCE_LABELS: Readonly<Record<MovementSource, string>> = {
  merch: 'Merch',
  dues: 'Dues',
  sponsor: 'Sponsor cash',
};
