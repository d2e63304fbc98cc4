/**
 * The processor's published test tokens, shown as labelled test cards while Padside runs against the local
 * payment fake; no real card number is ever typed into Padside.
 */
export const TEST_CARDS: readonly { token: string; label: string }[] = [
  { token: 'tok_ca', label: 'Test card: Visa issued in Canada, approves' },
  { token: 'tok_visa', label: 'Test card: Visa issued abroad, approves' },
  { token: 'tok_mastercard', label: 'Test card: Mastercard, approves' },
  { token: 'tok_chargeDeclined', label: 'Test card: always declined' },
  { token: 'tok_chargeDeclinedInsufficientFunds', label: 'Test card: declined, insufficient funds' },
  { token: 'tok_chargeCustomerFail', label: 'Test card: saves, then declines later charges' },
];
