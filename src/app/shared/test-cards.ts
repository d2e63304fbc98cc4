/**
 * The payment processor's published test tokens, offered as labelled test cards for dues and the shop while Padside
 * talks to the local payment fake (no publishable key set); no card number is ever typed into Padside.
 */
export const TEST_CARDS: readonly { token: string; label: string }[] = [
  { token: 'tok_visa', label: 'Test Visa (pays)' },
  { token: 'tok_ca', label: 'Test Visa issued in Canada (pays)' },
  { token: 'tok_mastercard', label: 'Test Mastercard (pays)' },
  { token: 'tok_chargeDeclined', label: 'Test card that is declined' },
  { token: 'tok_chargeDeclinedInsufficientFunds', label: 'Test card with insufficient funds' },
  { token: 'tok_chargeCustomerFail', label: 'Test card that can be kept on file but is declined when charged' },
];
