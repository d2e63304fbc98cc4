import type { Knex } from 'knex';
import type { MembershipStatus } from './terms';

export interface PlanRow {
  id: number;
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
  id: number;
  user_id: number;
  member_number: string;
  plan_id: number;
  status: MembershipStatus;
  term_start: string | null;
  term_end: string | null;
  legal_name: string;
  date_of_birth: string | null;
  address: string;
  phone: string;
  emergency_contact: string;
  association_number: string | null;
  association_expires: string | null;
  certification_level: string;
  certification_date: string | null;
  association_verified_at: Date | null;
  association_verified_by: number | null;
  association_verified_against: string | null;
  certification_verified_at: Date | null;
  certification_verified_by: number | null;
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
  next_renewal_attempt_on: string | null;
  renewal_failed_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

/** The columns staff verification writes; a new membership starts with none of them. */
export type VerificationColumn = `${'association' | 'certification'}_verified_${'at' | 'by' | 'against'}`;

export interface PaymentRow {
  id: number;
  membership_id: number;
  plan_id: number;
  entry: 'payment' | 'refund';
  status: 'attempted' | 'paid' | 'declined' | 'unknown' | 'refunded' | 'requested' | 'failed';
  method: 'card' | 'cash' | 'e-transfer' | 'cheque';
  amount_cents: number;
  receipt_number: string | null;
  processor_charge_id: string | null;
  idempotency_key: string;
  term_start: string | null;
  term_end: string | null;
  previous_term_end: string | null;
  refund_of: number | null;
  request_key: string | null;
  processor_refund_id: string | null;
  note: string | null;
  failure_message: string | null;
  recorded_by: number | null;
  attempted_at: Date | null;
  created_at: Date;
}

export interface AuditRow {
  id: number;
  membership_id: number;
  actor_user_id: number | null;
  actor_name: string | null;
  action: string;
  detail: Record<string, unknown>;
  created_at: Date;
}

/** A roster line: the membership with its account e-mail, opt-out and plan. */
export type RosterRow = MembershipRow & {
  email: string;
  marketing_opt_out: boolean;
  plan_code: string;
  plan_name: string;
};

/** The day and grace the roster's status is computed for, so filters match what the table shows. */
export interface AsOf {
  today: string;
  graceDays: number;
}

/** Plain reads and writes of the membership tables. */
export class MembershipRepository {
  constructor(private readonly db: Knex) {}

  /** Members per certification level for the levels not in `codes` (records a new level list would orphan). */
  levelsHeldOutside(codes: string[], db: Knex = this.db): Promise<{ certification_level: string; count: number }[]> {
    return db('memberships')
      .whereNotIn('certification_level', codes)
      .groupBy('certification_level')
      .orderBy('certification_level')
      .select('certification_level')
      .count<{ certification_level: string; count: number }[]>({ count: '*' });
  }

  /** The account's membership, unlocked; use `lockByUser` before changing it. */
  byUser(userId: number, db: Knex = this.db): Promise<MembershipRow | undefined> {
    return db<MembershipRow>('memberships').where('user_id', userId).first();
  }

  /** The account's membership, locked until `trx` ends so two writers of one membership take turns. */
  lockByUser(trx: Knex.Transaction, userId: number): Promise<MembershipRow | undefined> {
    return trx<MembershipRow>('memberships').where('user_id', userId).forUpdate().first();
  }

  /** The membership with this id, unlocked; use `lockById` before changing it. */
  byId(id: number, db: Knex = this.db): Promise<MembershipRow | undefined> {
    return db<MembershipRow>('memberships').where('id', id).first();
  }

  /** The membership, locked until `trx` ends so two writers of one membership take turns. */
  lockById(trx: Knex.Transaction, id: number): Promise<MembershipRow | undefined> {
    return trx<MembershipRow>('memberships').where('id', id).forUpdate().first();
  }

  /** The member's account address and marketing choice, for the staff's member page. */
  async accountOf(userId: number): Promise<{ email: string; marketing_opt_out: boolean } | undefined> {
    return this.db('users').where('id', userId).first('email', 'marketing_opt_out');
  }

  /** Display names of staff by id (who verified a record). */
  async userNames(ids: (number | null)[], db: Knex = this.db): Promise<Map<number, string>> {
    const wanted = [...new Set(ids.filter((i): i is number => i !== null))];
    if (!wanted.length) return new Map();
    const rows: { id: number; display_name: string }[] = await db('users')
      .whereIn('id', wanted)
      .select('id', 'display_name');
    return new Map(rows.map((r) => [r.id, r.display_name]));
  }

  /** The membership a member number names, as printed on the card and read at check-in. */
  byNumber(memberNumber: string, db: Knex = this.db): Promise<MembershipRow | undefined> {
    return db<MembershipRow>('memberships').where('member_number', memberNumber).first();
  }

  /** Inserts a membership with the next member number from the sequence (never reused, even after a rollback). */
  async insert(
    trx: Knex.Transaction,
    row: Omit<
      MembershipRow,
      | 'id'
      | 'member_number'
      | 'created_at'
      | 'updated_at'
      | 'renewal_attempts'
      | 'next_renewal_attempt_on'
      | 'renewal_failed_at'
      | 'card_brand'
      | 'card_last4'
      | VerificationColumn
    >,
  ): Promise<MembershipRow> {
    const [created] = await trx<MembershipRow>('memberships')
      .insert({
        ...row,
        member_number: trx.raw("lpad(nextval('membership_number_seq')::text, 5, '0')") as unknown as string,
      })
      .returning('*');
    return created;
  }

  /** Writes the given membership columns and the update time; member number and account never change. */
  async update(
    trx: Knex.Transaction,
    id: number,
    patch: Partial<Omit<MembershipRow, 'id' | 'member_number' | 'user_id'>>,
  ): Promise<MembershipRow> {
    const [row] = await trx<MembershipRow>('memberships')
      .where('id', id)
      .update({ ...patch, updated_at: trx.fn.now() as unknown as Date })
      .returning('*');
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
    const n = await trx('memberships')
      .where({ id, renewal_attempts: attempts, term_end: termEnd })
      .update({ renewal_attempts: attempts + 1, updated_at: trx.fn.now() });
    return n === 1;
  }

  /** Gives back an auto-renew attempt claimed with `attempts` that never reached the processor. */
  async releaseRenewalAttempt(trx: Knex.Transaction, id: number, attempts: number): Promise<void> {
    await trx('memberships')
      .where({ id, renewal_attempts: attempts + 1 })
      .update({ renewal_attempts: attempts, updated_at: trx.fn.now() });
  }

  /** The family members a family plan covers, in the order they were added. */
  family(membershipId: number, db: Knex = this.db): Promise<{ id: number; name: string; date_of_birth: string }[]> {
    return db('membership_family_members').where('membership_id', membershipId).orderBy('id');
  }

  /** Replaces the family members of a membership in the caller's transaction, so the list is never half-written. */
  async replaceFamily(
    trx: Knex.Transaction,
    membershipId: number,
    people: { name: string; dateOfBirth: string }[],
  ): Promise<void> {
    await trx('membership_family_members').where('membership_id', membershipId).delete();
    if (people.length)
      await trx('membership_family_members').insert(
        people.map((p) => ({ membership_id: membershipId, name: p.name, date_of_birth: p.dateOfBirth })),
      );
  }

  /** Appends one entry to the membership's audit trail in the caller's transaction, so the change and its record commit together. */
  async addAudit(
    trx: Knex.Transaction,
    membershipId: number,
    actorUserId: number | null,
    action: string,
    detail: Record<string, unknown> = {},
  ): Promise<void> {
    await trx('membership_audit').insert({
      membership_id: membershipId,
      actor_user_id: actorUserId,
      action,
      detail: JSON.stringify(detail),
    });
  }

  /** The membership's audit trail with each actor's name, newest first. */
  audit(membershipId: number, db: Knex = this.db): Promise<AuditRow[]> {
    return db('membership_audit as a')
      .leftJoin('users as u', 'u.id', 'a.actor_user_id')
      .where('a.membership_id', membershipId)
      .select('a.*', 'u.display_name as actor_name')
      .orderBy([
        { column: 'a.created_at', order: 'desc' },
        { column: 'a.id', order: 'desc' },
      ]);
  }
}
