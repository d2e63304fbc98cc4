import type { Knex } from 'knex';

/** A launch as stored. */
export interface LaunchRow {
  id: number;
  uid: string;
  title: string;
  launch_date: string;
  starts_at: string;
  ends_at: string;
  site_name: string;
  site_address: string | null;
  site_lat: string | null;
  site_lon: string | null;
  ceiling_metres: number | null;
  waiver_version: string | null;
  notes: string;
  status: 'scheduled' | 'called_off' | 'done';
  call_off_reason: string | null;
  called_off_at: Date | null;
  sequence: number;
  updated_at: Date;
  rsvp_count?: number;
}

/** The writable columns of a launch. */
export type LaunchFields = Pick<
  LaunchRow,
  | 'title'
  | 'launch_date'
  | 'starts_at'
  | 'ends_at'
  | 'site_name'
  | 'site_address'
  | 'site_lat'
  | 'site_lon'
  | 'ceiling_metres'
  | 'waiver_version'
  | 'notes'
>;

/** Someone to write to about a launch. */
export interface Recipient {
  user_id: number;
  email: string;
  display_name: string;
}

const RSVP_COUNT = '(SELECT count(*) FROM launch_rsvps r WHERE r.launch_id = launches.id AND r.going) AS rsvp_count';

/** Plain reads and writes of launches, RSVPs and attendance. */
export class LaunchRepository {
  constructor(private readonly db: Knex) {}

  // The date comes back as text, so it never shifts with the server's time zone.
  private select(db: Knex) {
    return db<LaunchRow>('launches').select(
      'launches.*',
      db.raw("to_char(launch_date, 'YYYY-MM-DD') AS launch_date"),
      db.raw(RSVP_COUNT),
    );
  }

  /** Launches with a date inside the optional range, in calendar order. */
  list(range: { from?: string; to?: string }, db: Knex = this.db): Promise<LaunchRow[]> {
    return this.select(db)
      .modify((qb) => (range.from ? qb.where('launch_date', '>=', range.from) : qb))
      .modify((qb) => (range.to ? qb.where('launch_date', '<=', range.to) : qb))
      .orderBy([{ column: 'launches.launch_date' }, { column: 'launches.starts_at' }, { column: 'launches.id' }]);
  }

  /** A launch by id. */
  byId(id: number, db: Knex = this.db): Promise<LaunchRow | undefined> {
    return this.select(db).where('launches.id', id).first();
  }

  /** Inserts a launch and returns its new id. */
  async insert(trx: Knex.Transaction, row: LaunchFields & { created_by: number }): Promise<number> {
    const [created] = await trx('launches').insert(row).returning('id');
    return created.id;
  }

  /** Writes the changed fields of a launch; false when no row has that id. */
  async update(trx: Knex.Transaction, id: number, patch: Partial<LaunchFields>): Promise<boolean> {
    return (
      (await trx('launches')
        .where('id', id)
        .update({ ...patch, updated_at: trx.fn.now() })) === 1
    );
  }

  /** Calls a scheduled launch off; true only for the one caller whose update won. */
  async callOff(trx: Knex.Transaction, id: number, reason: string): Promise<boolean> {
    const n = await trx('launches')
      .where({ id, status: 'scheduled' })
      .update({
        status: 'called_off',
        call_off_reason: reason,
        called_off_at: trx.fn.now(),
        sequence: trx.raw('sequence + 1'),
        updated_at: trx.fn.now(),
      });
    return n === 1;
  }

  /** Marks a scheduled launch done; true only if it was scheduled. */
  async markDone(trx: Knex.Transaction, id: number): Promise<boolean> {
    return (
      (await trx('launches')
        .where({ id, status: 'scheduled' })
        .update({ status: 'done', sequence: trx.raw('sequence + 1'), updated_at: trx.fn.now() })) === 1
    );
  }

  /** Records or changes a person's reply to a launch, one row per person and launch. */
  async setRsvp(trx: Knex.Transaction, launchId: number, userId: number, going: boolean): Promise<void> {
    await trx('launch_rsvps')
      .insert({ launch_id: launchId, user_id: userId, going })
      .onConflict(['launch_id', 'user_id'])
      .merge({ going, updated_at: trx.fn.now() });
  }

  /** The person's reply to a launch: true, false, or null if they have not answered. */
  async rsvpOf(launchId: number, userId: number, db: Knex = this.db): Promise<boolean | null> {
    const row = await db('launch_rsvps').where({ launch_id: launchId, user_id: userId }).first('going');
    return row ? Boolean(row.going) : null;
  }

  /** Everyone who said they would come, with their e-mail. */
  goingTo(launchId: number, db: Knex = this.db): Promise<Recipient[]> {
    return db('launch_rsvps as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where({ 'r.launch_id': launchId, 'r.going': true })
      .orderBy('u.id')
      .select('u.id as user_id', 'u.email', 'u.display_name');
  }

  /** Scheduled launches with a date in [from, to]. */
  scheduledBetween(from: string, to: string, db: Knex = this.db): Promise<LaunchRow[]> {
    return this.select(db).where('status', 'scheduled').whereBetween('launch_date', [from, to]).orderBy('launches.id');
  }

  /** Records a check-in; false when the member was already checked in for this launch. */
  async addAttendance(
    trx: Knex.Transaction,
    row: { launch_id: number; user_id: number; member_number: string; checked_in_by: number },
  ): Promise<boolean> {
    const rows = await trx('launch_attendance')
      .insert(row)
      .onConflict(['launch_id', 'user_id'])
      .ignore()
      .returning('user_id');
    return rows.length === 1;
  }

  /** Whether the person was checked in at the range table for that launch. */
  async isCheckedIn(launchId: number, userId: number, db: Knex = this.db): Promise<boolean> {
    return (
      (await db('launch_attendance').where({ launch_id: launchId, user_id: userId }).first('user_id')) !== undefined
    );
  }

  /** Who checked in at a launch, in check-in order, with the member number shown at the table. */
  attendance(
    launchId: number,
    db: Knex = this.db,
  ): Promise<{ user_id: number; display_name: string; member_number: string; checked_in_at: Date }[]> {
    return db('launch_attendance as a')
      .join('users as u', 'u.id', 'a.user_id')
      .where('a.launch_id', launchId)
      .orderBy('a.checked_in_at')
      .select('a.user_id', 'u.display_name', 'a.member_number', 'a.checked_in_at');
  }

  /** Launches per status with a date in [from, to], for the dashboard. */
  countsByStatus(from: string, to: string, db: Knex = this.db): Promise<{ status: string; count: number }[]> {
    return db('launches')
      .whereBetween('launch_date', [from, to])
      .groupBy('status')
      .select('status')
      .count<{ status: string; count: number }[]>({ count: '*' });
  }

  /** Check-ins at launches dated in [from, to], for the dashboard's season card. */
  async attendanceBetween(from: string, to: string, db: Knex = this.db): Promise<number> {
    const row = await db('launch_attendance as a')
      .join('launches as l', 'l.id', 'a.launch_id')
      .whereBetween('l.launch_date', [from, to])
      .count<{ count: number }[]>({ count: '*' })
      .first();
    return row?.count ?? 0;
  }
}
