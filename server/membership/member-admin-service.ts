import type { Knex } from 'knex';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { ClubCalendar } from '../platform/club-calendar';
import type { SettingsService } from '../settings/settings-service';
import { termPolicy, type DuesSettlement } from './dues-settlement';
import type { RosterQuery } from '../../contracts/membership/roster-schemas';
import type { ManualPaymentRequest, MemberPatch } from '../../contracts/membership/staff-member-schemas';
import type { DuesSummary, MemberDetail, RosterPage } from '../../contracts/membership/staff-member-answers';
import type { MembershipRepository, AsOf } from './membership-repository';
import type { PlanRepository } from './plan-repository';
import type { DuesPaymentRepository } from './dues-payment-repository';
import type { RosterRepository } from './roster-repository';
import { MEMBERSHIP_SETTINGS } from './membership-settings';
import { membershipView, paymentView, rosterView } from './membership-views';
import { labelOf, yesNo } from '../../contracts/labels/label-of';
import { MEMBERSHIP_STATUS_LABELS } from '../../contracts/labels/membership-statuses';
import { toCsv } from '../platform/csv';
import { withVoidedVerifications } from './flying-status';
import { verificationsView } from './flying-status-service';
import { termForPayment } from './terms';

/** The treasurer's side: roster, member detail, manual payments and summary (roster e-mail: roster-mail-service; plans and club rules:
 * plan-admin-service). */
export class MemberAdminService {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly planRepo: PlanRepository,
    private readonly paymentRepo: DuesPaymentRepository,
    private readonly rosterRepo: RosterRepository,
    private readonly settings: SettingsService,
    private readonly settlement: DuesSettlement,
    private readonly clock: Clock,
    private readonly calendar: ClubCalendar,
  ) {}

  private today(): string {
    return this.calendar.today();
  }

  private async policy() {
    return termPolicy(await this.settings.get(MEMBERSHIP_SETTINGS));
  }

  private async asOf(): Promise<AsOf> {
    return { today: this.today(), graceDays: (await this.policy()).graceDays };
  }

  /** One page of the roster with each member's status as the dates give it today, so the table never shows a stale status. */
  async roster(q: RosterQuery, page: number, pageSize: number): Promise<RosterPage> {
    const [policy, today] = [await this.policy(), this.today()];
    const result = await this.rosterRepo.rosterPage(q, page, pageSize, await this.asOf());
    return { items: result.items.map((r) => rosterView(r, today, policy)), total: result.total, page, pageSize };
  }

  /** The whole filtered roster as CSV, in the table's order, for the treasurer's own records. */
  async exportCsv(q: RosterQuery): Promise<string> {
    const [policy, today] = [await this.policy(), this.today()];
    const rows = (await this.rosterRepo.rosterAll(q, await this.asOf())).map((r) => rosterView(r, today, policy));
    return toCsv(
      [
        'Member number',
        'Name',
        'E-mail',
        'Plan',
        'Status',
        'Term end',
        'Certification',
        'Certification checked',
        'Association number',
        'Association expires',
        'Association checked',
        'Auto-renew',
      ],
      rows.map((r) => [
        r.memberNumber,
        r.name,
        r.email,
        r.planName,
        labelOf(MEMBERSHIP_STATUS_LABELS, r.status),
        r.termEnd,
        r.certificationLevel,
        yesNo(r.certificationVerified),
        r.associationNumber,
        r.associationExpires,
        yesNo(r.associationVerified),
        yesNo(r.autoRenew),
      ]),
    );
  }

  /** One member's full record for staff: profile, family, payments, verifications and audit trail. */
  async detail(id: number): Promise<MemberDetail> {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const m = await this.repo.byId(id);
    if (!m) throw notFound('No such member.');
    const [plan, family, payments, audit] = [
      await this.planRepo.plan(m.plan_id),
      await this.repo.family(id),
      await this.paymentRepo.payments(id),
      await this.repo.audit(id),
    ];
    const user = await this.repo.accountOf(m.user_id);
    return {
      member: {
        ...membershipView(m, plan, this.today(), termPolicy(s), s),
        email: user?.email ?? null,
        mailOptOut: user?.marketing_opt_out ?? false,
      },
      verifications: await verificationsView(this.repo, m),
      familyMembers: family.map((f) => ({ name: f.name, dateOfBirth: f.date_of_birth })),
      payments: payments.map(paymentView),
      audit: audit.map((a) => ({
        id: a.id,
        action: a.action,
        detail: a.detail,
        actor: a.actor_name,
        at: a.created_at.toISOString(),
      })),
    };
  }

  /** Staff correction of the record; every change lands in the audit with before and after. */
  async update(actorId: number, id: number, patch: MemberPatch): Promise<MemberDetail> {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    if (
      patch.certificationLevel !== undefined &&
      !s.certificationLevels.some((l) => l.code === patch.certificationLevel)
    ) {
      throw badRequest('Choose a certification level from the list.', {
        certificationLevel: 'Choose a level from the list.',
      });
    }
    await this.db.transaction(async (trx) => {
      const m = await this.repo.lockById(trx, id);
      if (!m) throw notFound('No such member.');
      const map = {
        associationNumber: 'association_number',
        associationExpires: 'association_expires',
        certificationLevel: 'certification_level',
        certificationDate: 'certification_date',
        address: 'address',
        phone: 'phone',
        emergencyContact: 'emergency_contact',
      } as const;
      const row: Record<string, unknown> = {};
      const changes: Record<string, { from: unknown; to: unknown }> = {};
      for (const [key, column] of Object.entries(map) as [keyof MemberPatch, (typeof map)[keyof MemberPatch]][]) {
        if (patch[key] === undefined) continue;
        const before = m[column];
        if (before === patch[key]) continue;
        row[column] = patch[key];
        changes[key] = { from: before, to: patch[key] };
      }
      if (!Object.keys(row).length) return;
      // A corrected value is no longer the one staff checked: it needs checking again.
      const full = withVoidedVerifications(m, row);
      await this.repo.update(trx, id, full);
      await this.repo.addAudit(trx, id, actorId, 'record_edited', {
        ...changes,
        ...('association_verified_at' in full ? { associationVerification: 'voided' } : {}),
        ...('certification_verified_at' in full ? { certificationVerification: 'voided' } : {}),
      });
    });
    return this.detail(id);
  }

  /** Cash at the field, e-transfer or cheque: renews one term like a card payment, with the receipt number given. */
  async manualPayment(actorId: number, id: number, input: ManualPaymentRequest): Promise<MemberDetail> {
    const policy = await this.policy();
    const today = this.today();
    await this.db.transaction(async (trx) => {
      const m = await this.repo.lockById(trx, id);
      if (!m) throw notFound('No such member.');
      const key = `manual:${m.id}:${input.receiptNumber.toLowerCase()}`;
      if (await this.paymentRepo.paymentByKey(key, trx))
        throw conflict('duplicate_receipt', 'That receipt number is already recorded for this member.', {
          receiptNumber: 'Already recorded for this member.',
        });
      const term = termForPayment(today, m.term_end, policy);
      const payment = await this.paymentRepo.insertPayment(trx, {
        membership_id: m.id,
        plan_id: m.plan_id,
        status: 'attempted',
        method: input.method,
        amount_cents: input.amountCents,
        receipt_number: input.receiptNumber,
        idempotency_key: key,
        note: input.note ?? null,
        recorded_by: actorId,
        created_at: this.clock.now(),
      });
      await this.settlement.settle(trx, m, payment, term, {
        today,
        policy,
        actorUserId: actorId,
        at: this.clock.now(),
      });
    });
    return this.detail(id);
  }

  /** Dues collected per month and plan (net of refunds, club time zone) and members by status. */
  async summary(): Promise<DuesSummary> {
    const collected = await this.paymentRepo.collectedByMonth(this.calendar.timeZone);
    const byStatus = await this.rosterRepo.countsByStatus(await this.asOf());
    const counts = { pending: 0, active: 0, lapsing: 0, lapsed: 0 };
    for (const r of byStatus) counts[r.status] = r.count;
    return {
      collected: collected.map((r) => ({
        month: r.month,
        planCode: r.plan_code,
        planName: r.plan_name,
        cents: r.cents,
        payments: r.payments,
      })),
      byStatus: counts,
    };
  }

  /** Members whose dues run out within `days`: active with the term ending by then, or already in grace. */
  async lapsingWithin(days: number): Promise<number> {
    return this.rosterRepo.countLapsingWithin(await this.asOf(), days);
  }
}
