import Stripe from 'stripe';
import type { ChargeResult, PaymentGateway } from './payment-gateway';

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
    try {
      const customer = await this.gateway.stripe.customers.create({ source: token, email, name }, { idempotencyKey });
      const sourceId =
        typeof customer.default_source === 'string' ? customer.default_source : (customer.default_source?.id ?? null);
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

  /** The customer's default card as brand and last four digits; null when the customer holds no card. */
  async describe(customerId: string): Promise<SavedCardSummary | null> {
    const customer = await this.gateway.stripe.customers.retrieve(customerId);
    if (customer.deleted || !customer.default_source) return null;
    const sourceId = typeof customer.default_source === 'string' ? customer.default_source : customer.default_source.id;
    const card = await this.gateway.stripe.customers.retrieveSource(customerId, sourceId);
    if (card.object !== 'card') return null;
    return { brand: card.brand, last4: card.last4, expMonth: card.exp_month, expYear: card.exp_year };
  }

  /**
   * An account's deletion: removes every card the processor customer holds and blanks the customer's name and e-mail.
   * The customer itself stays, because the processor's own records of past charges point at it.
   */
  async forget(customerId: string): Promise<void> {
    const customer = await this.gateway.stripe.customers.retrieve(customerId, { expand: ['sources'] });
    if (customer.deleted) return;
    const ids = new Set((customer.sources?.data ?? []).map((s) => s.id));
    if (customer.default_source)
      ids.add(typeof customer.default_source === 'string' ? customer.default_source : customer.default_source.id);
    for (const id of ids) await this.gateway.stripe.customers.deleteSource(customerId, id);
    await this.gateway.stripe.customers.update(customerId, { name: '', email: '', description: '' });
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

/** Brand and last four of a card source; null for anything else the processor might hold (a bank account). */
function cardOnFile(source: Stripe.CustomerSource | null): CardOnFile | null {
  return source && source.object === 'card' ? { brand: source.brand, last4: source.last4 } : null;
}

function refusal(err: unknown): string {
  if (err instanceof Stripe.errors.StripeCardError || err instanceof Stripe.errors.StripeInvalidRequestError)
    return err.message;
  throw err;
}
