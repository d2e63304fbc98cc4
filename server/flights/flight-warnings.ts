import { impulseClassRank, type MotorDesignation } from './motor-designation';

/**
 * The checks on a flight card, shown to the flyer and the range officer as warnings in words. They never allow a
 * flight: the range safety officer decides, under the national association's safety code and local aviation and
 * fire rules. Pure: no I/O.
 */

/** Standard gravity, m/s^2 (the conventional value, CGPM 1901). */
export const STANDARD_GRAVITY = 9.80665;
/** Thrust-to-weight at liftoff below this warns (common practice, no source). */
export const MIN_THRUST_TO_WEIGHT = 5;
/** Model-rocket limits in the usual safety codes (NFPA 1122 and the codes based on it, from memory). */
export const MODEL_ROCKET_MAX_LIFTOFF_GRAMS = 1500;
export const MODEL_ROCKET_MAX_TOTAL_IMPULSE_NS = 320;
/** The first class that is high-power whatever the rocket weighs (from memory). */
export const FIRST_HIGH_POWER_CLASS = 'H';

/** What the checks need from a card. `allowedClasses` are the classes the flyer's verified certification allows. */
export interface FlightWarningsInput {
  liftoffMassGrams: number;
  motors: MotorDesignation[];
  expectedAltitudeMetres: number | null;
  ceilingMetres: number | null;
  /**
   * The classes the flyer's verified certification allows (a club setting per level). A list covers every class up
   * to its largest, so a level may list only the classes it adds. Null or empty: nothing verified, which covers
   * model-rocket flights only.
   */
  allowedClasses: string[] | null;
}

/** One warning: a stable code for the program, a message for people. */
export interface FlightWarning {
  code: string;
  message: string;
}

/** The result of the checks. */
export interface FlightWarnings {
  thrustToWeight: number;
  warnings: FlightWarning[];
  needsHighPower: boolean;
}

/**
 * Motors lit at liftoff: all of them for a single motor or a cluster. When boosters (delay 0, which light the stage
 * above) are filed with motors that have a delay or are plugged, the card is read as a staged rocket and only the
 * boosters count, since the upper stages light later.
 */
export function motorsLitAtLiftoff(motors: MotorDesignation[]): MotorDesignation[] {
  const boosters = motors.filter((m) => m.delayS === 0);
  return boosters.length > 0 && boosters.length < motors.length ? boosters : motors;
}

/** Average thrust of the motors lit at liftoff over the rocket's weight; 0 without motors or mass. */
export function thrustToWeight(liftoffMassGrams: number, motors: MotorDesignation[]): number {
  if (!(liftoffMassGrams > 0)) return 0;
  const thrustN = motorsLitAtLiftoff(motors).reduce((sum, m) => sum + m.averageThrustN, 0);
  return thrustN / ((liftoffMassGrams / 1000) * STANDARD_GRAVITY);
}

/** The most total impulse the motors can hold: the sum of their classes' upper ends, N s. */
export function totalImpulseMaxNs(motors: MotorDesignation[]): number {
  return motors.reduce((sum, m) => sum + m.totalImpulseMaxNs, 0);
}

const round1 = (n: number) => Math.round(n * 10) / 10;
const fmt = (n: number) => n.toLocaleString('en-CA', { maximumFractionDigits: 1 });

/** The reasons a flight is beyond model rocketry, in words; empty when none. */
function highPowerReasons(input: FlightWarningsInput): string[] {
  const reasons: string[] = [];
  if (input.liftoffMassGrams > MODEL_ROCKET_MAX_LIFTOFF_GRAMS) {
    reasons.push(
      `it weighs ${fmt(input.liftoffMassGrams)} g at liftoff (model rockets stay at or under ${fmt(MODEL_ROCKET_MAX_LIFTOFF_GRAMS)} g)`,
    );
  }
  const impulse = totalImpulseMaxNs(input.motors);
  if (impulse > MODEL_ROCKET_MAX_TOTAL_IMPULSE_NS) {
    reasons.push(
      `its motors can hold up to ${fmt(impulse)} N·s together (model rockets stay at or under ${MODEL_ROCKET_MAX_TOTAL_IMPULSE_NS} N·s)`,
    );
  }
  const firstHighPower = impulseClassRank(FIRST_HIGH_POWER_CLASS);
  const big = input.motors.filter((m) => impulseClassRank(m.impulseClass) >= firstHighPower).map((m) => m.designation);
  if (big.length > 0)
    reasons.push(`${big.join(', ')} ${big.length === 1 ? 'is' : 'are'} class ${FIRST_HIGH_POWER_CLASS} or above`);
  return reasons;
}

/** Runs every check on a card and words what it finds. */
export function flightWarnings(input: FlightWarningsInput): FlightWarnings {
  const warnings: FlightWarning[] = [];
  const ratio = thrustToWeight(input.liftoffMassGrams, input.motors);

  if (input.motors.length > 0 && ratio < MIN_THRUST_TO_WEIGHT) {
    warnings.push({
      code: 'low_thrust_to_weight',
      message:
        `The motors lit at liftoff push about ${fmt(round1(ratio))} times the rocket's weight. ` +
        `Flyers usually look for at least ${MIN_THRUST_TO_WEIGHT} to 1 so the rocket leaves the rail fast enough to fly straight. ` +
        'A lighter rocket or a motor with more average thrust raises it.',
    });
  }

  if (
    input.expectedAltitudeMetres !== null &&
    input.ceilingMetres !== null &&
    input.expectedAltitudeMetres > input.ceilingMetres
  ) {
    warnings.push({
      code: 'above_ceiling',
      message:
        `The expected altitude of ${fmt(input.expectedAltitudeMetres)} m is above this launch's ceiling of ${fmt(input.ceilingMetres)} m. ` +
        'A smaller motor or a heavier rocket keeps the flight under it; the range safety officer has the last word.',
    });
  }

  const reasons = highPowerReasons(input);
  const needsHighPower = reasons.length > 0;
  if (needsHighPower) {
    warnings.push({
      code: 'high_power',
      message:
        `This looks like a high-power flight: ${reasons.join('; ')}. ` +
        'High-power flights need a flyer certified for them under the national association’s safety code.',
    });
  }

  const allowed = input.allowedClasses ?? [];
  const topAllowed = Math.max(-1, ...allowed.map(impulseClassRank));
  if (needsHighPower && topAllowed < impulseClassRank(FIRST_HIGH_POWER_CLASS)) {
    warnings.push({
      code: 'beyond_certification',
      message:
        'No verified high-power certification is on record for this flyer, and this flight needs one. A range officer can record it once it is checked.',
    });
  } else if (allowed.length > 0) {
    const beyond = motorsBeyondClasses(input.motors, allowed);
    if (beyond.length > 0) {
      warnings.push({
        code: 'beyond_certification',
        message: `${beyond.join(', ')} ${beyond.length === 1 ? 'is' : 'are'} beyond the classes this flyer's verified certification covers (up to ${highestClass(allowed)}).`,
      });
    }
  }

  return { thrustToWeight: ratio, warnings, needsHighPower };
}

function highestClass(classes: string[]): string {
  return classes
    .reduce((best, c) => (impulseClassRank(c) > impulseClassRank(best) ? c : best), classes[0])
    .toUpperCase();
}

/** Motors of a class above the largest allowed one (a club may list only the classes a level adds). */
function motorsBeyondClasses(motors: MotorDesignation[], allowedClasses: string[]): string[] {
  const top = Math.max(...allowedClasses.map(impulseClassRank));
  return motors.filter((m) => impulseClassRank(m.impulseClass) > top).map((m) => m.designation);
}
