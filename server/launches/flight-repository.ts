import type { Knex } from 'knex';
import type { FlightEvent, FlightSeriesPoint, FlightSummary } from '../../contracts/flights/flight-data';
import type { FlightOutcome } from '../../contracts/labels/launch-statuses';
import type { MotorView } from '../../contracts/launches/launch-answers';

/** A motor as stored on a card: what Padside read from its designation. */
export type StoredMotor = MotorView;

/** A flight card as stored, with its flyer's and launch's names. */
export interface FlightRow {
  id: number;
  launch_id: number;
  user_id: number;
  rocket_name: string;
  post_slug: string | null;
  liftoff_mass_grams: number;
  motors: StoredMotor[];
  expected_altitude_metres: number | null;
  recovery: string | null;
  pad: string | null;
  notes: string;
  thrust_to_weight: string;
  warnings: { code: string; message: string }[];
  needs_high_power: boolean;
  certification_level: string;
  status: 'filed' | 'approved' | 'sent_back' | 'flown';
  decision_reason: string | null;
  decided_at: Date | null;
  outcome: FlightOutcome | null;
  outcome_notes: string | null;
  flown_at: Date | null;
  created_at: Date;
  flyer_name: string;
  launch_title: string;
  launch_date: string;
  apogee_metres?: number | null;
}

/** The stored analysis of a flight's altimeter log. */
export interface FlightDataRow {
  flight_id: number;
  summary: FlightSummary;
  series: FlightSeriesPoint[];
  events: FlightEvent[];
  mapping: unknown;
  filter: string;
  file_name: string | null;
  uploaded_at: Date;
}

/** A new card's columns. */
export type NewFlight = Pick<
  FlightRow,
  | 'rocket_name'
  | 'post_slug'
  | 'liftoff_mass_grams'
  | 'expected_altitude_metres'
  | 'recovery'
  | 'pad'
  | 'notes'
  | 'needs_high_power'
  | 'certification_level'
> & {
  launch_id: number;
  user_id: number;
  motors: StoredMotor[];
  thrust_to_weight: number;
  warnings: { code: string; message: string }[];
};

/** Plain reads and writes of flight cards and their data. */
export class FlightRepository {
  constructor(private readonly db: Knex) {}

  private select(db: Knex) {
    return db('flights as f')
      .join('users as u', 'u.id', 'f.user_id')
      .join('launches as l', 'l.id', 'f.launch_id')
      .leftJoin('flight_data as d', 'd.flight_id', 'f.id')
      .select(
        'f.*',
        'u.display_name as flyer_name',
        'l.title as launch_title',
        db.raw("to_char(l.launch_date, 'YYYY-MM-DD') AS launch_date"),
        db.raw("(d.summary->>'apogeeMetres')::float AS apogee_metres"),
      );
  }

  /** Inserts a flight card (motors and warnings stored as JSON) and returns its new id. */
  async insert(trx: Knex.Transaction, row: NewFlight): Promise<number> {
    const [created] = await trx('flights')
      .insert({ ...row, motors: JSON.stringify(row.motors), warnings: JSON.stringify(row.warnings) })
      .returning('id');
    return created.id;
  }

  /** A flight card with its launch and flyer fields. */
  byId(id: number, db: Knex = this.db): Promise<FlightRow | undefined> {
    return this.select(db).where('f.id', id).first();
  }

  /** The cards of a launch in pad order, cards without a pad last, for the range staff's board. */
  forLaunch(launchId: number, db: Knex = this.db): Promise<FlightRow[]> {
    return this.select(db)
      .where('f.launch_id', launchId)
      .orderBy([{ column: 'f.pad', order: 'asc', nulls: 'last' }, { column: 'f.id' }]);
  }

  /** A flyer's own cards, latest launch first, for their logbook. */
  forUser(userId: number, db: Knex = this.db): Promise<FlightRow[]> {
    return this.select(db)
      .where('f.user_id', userId)
      .orderBy([
        { column: 'l.launch_date', order: 'desc' },
        { column: 'f.id', order: 'desc' },
      ]);
  }

  /** Moves a card on from `from`; true only for the one caller whose update won. */
  async decide(
    trx: Knex.Transaction,
    id: number,
    from: FlightRow['status'],
    to: 'approved' | 'sent_back',
    reason: string | null,
    by: number,
  ): Promise<boolean> {
    const n = await trx('flights').where({ id, status: from }).update({
      status: to,
      decision_reason: reason,
      decided_by: by,
      decided_at: trx.fn.now(),
      updated_at: trx.fn.now(),
    });
    return n === 1;
  }

  /** Records how an approved (or already flown) card's flight went. */
  async recordOutcome(
    trx: Knex.Transaction,
    id: number,
    outcome: FlightOutcome,
    notes: string | null,
  ): Promise<boolean> {
    const n = await trx('flights')
      .where('id', id)
      .whereIn('status', ['approved', 'flown'])
      .update({
        status: 'flown',
        outcome,
        outcome_notes: notes,
        flown_at: trx.raw('coalesce(flown_at, now())'),
        updated_at: trx.fn.now(),
      });
    return n === 1;
  }

  /** Stores (or replaces) a flight's analysed log. */
  async putData(
    trx: Knex.Transaction,
    row: Omit<FlightDataRow, 'uploaded_at'> & { uploaded_by: number },
  ): Promise<void> {
    const value = {
      ...row,
      summary: JSON.stringify(row.summary),
      series: JSON.stringify(row.series),
      events: JSON.stringify(row.events),
      mapping: JSON.stringify(row.mapping),
    };
    await trx('flight_data')
      .insert(value)
      .onConflict('flight_id')
      .merge({ ...value, uploaded_at: trx.fn.now() });
  }

  /** The altimeter log attached to a flight card, if one was uploaded. */
  data(flightId: number, db: Knex = this.db): Promise<FlightDataRow | undefined> {
    return db('flight_data').where('flight_id', flightId).first();
  }

  /** Flown cards and the best apogee in [from, to], for the dashboard. */
  async seasonTotals(
    from: string,
    to: string,
    db: Knex = this.db,
  ): Promise<{ flights: number; flown: number; bestApogeeMetres: number | null }> {
    const row: { flights: number; flown: number; best: number | null } | undefined = await db('flights as f')
      .join('launches as l', 'l.id', 'f.launch_id')
      .leftJoin('flight_data as d', 'd.flight_id', 'f.id')
      .whereBetween('l.launch_date', [from, to])
      .first(
        db.raw('count(*) AS flights'),
        db.raw("count(*) FILTER (WHERE f.status = 'flown') AS flown"),
        db.raw("max((d.summary->>'apogeeMetres')::float) AS best"),
      );
    return {
      flights: row?.flights ?? 0,
      flown: row?.flown ?? 0,
      bestApogeeMetres: row?.best ?? null,
    };
  }
}
