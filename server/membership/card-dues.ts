import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { conflict } from '../platform/app-error';
import { estimateFeeCents, PROCESSOR_FEES } from '../books/processor-fees';
import type { PaymentGateway } from '../payments/payment-gateway';
import { SavedCards } from '../payments/saved-cards';
import type { SettingsService } from '../settings/settings-service';
import type { DuesSettlement } from './dues-settlement';
import type { MembershipRepository, MembershipRow, PlanRow } from './membership-repository';
import type { Term, TermPolicy } from './terms';

/** How a term is paid by card: a one-time token, or the card saved with the processor. */
export type CardSource = { token: string } | { customerId: string; keyTail: string };

export type CardDuesResult = { outcome: 'paid'; membership: MembershipRow } | { outcome: 'declined' | 'unknown'; message: string };

/**
 * Card payment of one term. The payment row is written before the processor is asked, so a charge whose outcome is
 * unknown leaves a record staff can check and retry; the idempotency key ties retries to one charge.
 */
export class CardDues {
  readonly savedCards: SavedCards;

  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly settlement: DuesSettlement,
    private readonly settings: SettingsService,
    private readonly gateway: PaymentGateway,
  ) {
    this.savedCards = new SavedCards(gateway);
  }

  /** Charges the term and, when paid, settles it; a decline or unknown outcome is recorded on the payment row. */
  async pay(m: MembershipRow, plan: PlanRow, term: Term, amountCents: number, source: CardSource, ctx: { today: string; policy: TermPolicy; actorUserId: number | null; at: Date }): Promise<CardDuesResult> {
    const tail = 'token' in source ? createHash('sha256').update(source.token).digest('hex').slice(0, 16) : `saved-${source.keyTail}`;
    const key = `card:${m.id}:${term.end}:${tail}`;
    const earlier = await this.repo.paymentByKey(key);
    if (earlier?.status === 'paid') return { outcome: 'paid', membership: (await this.repo.byId(Number(m.id)))! };
    const payment =
      earlier ??
      (await this.repo
        .insertPayment(this.db, { membership_id: m.id, plan_id: plan.id, status: 'attempted', method: 'card', amount_cents: amountCents, idempotency_key: key, term_start: term.start, term_end: term.end, created_at: ctx.at })
        .catch((err: { code?: string }) => {
          // A second submit of the same payment while the first is still with the processor.
          throw err.code === '23505' ? conflict('payment_in_progress', 'This payment is already being processed; check your membership in a moment.') : err;
        }));
    const description = `Club dues ${term.start} to ${term.end}, member ${m.member_number}`;
    const metadata = { membershipPayment: String(payment.id), memberNumber: m.member_number };
    const result =
      'token' in source
        ? await this.gateway.charge({ token: source.token, amountCents, description, idempotencyKey: key, metadata })
        : await this.savedCards.charge(source.customerId, amountCents, description, key, metadata);
    if (result.outcome !== 'paid') {
      await this.repo.updatePayment(this.db, Number(payment.id), { status: result.outcome, failure_message: result.message.slice(0, 400) });
      return { outcome: result.outcome, message: result.message };
    }
    const fees = await this.settings.get(PROCESSOR_FEES);
    const feeCents = estimateFeeCents(amountCents, result.cardCountry !== null && result.cardCountry !== 'CA', fees);
    const membership = await this.db.transaction(async (trx) => {
      const locked = (await this.repo.byId(Number(m.id), trx, true))!;
      return this.settlement.settle(trx, locked, payment, term, { ...ctx, feeCents, chargeId: result.chargeId });
    });
    return { outcome: 'paid', membership };
  }
}
