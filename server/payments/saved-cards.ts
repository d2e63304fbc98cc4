import type { ChargeResult, KeepCardResult, PaymentGateway } from './payment-gateway';

/** The card as the processor describes it: never more than its brand and last four digits. */
export interface CardOnFile {
  brand: string;
  last4: string;
}

/** What saving a card came to: a processor customer holding it (and which card), or the processor's refusal. */
export type SaveCardResult =
  { outcome: 'saved'; customerId: string; card: CardOnFile | null } | { outcome: 'declined'; message: string };

/** What Padside may show of a saved card: never its number. */
export interface SavedCardSummary {
  brand: string;
  last4: string;
  expMonth: number;
  expYear: number;
}

/** Cards kept with the processor (as a customer's default card) for charges the member is not present for. */
export class SavedCards {
  constructor(private readonly gateway: PaymentGateway) {}

  /** Creates a processor customer holding the card behind `token`. */
  async save(token: string, email: string, name: string, idempotencyKey: string): Promise<SaveCardResult> {
    return onFile(await this.gateway.createCustomer(token, email, name, idempotencyKey));
  }

  /** Replaces the customer's default card with the card behind `token`. */
  async replace(customerId: string, token: string): Promise<SaveCardResult> {
    return onFile(await this.gateway.replaceDefaultCard(customerId, token));
  }

  /** The customer's default card as brand, last four digits and expiry; null when the customer holds no card. */
  describe(customerId: string): Promise<SavedCardSummary | null> {
    return this.gateway.defaultCard(customerId);
  }

  /** An account's deletion: the processor customer keeps no card, name or e-mail. */
  forget(customerId: string): Promise<void> {
    return this.gateway.forgetCustomer(customerId);
  }

  /** Charges the customer's default card once; the idempotency key makes a repeated attempt count once. */
  charge(
    customerId: string,
    amountCents: number,
    description: string,
    idempotencyKey: string,
    metadata: Record<string, string>,
  ): Promise<ChargeResult> {
    return this.gateway.charge({ customerId, token: '', amountCents, description, idempotencyKey, metadata });
  }
}

/** Only brand and last four leave for the member's screens at the moment of saving. */
function onFile(result: KeepCardResult): SaveCardResult {
  if (result.outcome === 'declined') return result;
  const card = result.card ? { brand: result.card.brand, last4: result.card.last4 } : null;
  return { outcome: 'saved', customerId: result.customerId, card };
}
