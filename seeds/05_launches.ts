import type { Knex } from 'knex';
import { hashPassword } from '../server/auth/password-hash';
import { Readable } from 'node:stream';
import { analyseFlightLog } from '../server/flights/flight-log/analyse-flight-log';
import { flightWarnings } from '../server/flights/flight-warnings';
import { parseMotorDesignation } from '../server/flights/motor-designation';
import { allowedClassesFor } from '../server/launches/certification';
import { LAUNCH_SETTINGS } from '../server/launches/launch-settings';
import { addDays } from '../server/membership/terms';
import { dateInZone } from '../server/platform/clock';
import { DEMO_PASSWORD } from './01_demo_accounts';

/** The demo range officer (README's table). */
export const DEMO_RANGE_OFFICER = {
  email: 'rso@padside.test',
  name: 'Agathe Thunderbird-Voss',
  roles: ['fan', 'range_officer'],
};

/** The invented field the Gopher Flats Rocketry Society flies from. */
const SITE = {
  site_name: 'Coulee Flats Field',
  site_address: 'Range Road 41, 6 km south of Gopher Flats, MB',
  site_lat: '49.712000',
  site_lon: '-98.903000',
};

/**
 * Invented launch days, `inDays` from the day of seeding; `{season}` in a title becomes the season of the day's date,
 * so a demo seeded in any month reads true.
 */
const LAUNCHES = [
  {
    key: 'shakedown',
    title: '{Season} shakedown launch',
    inDays: -24,
    status: 'done',
    ceiling: 900,
    notes: 'Bring your member card to the range table.',
  },
  {
    key: 'windy-saturday',
    title: 'Saturday club launch',
    inDays: -10,
    status: 'called_off',
    ceiling: 900,
    notes: '',
    reason: 'Gusts over 35 km/h forecast all day',
  },
  {
    key: 'fly-day',
    title: '{Season} fly day',
    inDays: 11,
    status: 'scheduled',
    ceiling: 1500,
    notes: 'Airspace arrangement to 1,500 m. Pads 1-4 model, pads 5-6 high power.',
  },
  {
    key: 'high-power',
    title: '{Season} high-power day',
    inDays: 39,
    status: 'scheduled',
    ceiling: 3000,
    notes: 'High-power pads open; certification cards checked at the table.',
  },
] as const;

/**
 * The season of a `YYYY-MM-DD` date on the prairies (northern hemisphere), by whole months: March to May spring,
 * June to August summer, September to November autumn, December to February winter (the meteorological seasons,
 * from memory).
 */
export function seasonOf(date: string): 'Spring' | 'Summer' | 'Autumn' | 'Winter' {
  const month = Number(date.slice(5, 7));
  if (month >= 3 && month <= 5) return 'Spring';
  if (month >= 6 && month <= 8) return 'Summer';
  if (month >= 9 && month <= 11) return 'Autumn';
  return 'Winter';
}

/** A demo launch's title for its date. */
export function launchTitleFor(title: string, date: string): string {
  return title.replace('{Season}', seasonOf(date));
}

/** Cards flown at the done launch: flyer e-mail, rocket, mass, motors, expected altitude, recovery, pad, outcome. */
const FLOWN = [
  {
    email: 'member@padside.test',
    rocket: 'Filament Falcon',
    mass: 96,
    motors: ['C6-5'],
    expected: 180,
    recovery: 'parachute',
    pad: '2',
    outcome: 'recovered',
    notes: 'Straight boost, chute out just past apogee.',
    log: { boostMps2: 60, burnS: 0.8, descentMps: 4.5 },
  },
  {
    email: 'member@padside.test',
    rocket: 'PLA Prairie Dog',
    mass: 410,
    motors: ['F32-6T'],
    expected: 420,
    recovery: 'parachute',
    pad: '3',
    outcome: 'damaged',
    notes: 'One fin cracked on landing in the stubble.',
    log: null,
  },
  {
    email: 'hollis.quarrie@padside.test',
    rocket: 'Coulee Crow',
    mass: 1650,
    motors: ['H128W-M'],
    expected: 650,
    recovery: 'dual_deploy',
    pad: '5',
    outcome: 'recovered',
    notes: 'Drogue at apogee, main at 150 m.',
    log: { boostMps2: 65, burnS: 1.6, descentMps: 6 },
  },
] as const;

/**
 * A made-up altimeter log (time s, pressure Pa, temperature C, acceleration g) of a flight that boosts at
 * `boostMps2` for `burnS`, coasts under standard gravity to apogee and comes down at `descentMps`, sampled at 20 Hz,
 * from a field `fieldMetres` above sea level. Pressure by the US Standard Atmosphere 1976 troposphere formula.
 */
export function syntheticAltimeterLog(o: {
  boostMps2: number;
  burnS: number;
  descentMps: number;
  fieldMetres?: number;
  padS?: number;
}): string {
  const g = 9.80665;
  const field = o.fieldMetres ?? 250;
  const pad = o.padS ?? 2;
  const vBurnout = o.boostMps2 * o.burnS;
  const hBurnout = 0.5 * o.boostMps2 * o.burnS ** 2;
  const tApogee = o.burnS + vBurnout / g;
  const apogee = hBurnout + vBurnout ** 2 / (2 * g);
  const tLanding = tApogee + apogee / o.descentMps;
  const height = (t: number) =>
    t <= 0
      ? 0
      : t <= o.burnS
        ? 0.5 * o.boostMps2 * t ** 2
        : t <= tApogee
          ? hBurnout + vBurnout * (t - o.burnS) - 0.5 * g * (t - o.burnS) ** 2
          : Math.max(0, apogee - o.descentMps * (t - tApogee));
  const accel = (t: number) => (t <= 0 || t > tLanding ? 1 : t <= o.burnS ? 1 + o.boostMps2 / g : t <= tApogee ? 0 : 1);
  const rows = ['time_s,pressure_pa,temperature_c,accel_g'];
  for (let i = 0; ; i++) {
    const t = i / 20 - pad;
    if (t > tLanding + 3) break;
    const h = field + height(t);
    const p = 101325 * (1 - 2.25577e-5 * h) ** 5.25588;
    rows.push(`${(t + pad).toFixed(2)},${p.toFixed(1)},${(15 - 0.0065 * h).toFixed(2)},${accel(t).toFixed(3)}`);
  }
  return rows.join('\n') + '\n';
}

/** Launch days, the range officer, and a few flown cards. Development only; loads once (prepare-db). */
export async function seed(knex: Knex): Promise<void> {
  const hash = await hashPassword(DEMO_PASSWORD);
  await knex('users')
    .insert({
      email: DEMO_RANGE_OFFICER.email,
      password_hash: hash,
      display_name: DEMO_RANGE_OFFICER.name,
      roles: DEMO_RANGE_OFFICER.roles,
      email_verified_at: knex.fn.now(),
    })
    .onConflict('email')
    .ignore();
  const rso = await knex('users').where('email', DEMO_RANGE_OFFICER.email).first('id');
  // Already seeded: the demo range officer (made only here) has launch days. Titles depend on the day, so not them.
  if (await knex('launches').where({ created_by: rso.id }).first('id')) return;

  const today = dateInZone(new Date(), process.env.CLUB_TIME_ZONE ?? 'America/Winnipeg');
  const ids: Record<string, number> = {};
  for (const l of LAUNCHES) {
    const date = addDays(today, l.inDays);
    const [row] = await knex('launches')
      .insert({
        title: launchTitleFor(l.title, date),
        launch_date: date,
        starts_at: '10:00',
        ends_at: '17:00',
        ...SITE,
        ceiling_metres: l.ceiling,
        waiver_version: '2026-1',
        notes: l.notes,
        status: l.status,
        call_off_reason: 'reason' in l ? l.reason : null,
        called_off_at: l.status === 'called_off' ? knex.fn.now() : null,
        sequence: l.status === 'scheduled' ? 0 : 1,
        created_by: rso.id,
      })
      .returning('id');
    ids[l.key] = Number(row.id);
  }

  // The demo member says they are coming to the next launch (and said so for the called-off one).
  const member = await knex('users').where('email', 'member@padside.test').first('id');
  if (member) {
    await knex('launch_rsvps').insert([
      { launch_id: ids['windy-saturday'], user_id: member.id, going: true },
      { launch_id: ids['fly-day'], user_id: member.id, going: true },
    ]);
  }

  const settings =
    (await knex('settings').where('key', LAUNCH_SETTINGS.key).first())?.value ?? LAUNCH_SETTINGS.defaults;
  const done = ids['shakedown'];
  for (const f of FLOWN) {
    const flyer = await knex('users as u')
      .join('memberships as m', 'm.user_id', 'u.id')
      .where('u.email', f.email)
      .first('u.id', 'm.member_number', 'm.certification_level');
    if (!flyer) continue;
    await knex('launch_attendance')
      .insert({ launch_id: done, user_id: flyer.id, member_number: flyer.member_number, checked_in_by: rso.id })
      .onConflict(['launch_id', 'user_id'])
      .ignore();
    const motors = f.motors.map((m) => parseMotorDesignation(m)!);
    const checked = flightWarnings({
      liftoffMassGrams: f.mass,
      motors,
      expectedAltitudeMetres: f.expected,
      ceilingMetres: 900,
      allowedClasses: allowedClassesFor(flyer.certification_level, settings),
    });
    const [flight] = await knex('flights')
      .insert({
        launch_id: done,
        user_id: flyer.id,
        rocket_name: f.rocket,
        liftoff_mass_grams: f.mass,
        motors: JSON.stringify(motors),
        expected_altitude_metres: f.expected,
        recovery: f.recovery,
        pad: f.pad,
        notes: '',
        thrust_to_weight: Math.round(checked.thrustToWeight * 100) / 100,
        warnings: JSON.stringify(checked.warnings),
        needs_high_power: checked.needsHighPower,
        certification_level: flyer.certification_level,
        status: 'flown',
        decided_by: rso.id,
        decided_at: knex.fn.now(),
        outcome: f.outcome,
        outcome_notes: f.notes,
        flown_at: knex.fn.now(),
      })
      .returning('id');
    if (!f.log) continue;
    // The demo chart comes from a made-up log run through the same analysis as an upload.
    const a = await analyseFlightLog(Readable.from(Buffer.from(syntheticAltimeterLog(f.log))));
    await knex('flight_data').insert({
      flight_id: flight.id,
      summary: JSON.stringify(a.summary),
      series: JSON.stringify(a.series),
      events: JSON.stringify(a.events),
      mapping: JSON.stringify(a.mapping),
      filter: a.filter,
      file_name: `${f.rocket.toLowerCase().replace(/\W+/g, '-')}.csv`,
      uploaded_by: flyer.id,
    });
  }
}
