/** How money came in or went out (the `method` codes of payments and money movements). */
export type PaymentMethod = 'card' | 'cash' | 'e-transfer' | 'cheque' | 'other';

export const PAYMENT_METHOD_LABELS: Readonly<Record<PaymentMethod, string>> = {
  card: 'Card',
  cash: 'Cash',
  'e-transfer': 'E-transfer',
  cheque: 'Cheque',
  other: 'Other',
};
