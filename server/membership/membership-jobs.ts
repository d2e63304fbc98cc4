import type { Knex } from 'knex';
import { enqueueEmail } from '../mail/outbox';
import type { Clock } from '../platform/clock';
import type { ClubCalendar } from '../platform/club-calendar';
import type { SettingsService } from '../settings/settings-service';
import type { CardDues } from './card-dues';
import { termPolicy, type DuesSettlement } from './dues-settlement';
import { reminderMail, renewalDeclinedMail, type ReminderKind } from './membership-mail';
import { type MembershipRepository, type RosterRow } from './membership-repository';
import type { PlanRepository } from './plan-repository';
import type { RosterRepository } from './roster-repository';
import { MEMBERSHIP_SETTINGS } from './membership-settings';
import { addDays, duesFor, termForPayment, type TermPolicy } from './terms';

/**
 * Days after the term end on which auto-renew tries the saved card: three tries over seven days; the third
 * decline lapses the membership. (Padside's own schedule; common practice, no source.)
 */
export const RENEWAL_TRY_OFFSETS = [0, 3, 7] as const;

/** Which reminder is due on `today` for a term ending `termEnd`, if any; windows let a missed day catch up. */
export function dueReminder(today: string, termEnd: string): ReminderKind | null {
  if (today >= addDays(termEnd, -30) && today < addDays(termEnd, -7)) return 'due-30';
  if (today >= addDays(termEnd, -7) && today < termEnd) return 'due-7';
  if (today >= termEnd && today < addDays(termEnd, 14)) return 'due-today';
  if (today >= addDays(termEnd, 14) && today <= addDays(termEnd, 21)) return 'overdue-14';
  return null;
}

/** The daily membership work: status and role, reminders, and auto-renew charges. */
export class MembershipJobs {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly planRepo: PlanRepository,
    private readonly rosterRepo: RosterRepository,
    private readonly settings: SettingsService,
    private readonly settlement: DuesSettlement,
    private readonly cardDues: CardDues,
    private readonly clock: Clock,
    private readonly calendar: ClubCalendar,
  ) {}

  private today(): string {
    return this.calendar.today();
  }

  /** Moves stored status (and the `member` role) to what the dates say today. */
  async refreshStatuses(): Promise<{ checked: number }> {
    const policy = termPolicy(await this.settings.get(MEMBERSHIP_SETTINGS));
    const today = this.today();
    const rows = await this.rosterRepo.standing();
    for (const r of rows) {
      await this.db.transaction(async (trx) =>
        this.settlement.refreshStatus(trx, (await this.repo.lockById(trx, r.id))!, today, policy),
      );
    }
    return { checked: rows.length };
  }

  /**
   * Dues reminders (30 and 7 days before the term end, on the day, 14 days after) and the association reminder
   * (30 days before its expiry). Dues notices are essential mail, sent whatever the opt-out; each goes once per
   * term end because its dedupe key names the membership, the kind and the date.
   */
  async sendReminders(): Promise<{ queued: number }> {
    await this.refreshStatuses();
    const today = this.today();
    let queued = 0;
    for (const r of await this.rosterRepo.standing()) {
      const ctx = { ...(await this.settlement.mailContext(this.db, r)), membershipId: r.id };
      const termEnd = r.term_end;
      const kind = termEnd && r.renewal_failed_at === null ? dueReminder(today, termEnd) : null;
      // Someone with auto-renew on gets no "ended" notice while the card is still being tried.
      if (
        kind &&
        termEnd &&
        !(
          r.auto_renew &&
          r.processor_customer_id &&
          (kind === 'due-today' || kind === 'overdue-14') &&
          r.renewal_attempts < RENEWAL_TRY_OFFSETS.length
        )
      ) {
        const mail = reminderMail(ctx, kind, termEnd, r.auto_renew && r.processor_customer_id !== null);
        if (await this.db.transaction((trx) => enqueueEmail(trx, mail))) queued++;
      }
      const assoc = r.association_expires;
      if (assoc && r.status !== 'lapsed' && today >= addDays(assoc, -30) && today <= assoc) {
        const mail = reminderMail(ctx, 'association-30', assoc, false);
        if (await this.db.transaction((trx) => enqueueEmail(trx, mail))) queued++;
      }
    }
    return { queued };
  }

  /** Charges saved cards of auto-renewing members whose term has ended and whose next try is due. */
  async autoRenew(): Promise<{ paid: number; declined: number; lapsed: number }> {
    const policy = termPolicy(await this.settings.get(MEMBERSHIP_SETTINGS));
    const today = this.today();
    const out = { paid: 0, declined: 0, lapsed: 0 };
    for (const r of await this.rosterRepo.standing()) {
      const termEnd = r.term_end;
      if (!r.auto_renew || !r.processor_customer_id || !termEnd || r.renewal_failed_at !== null) continue;
      const attempt = r.renewal_attempts;
      if (attempt >= RENEWAL_TRY_OFFSETS.length || today < addDays(termEnd, RENEWAL_TRY_OFFSETS[attempt])) continue;
      const claimed = await this.db.transaction((trx) => this.repo.claimRenewalAttempt(trx, r.id, attempt, termEnd));
      if (!claimed) continue;
      await this.tryOnce(r, termEnd, attempt, today, policy, out);
    }
    return out;
  }

  /** One charge of the saved card; a decline schedules the next try or, on the last, lapses the membership. */
  private async tryOnce(
    r: RosterRow,
    termEnd: string,
    attempt: number,
    today: string,
    policy: TermPolicy,
    out: { paid: number; declined: number; lapsed: number },
  ): Promise<void> {
    const plan = (await this.planRepo.plan(r.plan_id))!;
    const term = termForPayment(today, termEnd, policy);
    const amount = duesFor(plan.dues_cents, term, policy);
    const result = await this.cardDues.pay(
      r,
      plan,
      term,
      amount,
      { customerId: r.processor_customer_id!, keyTail: `auto-${attempt}` },
      { today, policy, actorUserId: null, at: this.clock.now() },
    );
    if (result.outcome === 'paid') {
      out.paid++;
      return;
    }
    // The member's own renewal holds the term right now: this try never reached the card, so the next run may use it.
    if (result.outcome === 'in_progress') {
      await this.db.transaction((trx) => this.repo.releaseRenewalAttempt(trx, r.id, attempt));
      return;
    }
    const last = attempt + 1 >= RENEWAL_TRY_OFFSETS.length;
    const nextTry = last ? null : addDays(termEnd, RENEWAL_TRY_OFFSETS[attempt + 1]);
    await this.db.transaction(async (trx) => {
      const m = (await this.repo.lockById(trx, r.id))!;
      const ctx = { ...(await this.settlement.mailContext(trx, m)), membershipId: m.id };
      if (last) {
        const failed = await this.repo.update(trx, m.id, {
          renewal_failed_at: this.clock.now(),
          next_renewal_attempt_on: null,
        });
        await this.repo.addAudit(trx, m.id, null, 'auto_renew_failed', {
          attempts: attempt + 1,
          message: result.message,
        });
        await this.settlement.refreshStatus(trx, failed, today, policy);
        out.lapsed++;
      } else {
        await this.repo.update(trx, m.id, { next_renewal_attempt_on: nextTry });
        await this.repo.addAudit(trx, m.id, null, 'auto_renew_declined', {
          attempt: attempt + 1,
          nextTry,
          message: result.message,
        });
        out.declined++;
      }
      await enqueueEmail(trx, renewalDeclinedMail(ctx, termEnd, attempt + 1, nextTry, result.message));
    });
  }
}
