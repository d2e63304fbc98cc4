import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { estimateFeeCents, PROCESSOR_FEES } from '../books/processor-fees';
import { cardCountry, type PaymentGateway } from '../payments/payment-gateway';
import { SavedCards, type SaveCardResult } from '../payments/saved-cards';
import type { SettingsService } from '../settings/settings-service';
import type { DuesSettlement } from './dues-settlement';
import type { MembershipRepository, MembershipRow, PaymentRow, PlanRow } from './membership-repository';
import type { DuesPaymentRepository } from './dues-payment-repository';
import type { Term, TermPolicy } from './terms';

/**
 * How a term is paid by card: a one-time token, the card saved with the processor, or a card to save first (saved
 * only once this request holds the term, so a second submit never saves it again).
 */
export type CardSource =
  | { token: string }
  | { customerId: string; keyTail: string }
  | { keyTail: string; saveCard: () => Promise<SaveCardResult> };

/** `alreadyPaid`: the term was paid by an earlier request, and this one charged nothing. */
export type CardDuesResult =
  | { outcome: 'paid'; membership: MembershipRow; alreadyPaid: boolean }
  | { outcome: 'declined' | 'unknown'; message: string }
  | { outcome: 'in_progress' };

/**
 * How long an attempt handed to the processor holds its term against other requests. The gateway gives up within
 * about 35 s (four tries of at most 8 s, see payment-gateway and stripe-client); an attempt older than this
 * belongs to a process that is gone.
 */
const ATTEMPT_HOLD_MS = 2 * 60_000;

type SettleContext = { today: string; policy: TermPolicy; actorUserId: number | null; at: Date };

type Claim =
  | { kind: 'claimed'; payment: PaymentRow }
  | { kind: 'paid'; membership: MembershipRow }
  | { kind: 'in_progress' }
  | { kind: 'declined'; message: string };

/**
 * Card payment of one term. The payment row is written before the processor is asked, so a charge whose outcome is
 * unknown leaves a record staff can check and retry; the idempotency key ties retries to one charge, and one
 * attempt at a time holds the term, so one member's term is charged at most once.
 */
export class CardDues {
  readonly savedCards: SavedCards;

  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly paymentRepo: DuesPaymentRepository,
    private readonly settlement: DuesSettlement,
    private readonly settings: SettingsService,
    private readonly gateway: PaymentGateway,
  ) {
    this.savedCards = new SavedCards(gateway);
  }

  /**
   * The key tail for a saved card that every request for the same attempt shares: the amount (a changed plan is a
   * different request to the processor) and the count of the term's earlier attempts that ended declined or
   * refunded (the next try after one is a new charge, never the processor's replay of the old answer).
   */
  async savedCardTail(m: MembershipRow, term: Term, amountCents: number, purpose: 'member' | 'join'): Promise<string> {
    const ended = (await this.paymentRepo.cardPaymentsForTerm(m.id, term.end)).filter(
      (p) => p.status === 'declined' || p.status === 'refunded',
    );
    return `${purpose}-${amountCents}-${ended.length}`;
  }

  /** Charges the term and, when paid, settles it; a decline or unknown outcome is recorded on the payment row. */
  async pay(
    m: MembershipRow,
    plan: PlanRow,
    term: Term,
    amountCents: number,
    source: CardSource,
    ctx: SettleContext,
  ): Promise<CardDuesResult> {
    const tail =
      'token' in source
        ? createHash('sha256').update(source.token).digest('hex').slice(0, 16)
        : `saved-${source.keyTail}`;
    const key = `card:${m.id}:${term.end}:${tail}`;
    const earlier = await this.resolveUnanswered(m, term, key, ctx);
    if (earlier) return earlier;
    const claim = await this.claim(m, plan, term, amountCents, key, ctx.at);
    if (claim.kind === 'paid') return { outcome: 'paid', membership: claim.membership, alreadyPaid: true };
    if (claim.kind === 'in_progress') return { outcome: 'in_progress' };
    if (claim.kind === 'declined') return { outcome: 'declined', message: claim.message };
    const payment = claim.payment;
    let customerId = 'customerId' in source ? source.customerId : null;
    if ('saveCard' in source) {
      const saved = await source.saveCard();
      if (saved.outcome === 'declined') return this.failed(payment, { outcome: 'declined', message: saved.message });
      customerId = saved.customerId;
    }
    const description = `Club dues ${term.start} to ${term.end}, member ${m.member_number}`;
    const metadata = { membershipPayment: String(payment.id), memberNumber: m.member_number };
    const result =
      'token' in source
        ? await this.gateway.charge({ token: source.token, amountCents, description, idempotencyKey: key, metadata })
        : await this.savedCards.charge(customerId!, amountCents, description, key, metadata);
    if (result.outcome !== 'paid') return this.failed(payment, result);
    const membership = await this.settlePaid(
      m,
      payment,
      term,
      { chargeId: result.chargeId, amountCents, cardCountry: result.cardCountry },
      ctx,
    );
    return { outcome: 'paid', membership, alreadyPaid: false };
  }

  /**
   * An earlier attempt on this term under another key (another card) whose answer never came, its outcome unknown
   * or its process gone, may have taken the money. The processor is asked before any new charge: a charge found pays
   * the term, and none found closes that attempt so the payment history says it did not charge.
   */
  private async resolveUnanswered(
    m: MembershipRow,
    term: Term,
    key: string,
    ctx: SettleContext,
  ): Promise<CardDuesResult | null> {
    const heldSince = ctx.at.getTime() - ATTEMPT_HOLD_MS;
    const unanswered = (await this.paymentRepo.cardPaymentsForTerm(m.id, term.end)).filter(
      (p) =>
        p.idempotency_key !== key &&
        (p.status === 'unknown' ||
          (p.status === 'attempted' && (p.attempted_at === null || p.attempted_at.getTime() <= heldSince))),
    );
    for (const p of unanswered) {
      let charge: Awaited<ReturnType<PaymentGateway['findCharge']>>;
      try {
        charge = await this.gateway.findCharge('membershipPayment', String(p.id));
      } catch (err) {
        return {
          outcome: 'unknown',
          message: `Could not check an earlier payment with the processor: ${(err as Error).message}`,
        };
      }
      if (charge) {
        const membership = await this.settlePaid(
          m,
          p,
          term,
          { chargeId: charge.id, amountCents: charge.amount, cardCountry: cardCountry(charge) },
          ctx,
        );
        return { outcome: 'paid', membership, alreadyPaid: true };
      }
      await this.db.transaction(async (trx) => {
        // Only if no other request took the attempt up again (same key) while the processor was asked.
        const current = await this.paymentRepo.lockPayment(trx, p.id);
        if (current?.status !== p.status || current.attempted_at?.getTime() !== p.attempted_at?.getTime()) return;
        await this.paymentRepo.updatePayment(trx, p.id, {
          status: 'declined',
          failure_message: 'Not charged: the processor holds no charge for this attempt.',
        });
      });
    }
    return null;
  }

  /** Settles a payment the processor charged, once: a second request that finds it already paid only reads the membership. */
  private async settlePaid(
    m: MembershipRow,
    payment: PaymentRow,
    term: Term,
    charge: { chargeId: string; amountCents: number; cardCountry: string | null },
    ctx: SettleContext,
  ): Promise<MembershipRow> {
    const fees = await this.settings.get(PROCESSOR_FEES);
    const feeCents = estimateFeeCents(
      charge.amountCents,
      charge.cardCountry !== null && charge.cardCountry !== 'CA',
      fees,
    );
    return this.db.transaction(async (trx) => {
      const locked = (await this.repo.lockById(trx, m.id))!;
      if ((await this.paymentRepo.lockPayment(trx, payment.id))?.status === 'paid') return locked;
      return this.settlement.settle(trx, locked, payment, term, { ...ctx, feeCents, chargeId: charge.chargeId });
    });
  }

  /**
   * Takes the term for this request, or says why not. The membership row lock makes claims on one member take
   * turns across processes; it is held only while the attempt is recorded, never while the processor is asked.
   */
  private claim(
    m: MembershipRow,
    plan: PlanRow,
    term: Term,
    amountCents: number,
    key: string,
    at: Date,
  ): Promise<Claim> {
    return this.db.transaction(async (trx): Promise<Claim> => {
      const locked = (await this.repo.lockById(trx, m.id))!;
      const earlier = await this.paymentRepo.cardPaymentsForTerm(m.id, term.end, trx);
      if (earlier.some((p) => p.status === 'paid')) return { kind: 'paid', membership: locked };
      const heldSince = at.getTime() - ATTEMPT_HOLD_MS;
      if (
        earlier.some((p) => p.status === 'attempted' && p.attempted_at !== null && p.attempted_at.getTime() > heldSince)
      )
        return { kind: 'in_progress' };
      const same = earlier.find((p) => p.idempotency_key === key);
      // The processor would only replay its first answer to this key, so give that answer without asking again.
      if (same?.status === 'declined')
        return { kind: 'declined', message: same.failure_message ?? 'The card was declined.' };
      if (same?.status === 'refunded')
        return { kind: 'declined', message: 'That card payment was refunded; enter the card again to pay.' };
      // An unknown outcome, or an attempt whose process is gone: ask again with the same key, which the processor charges once.
      if (same)
        return {
          kind: 'claimed',
          payment: await this.paymentRepo.updatePayment(trx, same.id, {
            status: 'attempted',
            attempted_at: at,
          }),
        };
      const payment = await this.paymentRepo.insertPayment(trx, {
        membership_id: m.id,
        plan_id: plan.id,
        status: 'attempted',
        method: 'card',
        amount_cents: amountCents,
        idempotency_key: key,
        term_start: term.start,
        term_end: term.end,
        attempted_at: at,
        created_at: at,
      });
      return { kind: 'claimed', payment };
    });
  }

  private async failed(
    payment: PaymentRow,
    result: { outcome: 'declined' | 'unknown'; message: string },
  ): Promise<CardDuesResult> {
    await this.db.transaction((trx) =>
      this.paymentRepo.updatePayment(trx, payment.id, {
        status: result.outcome,
        failure_message: result.message.slice(0, 400),
      }),
    );
    return { outcome: result.outcome, message: result.message };
  }
}
