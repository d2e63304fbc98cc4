import type { Knex } from 'knex';
import type { RosterQuery, RosterSortKey } from '../../contracts/membership/roster-schemas';
import type { AsOf, RosterRow } from './membership-repository';
import type { MembershipStatus } from './terms';

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

/** Reads over many memberships at once: the staff roster, the members the jobs walk, and the counts by status. */
export class RosterRepository {
  constructor(private readonly db: Knex) {}

  private roster(q: Omit<RosterQuery, 'sort' | 'dir'>, asOf: AsOf) {
    return this.db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .join('membership_plans as p', 'p.id', 'm.plan_id')
      .modify((qb) => {
        if (q.status) qb.whereRaw(`${LIVE_STATUS} = ?`, [...liveBindings(asOf), q.status]);
        if (q.planId) qb.where('m.plan_id', q.planId);
        if (q.certificationLevel) qb.where('m.certification_level', q.certificationLevel);
        if (q.associationExpiresBefore)
          qb.where((w) =>
            w.where('m.association_expires', '<', q.associationExpiresBefore!).orWhereNull('m.association_expires'),
          );
        if (q.q) {
          const like = `%${q.q.replace(/[\\%_]/g, (c) => '\\' + c)}%`;
          qb.where((w) =>
            w
              .whereILike('m.legal_name', like)
              .orWhereILike('u.email', like)
              .orWhereILike('m.member_number', like)
              .orWhereILike('m.association_number', like),
          );
        }
      });
  }

  /** One page of the roster, sorted by a whitelisted column with the member number as tie-break. */
  async rosterPage(
    q: RosterQuery,
    page: number,
    pageSize: number,
    asOf: AsOf,
  ): Promise<{ items: RosterRow[]; total: number }> {
    const [{ count }] = await this.roster(q, asOf).count<{ count: number }[]>({ count: '*' });
    const items = await this.rosterSorted(q, asOf)
      .limit(pageSize)
      .offset((page - 1) * pageSize);
    return { items, total: count };
  }

  /** Every roster line matching the filters, in the table's order (for the export and roster e-mail). */
  rosterAll(q: RosterQuery, asOf: AsOf): Promise<RosterRow[]> {
    return this.rosterSorted(q, asOf);
  }

  private rosterSorted(q: RosterQuery, asOf: AsOf) {
    const dir = q.dir === 'desc' ? 'DESC' : 'ASC';
    const base = this.roster(q, asOf).select(
      'm.*',
      'u.email',
      'u.marketing_opt_out',
      'p.code as plan_code',
      'p.name as plan_name',
    );
    return q.sort === 'status'
      ? base.orderByRaw(`${LIVE_STATUS} ${dir}, m.member_number ASC`, liveBindings(asOf))
      : base.orderByRaw(`${SORT_COLUMNS[q.sort]} ${dir} NULLS LAST, m.member_number ASC`);
  }

  /** Memberships that have paid at least once, with what the reminder and renewal jobs need. */
  standing(db: Knex = this.db): Promise<RosterRow[]> {
    return db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .join('membership_plans as p', 'p.id', 'm.plan_id')
      .whereNot('m.status', 'pending')
      .select('m.*', 'u.email', 'u.marketing_opt_out', 'p.code as plan_code', 'p.name as plan_name')
      .orderBy('m.id');
  }

  /** Active members whose term ends within `days`, plus those in grace: the ones about to lapse. */
  async countLapsingWithin(asOf: AsOf, days: number): Promise<number> {
    const { rows } = await this.db.raw(
      `SELECT count(*) AS n FROM memberships m WHERE ${LIVE_STATUS} IN ('active', 'lapsing') AND m.term_end < ?::date + ?::int`,
      [...liveBindings(asOf), asOf.today, days],
    );
    return rows[0].n;
  }

  /** Members per status as the dates give it on `asOf.today`. */
  async countsByStatus(asOf: AsOf): Promise<{ status: MembershipStatus; count: number }[]> {
    const { rows } = await this.db.raw(
      `SELECT ${LIVE_STATUS} AS status, count(*) AS count FROM memberships m GROUP BY 1`,
      liveBindings(asOf),
    );
    return rows;
  }
}
