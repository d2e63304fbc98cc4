import Stripe from 'stripe';

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

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Card charges and refunds through the Stripe SDK, with the retry rules of Stripe's idempotency guide. */
export class PaymentGateway {
  constructor(
    readonly stripe: Stripe,
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

export function cardCountry(charge: Stripe.Charge): string | null {
  const card = charge.payment_method_details?.card ?? (charge.source as Stripe.Card | null);
  return (card && 'country' in card ? card.country : null) ?? null;
}
