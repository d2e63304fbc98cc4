import Stripe from 'stripe';
import type { ChargeResult, PaymentGateway } from './payment-gateway';

/** The card as the processor describes it: never more than its brand and last four digits. */
export interface CardOnFile {
  brand: string;
  last4: string;
}

/** What saving a card came to: a processor customer holding it (and which card), or the processor's refusal. */
export type SaveCardResult = { outcome: 'saved'; customerId: string; card: CardOnFile | null } | { outcome: 'declined'; message: string };

/** Cards kept with the processor (as a customer's default card) for charges the member is not present for. */
export class SavedCards {
  constructor(private readonly gateway: PaymentGateway) {}

  /** Creates a processor customer holding the card behind `token`. */
  async save(token: string, email: string, name: string, idempotencyKey: string): Promise<SaveCardResult> {
    try {
      const customer = await this.gateway.stripe.customers.create({ source: token, email, name }, { idempotencyKey });
      const sourceId = typeof customer.default_source === 'string' ? customer.default_source : (customer.default_source?.id ?? null);
      const source = sourceId ? await this.gateway.stripe.customers.retrieveSource(customer.id, sourceId) : null;
      return { outcome: 'saved', customerId: customer.id, card: cardOnFile(source) };
    } catch (err) {
      return { outcome: 'declined', message: refusal(err) };
    }
  }

  /** Replaces the customer's default card with the card behind `token`. */
  async replace(customerId: string, token: string): Promise<SaveCardResult> {
    try {
      const card = await this.gateway.stripe.customers.createSource(customerId, { source: token });
      await this.gateway.stripe.customers.update(customerId, { default_source: card.id });
      return { outcome: 'saved', customerId, card: cardOnFile(card) };
    } catch (err) {
      return { outcome: 'declined', message: refusal(err) };
    }
  }

  /** Charges the customer's default card once; the idempotency key makes a repeated attempt count once. */
  charge(customerId: string, amountCents: number, description: string, idempotencyKey: string, metadata: Record<string, string>): Promise<ChargeResult> {
    return this.gateway.charge({ customerId, token: '', amountCents, description, idempotencyKey, metadata });
  }
}

/** Brand and last four of a card source; null for anything else the processor might hold (a bank account). */
function cardOnFile(source: Stripe.CustomerSource | null): CardOnFile | null {
  return source && source.object === 'card' ? { brand: source.brand, last4: source.last4 } : null;
}

function refusal(err: unknown): string {
  if (err instanceof Stripe.errors.StripeCardError || err instanceof Stripe.errors.StripeInvalidRequestError) return err.message;
  throw err;
}
