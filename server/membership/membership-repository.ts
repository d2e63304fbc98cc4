import type { Knex } from 'knex';
import type { RosterQuery, RosterSortKey } from '../../contracts/membership/roster-schemas';
import type { MembershipStatus } from './terms';

type Db = Knex | Knex.Transaction;

/** PostgreSQL `date` values arrive as local-midnight Date objects; read them back as `YYYY-MM-DD`. */
export function dateOnly(value: Date | string | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string') return value.slice(0, 10);
  const p = (n: number) => String(n).padStart(2, '0');
  return `${value.getFullYear()}-${p(value.getMonth() + 1)}-${p(value.getDate())}`;
}

/** A `date` column: read as a Date, written as a `YYYY-MM-DD` string. */
export type DateCol = Date | string;

export interface PlanRow {
  id: string;
  code: string;
  name: string;
  description: string;
  eligibility: 'any' | 'junior' | 'family';
  dues_cents: number;
  joining_fee_cents: number;
  active: boolean;
  sort_order: number;
}

export interface MembershipRow {
  id: string;
  user_id: string;
  member_number: string;
  plan_id: string;
  status: MembershipStatus;
  term_start: DateCol | null;
  term_end: DateCol | null;
  legal_name: string;
  date_of_birth: DateCol | null;
  address: string;
  phone: string;
  emergency_contact: string;
  association_number: string | null;
  association_expires: DateCol | null;
  certification_level: string;
  certification_date: DateCol | null;
  association_verified_at: Date | null;
  association_verified_by: string | null;
  association_verified_against: string | null;
  certification_verified_at: Date | null;
  certification_verified_by: string | null;
  certification_verified_against: string | null;
  waiver_version: string;
  waiver_accepted_at: Date;
  safety_code_version: string;
  safety_code_accepted_at: Date;
  auto_renew: boolean;
  processor_customer_id: string | null;
  card_brand: string | null;
  card_last4: string | null;
  renewal_attempts: number;
  next_renewal_attempt_on: DateCol | null;
  renewal_failed_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

/** The columns staff verification writes; a new membership starts with none of them. */
export type VerificationColumn = `${'association' | 'certification'}_verified_${'at' | 'by' | 'against'}`;

export interface PaymentRow {
  id: string;
  membership_id: string;
  plan_id: string;
  entry: 'payment' | 'refund';
  status: 'attempted' | 'paid' | 'declined' | 'unknown' | 'refunded' | 'requested' | 'failed';
  method: 'card' | 'cash' | 'e-transfer' | 'cheque';
  amount_cents: number;
  receipt_number: string | null;
  processor_charge_id: string | null;
  idempotency_key: string;
  term_start: DateCol | null;
  term_end: DateCol | null;
  previous_term_end: DateCol | null;
  refund_of: string | null;
  request_key: string | null;
  processor_refund_id: string | null;
  note: string | null;
  failure_message: string | null;
  recorded_by: string | null;
  attempted_at: Date | null;
  created_at: Date;
}

export interface AuditRow {
  id: string;
  membership_id: string;
  actor_user_id: string | null;
  actor_name: string | null;
  action: string;
  detail: Record<string, unknown>;
  created_at: Date;
}

/** A roster line: the membership with its account e-mail, opt-out and plan. */
export type RosterRow = MembershipRow & { email: string; marketing_opt_out: boolean; plan_code: string; plan_name: string };

/** The day and grace the roster's status is computed for, so filters match what the table shows. */
export interface AsOf {
  today: string;
  graceDays: number;
}

/** The status the dates give (the same rule as `statusOn`), so a stale stored status never hides a member. */
const LIVE_STATUS =
  "(CASE WHEN m.term_end IS NULL THEN 'pending' WHEN m.term_end >= ?::date THEN 'active' " +
  "WHEN m.renewal_failed_at IS NOT NULL OR m.term_end + ?::int < ?::date THEN 'lapsed' ELSE 'lapsing' END)";
const liveBindings = (a: AsOf) => [a.today, a.graceDays, a.today];

const SORT_COLUMNS: Record<Exclude<RosterSortKey, 'status'>, string> = {
  memberNumber: 'm.member_number',
  name: 'm.legal_name',
  termEnd: 'm.term_end',
  plan: 'p.name',
  associationExpires: 'm.association_expires',
};

/** Plain reads and writes of the membership tables. */
export class MembershipRepository {
  constructor(private readonly db: Knex) {}

  plans(includeInactive: boolean, db: Db = this.db): Promise<PlanRow[]> {
    return db<PlanRow>('membership_plans')
      .modify((qb) => (includeInactive ? qb : qb.where('active', true)))
      .orderBy([{ column: 'sort_order' }, { column: 'id' }]);
  }

  plan(id: number, db: Db = this.db): Promise<PlanRow | undefined> {
    return db<PlanRow>('membership_plans').where('id', id).first();
  }

  async insertPlan(row: Omit<PlanRow, 'id'>, db: Db = this.db): Promise<PlanRow> {
    const [created] = await db<PlanRow>('membership_plans').insert(row).returning('*');
    return created;
  }

  async updatePlan(id: number, patch: Partial<Omit<PlanRow, 'id'>>, db: Db = this.db): Promise<PlanRow | undefined> {
    const [row] = await db<PlanRow>('membership_plans').where('id', id).update({ ...patch, updated_at: db.fn.now() } as Partial<PlanRow>).returning('*');
    return row;
  }

  /** Members per certification level for the levels not in `codes` (records a new level list would orphan). */
  levelsHeldOutside(codes: string[], db: Db = this.db): Promise<{ certification_level: string; count: string }[]> {
    return db('memberships')
      .whereNotIn('certification_level', codes)
      .groupBy('certification_level')
      .orderBy('certification_level')
      .select('certification_level')
      .count<{ certification_level: string; count: string }[]>({ count: '*' });
  }

  byUser(userId: number, db: Db = this.db, lock = false): Promise<MembershipRow | undefined> {
    return db<MembershipRow>('memberships').where('user_id', userId).modify((qb) => (lock ? qb.forUpdate() : qb)).first();
  }

  byId(id: number, db: Db = this.db, lock = false): Promise<MembershipRow | undefined> {
    return db<MembershipRow>('memberships').where('id', id).modify((qb) => (lock ? qb.forUpdate() : qb)).first();
  }

  /** Display names of staff by id (who verified a record). */
  async userNames(ids: (string | null)[], db: Db = this.db): Promise<Map<string, string>> {
    const wanted = [...new Set(ids.filter((i): i is string => i !== null))];
    if (!wanted.length) return new Map();
    const rows: { id: string; display_name: string }[] = await db('users').whereIn('id', wanted).select('id', 'display_name');
    return new Map(rows.map((r) => [String(r.id), r.display_name]));
  }

  byNumber(memberNumber: string, db: Db = this.db): Promise<MembershipRow | undefined> {
    return db<MembershipRow>('memberships').where('member_number', memberNumber).first();
  }

  /** Inserts a membership with the next member number from the sequence (never reused, even after a rollback). */
  async insert(trx: Knex.Transaction, row: Omit<MembershipRow, 'id' | 'member_number' | 'created_at' | 'updated_at' | 'renewal_attempts' | 'next_renewal_attempt_on' | 'renewal_failed_at' | 'card_brand' | 'card_last4' | VerificationColumn>): Promise<MembershipRow> {
    const [created] = await trx<MembershipRow>('memberships')
      .insert({ ...row, member_number: trx.raw("lpad(nextval('membership_number_seq')::text, 5, '0')") as unknown as string })
      .returning('*');
    return created;
  }

  async update(trx: Db, id: number, patch: Partial<Omit<MembershipRow, 'id' | 'member_number' | 'user_id'>>): Promise<MembershipRow> {
    const [row] = await trx<MembershipRow>('memberships').where('id', id).update({ ...patch, updated_at: trx.fn.now() as unknown as Date }).returning('*');
    return row;
  }

  /** Changes the status only if it still is `from`; true for the one caller whose update won. */
  async moveStatus(trx: Knex.Transaction, id: number, from: MembershipStatus, to: MembershipStatus): Promise<boolean> {
    const n = await trx('memberships').where({ id, status: from }).update({ status: to, updated_at: trx.fn.now() });
    return n === 1;
  }

  /**
   * Claims the next auto-renew attempt: true only for the one caller that saw `attempts` and the term end still
   * current (a renewal paid meanwhile moves the term end, and the claim then fails).
   */
  async claimRenewalAttempt(trx: Knex.Transaction, id: number, attempts: number, termEnd: string): Promise<boolean> {
    const n = await trx('memberships').where({ id, renewal_attempts: attempts, term_end: termEnd }).update({ renewal_attempts: attempts + 1, updated_at: trx.fn.now() });
    return n === 1;
  }

  /** Gives back an auto-renew attempt claimed with `attempts` that never reached the processor. */
  async releaseRenewalAttempt(id: number, attempts: number, db: Db = this.db): Promise<void> {
    await db('memberships').where({ id, renewal_attempts: attempts + 1 }).update({ renewal_attempts: attempts, updated_at: db.fn.now() });
  }

  family(membershipId: number, db: Db = this.db): Promise<{ id: string; name: string; date_of_birth: DateCol }[]> {
    return db('membership_family_members').where('membership_id', membershipId).orderBy('id');
  }

  async replaceFamily(trx: Knex.Transaction, membershipId: number, people: { name: string; dateOfBirth: string }[]): Promise<void> {
    await trx('membership_family_members').where('membership_id', membershipId).delete();
    if (people.length) await trx('membership_family_members').insert(people.map((p) => ({ membership_id: membershipId, name: p.name, date_of_birth: p.dateOfBirth })));
  }

  async insertPayment(db: Db, row: Partial<PaymentRow> & Pick<PaymentRow, 'membership_id' | 'plan_id' | 'status' | 'method' | 'amount_cents' | 'idempotency_key'>): Promise<PaymentRow> {
    const [created] = await db<PaymentRow>('membership_payments').insert(row).returning('*');
    return created;
  }

  async updatePayment(db: Db, id: number, patch: Partial<PaymentRow>): Promise<PaymentRow> {
    const [row] = await db<PaymentRow>('membership_payments').where('id', id).update(patch).returning('*');
    return row;
  }

  payment(id: number, db: Db = this.db, lock = false): Promise<PaymentRow | undefined> {
    return db<PaymentRow>('membership_payments').where('id', id).modify((qb) => (lock ? qb.forUpdate() : qb)).first();
  }

  paymentByKey(key: string, db: Db = this.db): Promise<PaymentRow | undefined> {
    return db<PaymentRow>('membership_payments').where('idempotency_key', key).first();
  }

  /** The card payments (not refunds) of one membership for the term ending `termEnd`, oldest first. */
  cardPaymentsForTerm(membershipId: number, termEnd: string, db: Db = this.db): Promise<PaymentRow[]> {
    return db<PaymentRow>('membership_payments').where({ membership_id: String(membershipId), term_end: termEnd, entry: 'payment', method: 'card' }).orderBy('id');
  }

  payments(membershipId: number, db: Db = this.db): Promise<PaymentRow[]> {
    return db<PaymentRow>('membership_payments').where('membership_id', membershipId).orderBy([{ column: 'created_at', order: 'desc' }, { column: 'id', order: 'desc' }]);
  }

  /** Money refunded against a payment (a positive number): settled refunds, plus claims still `requested`. */
  async refundedCents(paymentId: number, db: Db = this.db, statuses: PaymentRow['status'][] = ['refunded', 'requested']): Promise<number> {
    const [{ sum }] = await db('membership_payments').where({ refund_of: paymentId, entry: 'refund' }).whereIn('status', statuses).sum<{ sum: string | null }[]>({ sum: 'amount_cents' });
    return -Number(sum ?? 0);
  }

  /** The refund a client key (Idempotency-Key) already asked for on this membership. */
  refundByRequestKey(membershipId: number, key: string, db: Db = this.db): Promise<PaymentRow | undefined> {
    return db<PaymentRow>('membership_payments').where({ membership_id: String(membershipId), request_key: key, entry: 'refund' }).first();
  }

  /** Refunds recorded against one payment, oldest first. */
  refundsOf(paymentId: number, db: Db = this.db): Promise<PaymentRow[]> {
    return db<PaymentRow>('membership_payments').where({ refund_of: String(paymentId), entry: 'refund' }).orderBy('id');
  }

  /** The paid card payment behind a processor charge. */
  paymentByCharge(chargeId: string, db: Db = this.db): Promise<PaymentRow | undefined> {
    return db<PaymentRow>('membership_payments').where({ processor_charge_id: chargeId, entry: 'payment' }).whereIn('status', ['paid', 'refunded']).first();
  }

  /** Card refund claims still waiting for the processor's answer since before `before`. */
  staleRefundClaims(before: Date, db: Db = this.db): Promise<PaymentRow[]> {
    return db<PaymentRow>('membership_payments').where({ entry: 'refund', status: 'requested' }).where('created_at', '<', before).orderBy('id').limit(100);
  }

  async addAudit(db: Db, membershipId: number, actorUserId: number | null, action: string, detail: Record<string, unknown> = {}): Promise<void> {
    await db('membership_audit').insert({ membership_id: membershipId, actor_user_id: actorUserId, action, detail: JSON.stringify(detail) });
  }

  audit(membershipId: number, db: Db = this.db): Promise<AuditRow[]> {
    return db('membership_audit as a')
      .leftJoin('users as u', 'u.id', 'a.actor_user_id')
      .where('a.membership_id', membershipId)
      .select('a.*', 'u.display_name as actor_name')
      .orderBy([{ column: 'a.created_at', order: 'desc' }, { column: 'a.id', order: 'desc' }]);
  }

  private roster(q: Omit<RosterQuery, 'sort' | 'dir'>, asOf: AsOf) {
    return this.db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .join('membership_plans as p', 'p.id', 'm.plan_id')
      .modify((qb) => {
        if (q.status) qb.whereRaw(`${LIVE_STATUS} = ?`, [...liveBindings(asOf), q.status]);
        if (q.planId) qb.where('m.plan_id', q.planId);
        if (q.certificationLevel) qb.where('m.certification_level', q.certificationLevel);
        if (q.associationExpiresBefore) qb.where((w) => w.where('m.association_expires', '<', q.associationExpiresBefore!).orWhereNull('m.association_expires'));
        if (q.q) {
          const like = `%${q.q.replace(/[\\%_]/g, (c) => '\\' + c)}%`;
          qb.where((w) => w.whereILike('m.legal_name', like).orWhereILike('u.email', like).orWhereILike('m.member_number', like).orWhereILike('m.association_number', like));
        }
      });
  }

  /** One page of the roster, sorted by a whitelisted column with the member number as tie-break. */
  async rosterPage(q: RosterQuery, page: number, pageSize: number, asOf: AsOf): Promise<{ items: RosterRow[]; total: number }> {
    const [{ count }] = await this.roster(q, asOf).count<{ count: string }[]>({ count: '*' });
    const items = await this.rosterSorted(q, asOf).limit(pageSize).offset((page - 1) * pageSize);
    return { items, total: Number(count) };
  }

  /** Every roster line matching the filters, in the table's order (for the export and roster e-mail). */
  rosterAll(q: RosterQuery, asOf: AsOf): Promise<RosterRow[]> {
    return this.rosterSorted(q, asOf);
  }

  private rosterSorted(q: RosterQuery, asOf: AsOf) {
    const dir = q.dir === 'desc' ? 'DESC' : 'ASC';
    const base = this.roster(q, asOf).select('m.*', 'u.email', 'u.marketing_opt_out', 'p.code as plan_code', 'p.name as plan_name');
    return q.sort === 'status'
      ? base.orderByRaw(`${LIVE_STATUS} ${dir}, m.member_number ASC`, liveBindings(asOf))
      : base.orderByRaw(`${SORT_COLUMNS[q.sort]} ${dir} NULLS LAST, m.member_number ASC`);
  }

  /** Memberships that have paid at least once, with what the reminder and renewal jobs need. */
  standing(db: Db = this.db): Promise<RosterRow[]> {
    return db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .join('membership_plans as p', 'p.id', 'm.plan_id')
      .whereNot('m.status', 'pending')
      .select('m.*', 'u.email', 'u.marketing_opt_out', 'p.code as plan_code', 'p.name as plan_name')
      .orderBy('m.id');
  }

  /** Net dues per calendar month (club time zone) and plan, over paid payments and refunds. */
  collectedByMonth(timeZone: string, db: Db = this.db): Promise<{ month: string; plan_code: string; plan_name: string; cents: string; payments: string }[]> {
    return db('membership_payments as pay')
      .join('membership_plans as p', 'p.id', 'pay.plan_id')
      .whereIn('pay.status', ['paid', 'refunded'])
      .select(db.raw("to_char(pay.created_at AT TIME ZONE ?, 'YYYY-MM') as month", [timeZone]), 'p.code as plan_code', 'p.name as plan_name')
      .sum({ cents: 'pay.amount_cents' })
      .select(db.raw("count(*) FILTER (WHERE pay.entry = 'payment') as payments"))
      .groupByRaw('1, p.code, p.name')
      .orderByRaw('1 DESC, p.code');
  }

  /** Active members whose term ends within `days`, plus those in grace: the ones about to lapse. */
  async countLapsingWithin(asOf: AsOf, days: number): Promise<number> {
    const { rows } = await this.db.raw(
      `SELECT count(*) AS n FROM memberships m WHERE ${LIVE_STATUS} IN ('active', 'lapsing') AND m.term_end < ?::date + ?::int`,
      [...liveBindings(asOf), asOf.today, days],
    );
    return Number(rows[0].n);
  }

  /** Members per status as the dates give it on `asOf.today`. */
  async countsByStatus(asOf: AsOf): Promise<{ status: MembershipStatus; count: string }[]> {
    const { rows } = await this.db.raw(`SELECT ${LIVE_STATUS} AS status, count(*) AS count FROM memberships m GROUP BY 1`, liveBindings(asOf));
    return rows;
  }
}
