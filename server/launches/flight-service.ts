import { Readable } from 'node:stream';
import type { Knex } from 'knex';
import { analyseFlightLog } from '../flights/flight-log/analyse-flight-log';
import type { ColumnMapping } from '../../contracts/flights/column-mapping';
import { flightWarnings } from '../flights/flight-warnings';
import { parseMotorDesignation, type MotorDesignation } from '../flights/motor-designation';
import { badRequest, conflict, forbidden, notFound } from '../platform/app-error';
import type { Role } from '../platform/roles';
import type { SettingsService } from '../settings/settings-service';
import { allowedClassesFor } from './certification';
import type { FlightRepository, FlightRow, StoredMotor } from './flight-repository';
import type { FlightOutcome } from '../../contracts/labels/launch-statuses';
import { FLIGHT_CAUTION, flightDataView, flightView } from './flight-views';
import type { FlyerStanding } from './flyer-standing';
import type {
  FlightPage,
  FlightView,
  LaunchResults,
  Logbook,
  RangeQueue,
} from '../../contracts/launches/launch-answers';
import type { FlightInput } from '../../contracts/launches/launch-schemas';
import type { LaunchService } from './launch-service';
import { LAUNCH_SETTINGS } from './launch-settings';
import { launchView } from './launch-views';

/** An uploaded altimeter log. */
export interface LogUpload {
  bytes: Buffer;
  fileName: string;
  columns: ColumnMapping | undefined;
}

const RANGE_STAFF: Role[] = ['range_officer', 'admin'];

/** The warning that stops an approval: the card needs more than the flyer's verified certification. */
const BEYOND_CERTIFICATION = 'beyond_certification';

const stored = (m: MotorDesignation): StoredMotor => ({
  designation: m.designation,
  impulseClass: m.impulseClass,
  averageThrustN: m.averageThrustN,
  delayS: m.delayS,
  plugged: m.plugged,
  totalImpulseMinNs: m.totalImpulseMinNs,
  totalImpulseMaxNs: m.totalImpulseMaxNs,
});

/** Flight cards at the range table, the range officer's decisions and outcomes, logs, logbooks and results. */
export class FlightService {
  constructor(
    private readonly db: Knex,
    private readonly repo: FlightRepository,
    private readonly launches: LaunchService,
    private readonly flyers: FlyerStanding,
    private readonly settings: SettingsService,
  ) {}

  private async find(id: number): Promise<FlightRow> {
    const f = await this.repo.byId(id);
    if (!f) throw notFound('No such flight.');
    return f;
  }

  /** The flyer's verified level and what it allows, read afresh each time (a level can change between filing and approval). */
  private async certification(userId: number) {
    const level = (await this.flyers.byUser(userId))?.certificationLevel ?? null;
    return { level, allowed: allowedClassesFor(level, await this.settings.get(LAUNCH_SETTINGS)) };
  }

  /** Files a card for a checked-in member: parses each motor and adds the warnings; Padside never approves. */
  async file(launchId: number, userId: number, input: FlightInput): Promise<{ flight: FlightView; caution: string }> {
    const launch = await this.launches.find(launchId);
    if (launch.status !== 'scheduled')
      throw conflict('launch_closed', 'Cards are filed only on a launch that is on the calendar.');
    if (!(await this.launches.isCheckedIn(launchId, userId)))
      throw conflict('not_checked_in', 'Check in at the range table with your member card before filing a card.');
    const motors: MotorDesignation[] = [];
    const unread: Record<string, string> = {};
    input.motors.forEach((text, i) => {
      const m = parseMotorDesignation(text);
      if (m) motors.push(m);
      else
        unread[`motors.${i}`] =
          `Padside cannot read "${text}". Type it as printed on the motor, for example C6-5, F32-6T or H128W-M.`;
    });
    if (Object.keys(unread).length) throw badRequest('A motor designation could not be read.', unread);
    const { level, allowed } = await this.certification(userId);
    const checked = flightWarnings({
      liftoffMassGrams: input.liftoffMassGrams,
      motors,
      expectedAltitudeMetres: input.expectedAltitudeMetres ?? null,
      ceilingMetres: launch.ceiling_metres,
      allowedClasses: allowed,
    });
    const id = await this.db.transaction((trx) =>
      this.repo.insert(trx, {
        launch_id: launchId,
        user_id: userId,
        rocket_name: input.rocketName,
        post_slug: input.postSlug ?? null,
        liftoff_mass_grams: input.liftoffMassGrams,
        motors: motors.map(stored),
        expected_altitude_metres: input.expectedAltitudeMetres ?? null,
        recovery: input.recovery ?? null,
        pad: input.pad ?? null,
        notes: input.notes ?? '',
        thrust_to_weight: Math.round(checked.thrustToWeight * 100) / 100,
        warnings: checked.warnings,
        needs_high_power: checked.needsHighPower,
        certification_level: level ?? 'none',
      }),
    );
    return { flight: flightView((await this.repo.byId(id))!), caution: FLIGHT_CAUTION };
  }

  /** The range officer's queue for one launch: every card, grouped by pad, with the caution. */
  async queue(launchId: number): Promise<RangeQueue> {
    const launch = await this.launches.find(launchId);
    const cards = (await this.repo.forLaunch(launchId)).map(flightView);
    const pads = new Map<string, typeof cards>();
    for (const c of cards) pads.set(c.pad ?? '', [...(pads.get(c.pad ?? '') ?? []), c]);
    return {
      launch: launchView(launch),
      caution: FLIGHT_CAUTION,
      pads: [...pads].map(([pad, items]) => ({ pad: pad || null, items })),
    };
  }

  /** Approve or send back a waiting card. A card beyond the flyer's verified certification cannot be approved. */
  async decide(id: number, staffId: number, approve: boolean, reason: string | null): Promise<{ flight: FlightView }> {
    const f = await this.find(id);
    if (f.status !== 'filed')
      throw conflict('already_decided', `This card is already ${f.status === 'sent_back' ? 'sent back' : f.status}.`);
    if (approve) {
      // The same checks as at filing, against the flyer's verified level as it stands now.
      const { allowed } = await this.certification(f.user_id);
      const launch = await this.launches.find(f.launch_id);
      const now = flightWarnings({
        liftoffMassGrams: f.liftoff_mass_grams,
        motors: f.motors,
        expectedAltitudeMetres: f.expected_altitude_metres,
        ceilingMetres: launch.ceiling_metres,
        allowedClasses: allowed,
      });
      if (now.warnings.some((w) => w.code === BEYOND_CERTIFICATION)) {
        throw conflict(
          'not_certified',
          "This card goes beyond the flyer's verified certification level, so Padside cannot record it as cleared.",
        );
      }
    } else if (!reason) {
      throw badRequest('Say why the card goes back.', { reason: 'Give a reason.' });
    }
    if (
      !(await this.db.transaction((trx) =>
        this.repo.decide(trx, id, 'filed', approve ? 'approved' : 'sent_back', reason, staffId),
      ))
    )
      throw conflict('already_decided', 'Someone decided on this card a moment ago.');
    return { flight: flightView((await this.repo.byId(id))!) };
  }

  /** How a cleared flight went; can be corrected afterwards. */
  async outcome(id: number, outcome: FlightOutcome, notes: string | null): Promise<{ flight: FlightView }> {
    const f = await this.find(id);
    if (!(await this.db.transaction((trx) => this.repo.recordOutcome(trx, id, outcome, notes))))
      throw conflict(
        'not_cleared',
        `Only a card cleared to fly gets an outcome; this one is ${f.status === 'sent_back' ? 'sent back' : 'still waiting'}.`,
      );
    return { flight: flightView((await this.repo.byId(id))!) };
  }

  /** Analyses and stores an altimeter log of a flown card (up to 200,000 rows, which the analysis enforces), by its flyer or range staff. */
  async uploadLog(id: number, user: { id: number; roles: Role[] }, upload: LogUpload) {
    const f = await this.find(id);
    if (f.user_id !== user.id && !user.roles.some((r) => RANGE_STAFF.includes(r)))
      throw forbidden('Only the flyer or a range officer adds data to this flight.');
    if (f.status !== 'flown') throw conflict('not_flown', 'Add data once the flight has an outcome.');
    const analysis = await analyseFlightLog(Readable.from(upload.bytes), upload.columns);
    await this.db.transaction((trx) =>
      this.repo.putData(trx, {
        flight_id: id,
        summary: analysis.summary,
        series: analysis.series,
        events: analysis.events,
        mapping: analysis.mapping,
        filter: analysis.filter,
        file_name: upload.fileName.slice(0, 200),
        uploaded_by: user.id,
      }),
    );
    return { summary: analysis.summary, events: analysis.events, filter: analysis.filter };
  }

  /** The flight page: the card, its analysed data (summary, series, events) and the caution. */
  async show(id: number): Promise<FlightPage> {
    const f = await this.find(id);
    return { flight: flightView(f), data: flightDataView(await this.repo.data(id)), caution: FLIGHT_CAUTION };
  }

  /** A member's logbook: flights by date, motors by class, total impulse flown, best altitude. */
  async logbook(userId: number): Promise<Logbook> {
    const flights = (await this.repo.forUser(userId)).map(flightView);
    const flown = flights.filter((f) => f.status === 'flown');
    const motorsByClass: Record<string, number> = {};
    let min = 0;
    let max = 0;
    for (const m of flown.flatMap((f) => f.motors)) {
      motorsByClass[m.impulseClass] = (motorsByClass[m.impulseClass] ?? 0) + 1;
      min += m.totalImpulseMinNs;
      max += m.totalImpulseMaxNs;
    }
    const best =
      flown.filter((f) => f.apogeeMetres !== null).sort((a, b) => b.apogeeMetres! - a.apogeeMetres!)[0] ?? null;
    return {
      items: flights,
      totals: {
        flights: flights.length,
        flown: flown.length,
        motorsByClass: Object.fromEntries(Object.entries(motorsByClass).sort()),
        // The designation gives only the class, so the total impulse is the sum of the classes' ranges.
        totalImpulseNs: { min: Math.round(min * 100) / 100, max: Math.round(max * 100) / 100 },
        bestAltitude: best
          ? {
              flightId: best.id,
              rocketName: best.rocketName,
              apogeeMetres: best.apogeeMetres!,
              launchDate: best.launchDate,
            }
          : null,
      },
      caution: FLIGHT_CAUTION,
    };
  }

  /** A launch day's results: its flown cards, the highest flight and the outcomes. */
  async results(launchId: number): Promise<LaunchResults> {
    const launch = await this.launches.find(launchId);
    const flights = (await this.repo.forLaunch(launchId)).map(flightView).filter((f) => f.status === 'flown');
    const outcomes: Record<string, number> = {};
    for (const f of flights) if (f.outcome) outcomes[f.outcome] = (outcomes[f.outcome] ?? 0) + 1;
    const highest =
      flights.filter((f) => f.apogeeMetres !== null).sort((a, b) => b.apogeeMetres! - a.apogeeMetres!)[0] ?? null;
    return { launch: launchView(launch), flights, highest, outcomes, caution: FLIGHT_CAUTION };
  }

  /** Flights this season, for the dashboard. */
  seasonTotals(from: string, to: string) {
    return this.repo.seasonTotals(from, to);
  }
}
