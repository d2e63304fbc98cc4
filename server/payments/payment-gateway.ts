import Stripe from 'stripe';
import { signedInTheFuture, SIGNATURE_TOLERANCE_SECONDS } from './webhook-signature';

/** What a charge attempt came to. `unknown` means the processor may or may not have taken the money. */
export type ChargeResult =
  | { outcome: 'paid'; chargeId: string; amountCents: number; feeCents: number | null; cardCountry: string | null }
  | { outcome: 'declined'; message: string; declineCode: string | null }
  | { outcome: 'unknown'; message: string };

export interface ChargeRequest {
  amountCents: number;
  token: string;
  description: string;
  idempotencyKey: string;
  metadata: Record<string, string>;
  customerId?: string;
}

/** A card the processor holds for a customer, as Padside may show it: never its number. */
export interface ProcessorCard {
  brand: string;
  last4: string;
  expMonth: number;
  expYear: number;
}

/** What asking the processor to keep a card came to: the customer holding it, or the processor's refusal. */
export type KeepCardResult =
  { outcome: 'saved'; customerId: string; card: ProcessorCard | null } | { outcome: 'declined'; message: string };

/** A verified processor event, or why its signature was refused. */
export type SignedEvent = { event: Stripe.Event } | { refused: 'unsigned' | 'future' | 'mismatch' };

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Every call to the processor: charges and refunds (with the retry rules of Stripe's idempotency guide), the customers
 * that keep a card on file, and the signature check on its events. Nothing else holds the SDK client.
 */
export class PaymentGateway {
  constructor(
    private readonly stripe: Stripe,
    private readonly retryDelaysMs: number[] = [200, 600, 1500],
  ) {}

  /** Charges once: 429 and network errors retry with the same key; a 5xx leaves the outcome unknown. */
  async charge(req: ChargeRequest): Promise<ChargeResult> {
    for (let attempt = 0; ; attempt++) {
      try {
        const charge = await this.stripe.charges.create(
          {
            amount: req.amountCents,
            currency: 'cad',
            description: req.description,
            metadata: req.metadata,
            ...(req.customerId
              ? { customer: req.customerId, ...(req.token ? { source: req.token } : {}) }
              : { source: req.token }),
          },
          { idempotencyKey: req.idempotencyKey },
        );
        if (charge.status === 'failed')
          return {
            outcome: 'declined',
            message: charge.failure_message ?? 'The card was declined.',
            declineCode: charge.failure_code ?? null,
          };
        return {
          outcome: 'paid',
          chargeId: charge.id,
          amountCents: charge.amount,
          feeCents: null,
          cardCountry: cardCountry(charge),
        };
      } catch (err) {
        if (err instanceof Stripe.errors.StripeCardError) {
          return { outcome: 'declined', message: err.message, declineCode: err.decline_code ?? err.code ?? null };
        }
        const retriable =
          err instanceof Stripe.errors.StripeRateLimitError || err instanceof Stripe.errors.StripeConnectionError;
        if (retriable && attempt < this.retryDelaysMs.length) {
          await sleep(this.retryDelaysMs[attempt]);
          continue;
        }
        if (err instanceof Stripe.errors.StripeInvalidRequestError) {
          return { outcome: 'declined', message: err.message, declineCode: err.code ?? null };
        }
        return { outcome: 'unknown', message: (err as Error).message };
      }
    }
  }

  /** The newest charge whose metadata has `key` = `value`, searching the most recent `scan` charges. */
  async findCharge(key: string, value: string, scan = 500): Promise<Stripe.Charge | null> {
    let found: Stripe.Charge | null = null;
    let startingAfter: string | undefined;
    for (let seen = 0; seen < scan && !found;) {
      const page = await this.stripe.charges.list({
        limit: 100,
        ...(startingAfter ? { starting_after: startingAfter } : {}),
      });
      found = page.data.find((c) => c.metadata?.[key] === value && c.status === 'succeeded') ?? null;
      seen += page.data.length;
      if (!page.has_more || page.data.length === 0) break;
      startingAfter = page.data[page.data.length - 1].id;
    }
    return found;
  }

  /**
   * Refunds part or all of a charge; the idempotency key makes a retried refund count once, and the same key in the
   * refund's metadata lets reconciliation match a refund whose answer never came back to its claim.
   */
  async refund(chargeId: string, amountCents: number, idempotencyKey: string): Promise<Stripe.Refund> {
    return this.stripe.refunds.create(
      { charge: chargeId, amount: amountCents, metadata: { padsideRefundKey: idempotencyKey } },
      { idempotencyKey },
    );
  }

  /** Every refund the processor holds for one charge, oldest first. */
  async refundsOf(chargeId: string): Promise<Stripe.Refund[]> {
    const all: Stripe.Refund[] = [];
    for await (const r of this.stripe.refunds.list({ charge: chargeId, limit: 100 })) all.push(r);
    return all.sort((a, b) => a.created - b.created || a.id.localeCompare(b.id));
  }

  /** The charges behind the processor's most recent `scan` refunds, newest first. */
  async recentlyRefundedCharges(scan = 300): Promise<string[]> {
    const charges = new Set<string>();
    let seen = 0;
    for await (const r of this.stripe.refunds.list({ limit: 100 })) {
      if (typeof r.charge === 'string') charges.add(r.charge);
      else if (r.charge) charges.add(r.charge.id);
      if (++seen >= scan) break;
    }
    return [...charges];
  }

  /**
   * The fee the processor actually kept on a charge, from the charge's balance transaction; null while it is not
   * known (or, with the local fake, never: it has no balance transactions).
   */
  async actualFeeCents(chargeId: string): Promise<number | null> {
    try {
      const charge = await this.stripe.charges.retrieve(chargeId);
      const bt = charge.balance_transaction;
      if (!bt) return null;
      const tx = typeof bt === 'string' ? await this.stripe.balanceTransactions.retrieve(bt) : bt;
      return typeof tx.fee === 'number' ? tx.fee : null;
    } catch (err) {
      // Unknown charge or no balance-transaction endpoint: keep the estimate and try again on the next pass.
      if (err instanceof Stripe.errors.StripeError) return null;
      throw err;
    }
  }

  /** Creates a processor customer holding the card behind `token`; the idempotency key makes a retry create one. */
  async createCustomer(token: string, email: string, name: string, idempotencyKey: string): Promise<KeepCardResult> {
    try {
      const customer = await this.stripe.customers.create({ source: token, email, name }, { idempotencyKey });
      const sourceId = sourceIdOf(customer.default_source);
      const source = sourceId ? await this.stripe.customers.retrieveSource(customer.id, sourceId) : null;
      return { outcome: 'saved', customerId: customer.id, card: processorCard(source) };
    } catch (err) {
      return { outcome: 'declined', message: refusal(err) };
    }
  }

  /** Adds the card behind `token` to the customer and makes it the default one. */
  async replaceDefaultCard(customerId: string, token: string): Promise<KeepCardResult> {
    try {
      const card = await this.stripe.customers.createSource(customerId, { source: token });
      await this.stripe.customers.update(customerId, { default_source: card.id });
      return { outcome: 'saved', customerId, card: processorCard(card) };
    } catch (err) {
      return { outcome: 'declined', message: refusal(err) };
    }
  }

  /** The customer's default card; null when the customer is gone or holds no card. */
  async defaultCard(customerId: string): Promise<ProcessorCard | null> {
    const customer = await this.stripe.customers.retrieve(customerId);
    if (customer.deleted) return null;
    const sourceId = sourceIdOf(customer.default_source);
    return sourceId ? processorCard(await this.stripe.customers.retrieveSource(customerId, sourceId)) : null;
  }

  /**
   * Removes every card the customer holds and blanks its name and e-mail. The customer itself stays, because the
   * processor's own records of past charges point at it.
   */
  async forgetCustomer(customerId: string): Promise<void> {
    const customer = await this.stripe.customers.retrieve(customerId, { expand: ['sources'] });
    if (customer.deleted) return;
    const ids = new Set((customer.sources?.data ?? []).map((s) => s.id));
    const defaultId = sourceIdOf(customer.default_source);
    if (defaultId) ids.add(defaultId);
    for (const id of ids) await this.stripe.customers.deleteSource(customerId, id);
    await this.stripe.customers.update(customerId, { name: '', email: '', description: '' });
  }

  /**
   * The processor event in `payload` when `signature` proves it came from the processor with `secret`, signed within
   * the tolerance of `nowSeconds` either way (the SDK itself refuses only old timestamps).
   */
  signedEvent(payload: Buffer, signature: string | undefined, secret: string, nowSeconds: number): SignedEvent {
    if (!signature) return { refused: 'unsigned' };
    if (signedInTheFuture(signature, nowSeconds)) return { refused: 'future' };
    try {
      return { event: this.stripe.webhooks.constructEvent(payload, signature, secret, SIGNATURE_TOLERANCE_SECONDS) };
    } catch {
      return { refused: 'mismatch' };
    }
  }

  /** Whether the processor answers at all. */
  async reachable(): Promise<boolean> {
    try {
      await this.stripe.charges.list({ limit: 1 });
      return true;
    } catch {
      return false;
    }
  }
}

function sourceIdOf(source: string | Stripe.CustomerSource | null): string | null {
  return typeof source === 'string' ? source : (source?.id ?? null);
}

/** Brand, last four and expiry of a card source; null for anything else a customer might hold (a bank account). */
function processorCard(source: Stripe.CustomerSource | null): ProcessorCard | null {
  return source && source.object === 'card'
    ? { brand: source.brand, last4: source.last4, expMonth: source.exp_month, expYear: source.exp_year }
    : null;
}

/** The processor's message when it refused the card or the request; anything else is not a refusal and goes on up. */
function refusal(err: unknown): string {
  if (err instanceof Stripe.errors.StripeCardError || err instanceof Stripe.errors.StripeInvalidRequestError)
    return err.message;
  throw err;
}

export function cardCountry(charge: Stripe.Charge): string | null {
  const card = charge.payment_method_details?.card ?? (charge.source as Stripe.Card | null);
  return (card && 'country' in card ? card.country : null) ?? null;
}
