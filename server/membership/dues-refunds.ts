import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import Stripe from 'stripe';
import { recordMovement } from '../books/ledger-writer';
import { enqueueEmail } from '../mail/outbox';
import type { PaymentGateway } from '../payments/payment-gateway';
import { AppError, badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { ClubCalendar } from '../platform/club-calendar';
import type { SettingsService } from '../settings/settings-service';
import { termPolicy, type DuesSettlement } from './dues-settlement';
import { refundMail } from './membership-mail';
import { type MembershipRepository, type MembershipRow, type PaymentRow } from './membership-repository';
import type { DuesPaymentRepository } from './dues-payment-repository';
import { MEMBERSHIP_SETTINGS } from './membership-settings';
import type { RefundRequest } from '../../contracts/membership/staff-member-schemas';

// A claim older than this has outlived any processor call that could still answer (common practice, no source).
const STALE_CLAIM_MS = 10 * 60_000;

/**
 * Dues refunds. Every one is decided under the member's row lock (then the payment's), reading what is left to
 * refund inside that transaction. Cash, e-transfer and cheque refunds are recorded there and then; card refunds are
 * claimed first (a `requested` refund row with its own key), then asked of the processor, then recorded.
 */
export class DuesRefunds {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly paymentRepo: DuesPaymentRepository,
    private readonly settings: SettingsService,
    private readonly settlement: DuesSettlement,
    private readonly gateway: PaymentGateway,
    private readonly clock: Clock,
    private readonly calendar: ClubCalendar,
    private readonly log: Logger,
  ) {}

  /**
   * Refunds part or all of a payment. `requestKey` (the client's Idempotency-Key) makes a repeated request answer
   * with the first one's result instead of refunding again.
   */
  async refund(actorId: number, memberId: number, input: RefundRequest, requestKey: string | null): Promise<void> {
    const claim = await this.db.transaction(async (trx) => {
      const m = await this.repo.lockById(trx, memberId);
      if (!m) throw notFound('No such member.');
      if (requestKey) {
        const earlier = await this.paymentRepo.refundByRequestKey(memberId, requestKey, trx);
        if (earlier) return { replay: earlier };
      }
      const payment = await this.paymentRepo.lockPayment(trx, input.paymentId);
      if (!payment || payment.membership_id !== memberId || payment.entry !== 'payment')
        throw badRequest('Choose a payment of this member.', { paymentId: 'Choose a payment of this member.' });
      if (payment.status !== 'paid' && payment.status !== 'refunded')
        throw badRequest('Only a paid payment can be refunded.', { paymentId: 'This payment was not paid.' });
      if (input.amountCents < 1 || input.amountCents > payment.amount_cents)
        throw badRequest('The refund is more than the payment.', {
          amountCents: `At most ${payment.amount_cents} cents can be refunded.`,
        });
      const left = payment.amount_cents - (await this.paymentRepo.refundedCents(payment.id, trx));
      if (input.amountCents > left)
        throw conflict('over_refund', 'The refund is more than what is left of the payment.', {
          amountCents: left ? `At most ${left} cents are left to refund.` : 'This payment is already refunded.',
        });
      if (payment.method === 'card' && !payment.processor_charge_id)
        throw badRequest('This card payment has no processor charge to refund.', {
          paymentId: 'No processor charge on record.',
        });
      const refund = await this.paymentRepo.insertPayment(trx, {
        membership_id: m.id,
        plan_id: payment.plan_id,
        entry: 'refund',
        status: payment.method === 'card' ? 'requested' : 'refunded',
        method: payment.method,
        amount_cents: -input.amountCents,
        idempotency_key: `dues-refund-${randomUUID()}`,
        request_key: requestKey,
        refund_of: payment.id,
        note: input.reason,
        processor_charge_id: payment.processor_charge_id,
        recorded_by: actorId,
        created_at: this.clock.now(),
      });
      if (payment.method !== 'card') await this.book(trx, m, payment, refund, actorId, input.reason);
      return { claim: payment.method === 'card' ? refund : null, chargeId: payment.processor_charge_id };
    });
    if (claim.replay) return this.answerReplay(claim.replay, input);
    if (!claim.claim) return;
    const r = claim.claim;
    let processorRefund: Stripe.Refund;
    try {
      processorRefund = await this.gateway.refund(claim.chargeId!, -r.amount_cents, r.idempotency_key);
    } catch (err) {
      if (err instanceof Stripe.errors.StripeInvalidRequestError) {
        await this.settle(r.id, null, err.message);
        throw conflict('processor_refused', `The card processor refused the refund: ${err.message}`);
      }
      this.log.warn(
        { memberId, refundId: r.id, message: (err as Error).message },
        'dues refund outcome unknown; claim left requested',
      );
      throw new AppError(
        502,
        'processor_unreachable',
        'The card processor did not answer. The refund is held and will be settled from the processor shortly; do not refund it again.',
      );
    }
    await this.settle(r.id, processorRefund.id, null);
  }

  /** Records every refund the processor holds for a dues charge that Padside does not know yet; true if it is a dues charge. */
  async syncCharge(chargeId: string): Promise<boolean> {
    const found = await this.paymentRepo.paymentByCharge(chargeId);
    if (!found) return false;
    const held = (await this.gateway.refundsOf(chargeId)).filter(
      (r) => r.status === 'succeeded' || r.status === 'pending',
    );
    await this.db.transaction(async (trx) => {
      const m = (await this.repo.lockById(trx, found.membership_id))!;
      const payment = (await this.paymentRepo.lockPayment(trx, found.id))!;
      const known = await this.paymentRepo.refundsOf(payment.id, trx);
      for (const pr of held) {
        if (known.some((k) => k.processor_refund_id === pr.id)) continue;
        const claim = known.find((k) => k.idempotency_key === pr.metadata?.padsideRefundKey);
        if (claim) {
          if (claim.status !== 'refunded') await this.recordSucceeded(trx, m, payment, claim, pr.id);
          continue;
        }
        const left = payment.amount_cents - (await this.paymentRepo.refundedCents(payment.id, trx, ['refunded']));
        const amount = Math.min(pr.amount, left);
        if (amount < 1) continue;
        const refund = await this.paymentRepo.insertPayment(trx, {
          membership_id: m.id,
          plan_id: payment.plan_id,
          entry: 'refund',
          status: 'refunded',
          method: 'card',
          amount_cents: -amount,
          idempotency_key: `dues-refund-processor-${pr.id}`,
          refund_of: payment.id,
          note: 'Refunded at the payment processor',
          processor_charge_id: chargeId,
          processor_refund_id: pr.id,
          created_at: this.clock.now(),
        });
        await this.book(trx, m, payment, refund, null, 'Refunded at the payment processor');
      }
    });
    return true;
  }

  /** Settles card refund claims whose processor answer never came, from the processor's own list. */
  async settleStaleClaims(): Promise<number> {
    const stale = await this.paymentRepo.staleRefundClaims(new Date(this.clock.now().getTime() - STALE_CLAIM_MS));
    for (const claim of stale) {
      const found = (await this.gateway.refundsOf(claim.processor_charge_id!)).find(
        (pr) => pr.metadata?.padsideRefundKey === claim.idempotency_key,
      );
      await this.settle(
        claim.id,
        found?.id ?? null,
        found ? null : 'No refund reached the processor; the claim was released.',
      );
    }
    return stale.length;
  }

  private answerReplay(earlier: PaymentRow, input: RefundRequest): void {
    if (earlier.refund_of !== input.paymentId || -earlier.amount_cents !== input.amountCents)
      throw conflict('request_key_reused', 'That Idempotency-Key was used for a different refund.');
    if (earlier.status === 'requested')
      throw conflict('refund_in_progress', 'This refund is already under way; reload the member in a moment.');
    if (earlier.status === 'failed')
      throw conflict(
        'processor_refused',
        `The card processor refused the refund: ${earlier.failure_message ?? 'no reason given'}`,
      );
  }

  /** The outcome of a card claim, under the member's lock: refunded (with its processor id) or failed. */
  private async settle(refundId: number, processorRefundId: string | null, failure: string | null): Promise<void> {
    await this.db.transaction(async (trx) => {
      const claim = (await this.paymentRepo.payment(refundId, trx))!;
      const m = (await this.repo.lockById(trx, claim.membership_id))!;
      const fresh = (await this.paymentRepo.lockPayment(trx, refundId))!;
      if (fresh.status !== 'requested') return;
      if (!processorRefundId) {
        await this.paymentRepo.updatePayment(trx, refundId, {
          status: 'failed',
          failure_message: (failure ?? 'refused').slice(0, 400),
        });
        return;
      }
      const payment = (await this.paymentRepo.lockPayment(trx, fresh.refund_of!))!;
      await this.recordSucceeded(trx, m, payment, fresh, processorRefundId);
    });
  }

  private async recordSucceeded(
    trx: Knex.Transaction,
    m: MembershipRow,
    payment: PaymentRow,
    claim: PaymentRow,
    processorRefundId: string,
  ): Promise<void> {
    const refund = await this.paymentRepo.updatePayment(trx, claim.id, {
      status: 'refunded',
      processor_refund_id: processorRefundId,
      failure_message: null,
    });
    await this.book(trx, m, payment, refund, claim.recorded_by, claim.note ?? '');
  }

  /**
   * The writes that follow a refund that happened, in its transaction: the payment marked refunded once nothing is
   * left, the term taken back when the payment that bought the current term is refunded in full, the negative
   * money movement, the receipt and the audit line.
   */
  private async book(
    trx: Knex.Transaction,
    m: MembershipRow,
    payment: PaymentRow,
    refund: PaymentRow,
    actorId: number | null,
    reason: string,
  ): Promise<void> {
    const policy = termPolicy(await this.settings.get(MEMBERSHIP_SETTINGS, trx));
    const today = this.calendar.today();
    const amountCents = -refund.amount_cents;
    const full = (await this.paymentRepo.refundedCents(payment.id, trx, ['refunded'])) >= payment.amount_cents;
    if (full) await this.paymentRepo.updatePayment(trx, payment.id, { status: 'refunded' });
    let termEnd = m.term_end;
    if (full && payment.term_end === termEnd) {
      termEnd = payment.previous_term_end;
      const reverted = await this.repo.update(trx, m.id, {
        term_end: termEnd,
        term_start: termEnd ? m.term_start : null,
      });
      await this.settlement.refreshStatus(trx, reverted, today, policy, actorId);
    }
    await recordMovement(trx, {
      occurredAt: this.clock.now(),
      kind: 'refund',
      source: 'dues',
      reference: m.member_number,
      counterparty: m.legal_name,
      grossCents: -amountCents,
      processorChargeId: payment.processor_charge_id,
      method: payment.method,
      idempotencyKey: `dues:${refund.idempotency_key}`,
    });
    await enqueueEmail(
      trx,
      refundMail(await this.settlement.mailContext(trx, m), {
        refundId: refund.id,
        amountCents,
        method: payment.method,
        termEnd,
      }),
    );
    await this.repo.addAudit(trx, m.id, actorId, 'refunded', {
      paymentId: payment.id,
      amountCents,
      reason,
      termEnd,
      origin: actorId === null && refund.processor_refund_id ? 'processor' : 'staff',
    });
  }
}
