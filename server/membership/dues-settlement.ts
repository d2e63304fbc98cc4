import type { Knex } from 'knex';
import type { UserRepository } from '../auth/user-repository';
import { recordMovement } from '../books/ledger-writer';
import { enqueueEmail } from '../mail/outbox';
import { lapsedMail, receiptMail, type MemberMailContext } from './membership-mail';
import { type MembershipRepository, type MembershipRow, type PaymentRow } from './membership-repository';
import type { PlanRepository } from './plan-repository';
import type { DuesPaymentRepository } from './dues-payment-repository';
import type { MembershipSettings } from './membership-settings';
import { isInGoodStanding, statusOn, type MembershipStatus, type Term, type TermPolicy } from './terms';

/** The arithmetic's view of the club settings. */
export function termPolicy(s: MembershipSettings): TermPolicy {
  return { rule: s.termRule, lateSeasonFrom: s.lateSeasonFrom, graceDays: s.graceDays, prorate: s.prorate };
}

/**
 * The writes that follow money: a paid term extends the membership, records the movement, sends the receipt and
 * moves status and the `member` role together, all in the caller's transaction.
 */
export class DuesSettlement {
  constructor(
    private readonly repo: MembershipRepository,
    private readonly planRepo: PlanRepository,
    private readonly paymentRepo: DuesPaymentRepository,
    private readonly users: UserRepository,
    private readonly publicUrl: string,
  ) {}

  /** Mail context for a membership. */
  async mailContext(db: Knex, m: MembershipRow): Promise<MemberMailContext> {
    const user = await this.users.byId(m.user_id, db);
    const plan = await this.planRepo.plan(m.plan_id, db);
    return {
      to: user!.email,
      name: m.legal_name,
      memberNumber: m.member_number,
      planName: plan?.name ?? 'club',
      publicUrl: this.publicUrl,
    };
  }

  /** Marks a payment paid and applies its term; returns the updated membership. */
  async settle(
    trx: Knex.Transaction,
    m: MembershipRow,
    payment: PaymentRow,
    term: Term,
    opts: {
      today: string;
      policy: TermPolicy;
      actorUserId: number | null;
      feeCents?: number;
      chargeId?: string | null;
      at: Date;
    },
  ): Promise<MembershipRow> {
    const paid = await this.paymentRepo.updatePayment(trx, payment.id, {
      status: 'paid',
      processor_charge_id: opts.chargeId ?? null,
      term_start: term.start,
      term_end: term.end,
      previous_term_end: m.term_end,
    });
    const status = statusOn(opts.today, term.end, opts.policy);
    const updated = await this.repo.update(trx, m.id, {
      term_start: term.start,
      term_end: term.end,
      status,
      renewal_attempts: 0,
      next_renewal_attempt_on: null,
      renewal_failed_at: null,
    });
    await this.users.setRole(trx, m.user_id, 'member', isInGoodStanding(status));
    const ctx = await this.mailContext(trx, updated);
    await recordMovement(trx, {
      occurredAt: opts.at,
      kind: payment.method === 'card' ? 'dues_payment' : 'manual_payment',
      source: 'dues',
      reference: m.member_number,
      counterparty: m.legal_name,
      grossCents: payment.amount_cents,
      ...(payment.method === 'card' ? { feeCents: opts.feeCents ?? 0, feeEstimated: true } : {}),
      processorChargeId: opts.chargeId ?? null,
      method: payment.method,
      idempotencyKey: `dues:${payment.idempotency_key}`,
    });
    await enqueueEmail(
      trx,
      receiptMail(ctx, {
        paymentId: paid.id,
        amountCents: paid.amount_cents,
        method: paid.method,
        receiptNumber: paid.receipt_number,
        termStart: term.start,
        termEnd: term.end,
      }),
    );
    await this.repo.addAudit(trx, m.id, opts.actorUserId, 'term_paid', {
      paymentId: paid.id,
      method: paid.method,
      amountCents: paid.amount_cents,
      from: m.term_end,
      to: term.end,
      status: { from: m.status, to: status },
    });
    return updated;
  }

  /**
   * Stores the status the dates give on `today` and moves the role with it. Only the caller whose conditional
   * update wins writes the audit and the lapse e-mail, so two processes running this at once act once.
   */
  async refreshStatus(
    trx: Knex.Transaction,
    m: MembershipRow,
    today: string,
    policy: TermPolicy,
    actorUserId: number | null = null,
  ): Promise<MembershipStatus> {
    const next = statusOn(today, m.term_end, policy, m.renewal_failed_at !== null);
    if (next === m.status) return next;
    if (!(await this.repo.moveStatus(trx, m.id, m.status, next))) return next;
    await this.users.setRole(trx, m.user_id, 'member', isInGoodStanding(next));
    await this.repo.addAudit(trx, m.id, actorUserId, 'status_changed', { from: m.status, to: next, on: today });
    if (next === 'lapsed' && m.renewal_failed_at === null && m.term_end) {
      await enqueueEmail(trx, lapsedMail({ ...(await this.mailContext(trx, m)), membershipId: m.id }, m.term_end!));
    }
    return next;
  }
}
