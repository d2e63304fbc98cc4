import { altitudeAbovePadMetres } from './pressure-altitude';
import { findCorner, median, movingAverage, smoothQuadratic } from './smoothing';

/**
 * The arithmetic of an altimeter log: altitude above the pad from pressure, smoothing, the flight's events and its
 * summary. Pure: arrays in, numbers out; the CSV reading lives in analyse-flight-log.ts.
 */

/** One log's readings, in SI units and g, with strictly increasing times (s). */
export interface FlightSamples {
  t: Float64Array;
  pressurePa: Float64Array;
  /** Accelerometer reading in g (the magnitude when three axes were logged); null when the log has none. */
  accelG: Float64Array | null;
}

export type { FlightEvent, FlightSeriesPoint, FlightSummary } from '../../../contracts/flights/flight-data';
import type { FlightEvent, FlightSeriesPoint, FlightSummary } from '../../../contracts/flights/flight-data';

/** The analysis without the column mapping it was read with. */
export interface FlightSampleAnalysis {
  summary: FlightSummary;
  series: FlightSeriesPoint[];
  events: FlightEvent[];
  filter: string;
}

/** Why a log holds no flight Padside can analyse; the caller words it for the user. */
export class NoFlightFound extends Error {}

/** At most this many chart points. */
export const MAX_SERIES_POINTS = 1000;
const FEET_PER_METRE = 1 / 0.3048;
const MIN_APOGEE_M = 3;
const STILL_WINDOW_S = 2;
const STILL_RANGE_M = 0.5;
const ACCEL_WINDOW_S = 0.05;

const round = (n: number, digits: number) => Math.round(n * 10 ** digits) / 10 ** digits;

function medianGap(t: Float64Array): number {
  const gaps = new Float64Array(Math.max(0, t.length - 1));
  for (let i = 1; i < t.length; i++) gaps[i - 1] = t[i] - t[i - 1];
  return median(gaps) || 0;
}

/** The smoothing window: one second, or ten samples for slow loggers. */
export function smoothingWindowSeconds(t: Float64Array): number {
  return Math.max(1, 10 * medianGap(t));
}

/** The words the analysis uses to say how it smoothed. */
export function describeFilter(windowS: number, hasAccel: boolean, binned: boolean): string {
  const w = round(windowS, 2);
  return (
    (binned ? `Readings averaged into ${BIN_S * 1000} ms bins, then ` : '') +
    `Savitzky–Golay smoothing (quadratic least squares) of the altitude over ${w} s windows, centred or one-sided ` +
    `whichever fits best, so burnout and deployment stay sharp; speed is the slope of the fitted quadratic.` +
    (hasAccel ? ` Acceleration: centred moving average over ${ACCEL_WINDOW_S} s.` : '')
  );
}

function firstIndexAtOrAfter(t: Float64Array, time: number): number {
  let lo = 0,
    hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (t[mid] < time) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Liftoff time: from the accelerometer where it shows the boost, else extrapolated from the climb. */
function findLiftoff(
  t: Float64Array,
  alt: Float64Array,
  speed: Float64Array,
  apogeeIndex: number,
  accel: Float64Array | null,
): number {
  const threshold = Math.max(1, Math.min(5, alt[apogeeIndex] * 0.1));
  let k = apogeeIndex;
  while (k > 0 && alt[k - 1] >= threshold) k--;
  // Under a steady push h = a (t - t0)^2 / 2 and v = a (t - t0), so t0 = t - 2 h / v.
  const fromClimb = speed[k] > 0 ? Math.max(t[0], t[k] - (2 * alt[k]) / speed[k]) : t[k];
  if (accel) {
    // A boost reads well over the 1 g of the pad; walk back to where it began. A reading that never drops to the
    // pad's, or a start long before the climb, is a wrong column or unit, and the climb decides instead.
    let j = k;
    while (j > 0 && accel[j] > 1.5) j--;
    if (j < k && accel[j] <= 1.5 && t[j + 1] >= fromClimb - 1) return t[j + 1];
  }
  return fromClimb;
}

/** Index of the first sample from which the altitude stays within a half-metre band for two seconds. */
function findLanding(t: Float64Array, alt: Float64Array, from: number): number | null {
  const n = t.length;
  let hi = from;
  for (let i = from; i < n; i++) {
    while (hi + 1 < n && t[hi + 1] <= t[i] + STILL_WINDOW_S) hi++;
    if (t[hi] - t[i] < STILL_WINDOW_S * 0.75) return null;
    let min = Infinity,
      max = -Infinity;
    for (let k = i; k <= hi; k++) {
      if (alt[k] < min) min = alt[k];
      if (alt[k] > max) max = alt[k];
    }
    if (max - min < STILL_RANGE_M) return i;
  }
  return null;
}

/**
 * Descent rate under the main device and where the descent settled to it: the rate of the last seconds before
 * landing, then back from there for as long as the speed stays near it (so a main opened low after a fast drogue
 * descent is read on its own), then the median over that stretch.
 */
function findDescent(
  t: Float64Array,
  speed: Float64Array,
  apogee: number,
  end: number,
): { rate: number; deployment: number } | null {
  const span = t[end] - t[apogee];
  if (span < 1) return null;
  const to = firstIndexAtOrAfter(t, t[end] - Math.min(0.5, 0.1 * span));
  const from = Math.max(apogee, firstIndexAtOrAfter(t, t[to] - Math.min(3, 0.5 * span)));
  if (to - from < 3) return null;
  const last = -median(speed.subarray(from, to));
  if (!(last > 0)) return null;
  const tolerance = Math.max(0.5, 0.15 * last);
  // Walk back on the speed averaged over half a second, so one noisy reading does not end the steady stretch.
  const steady = movingAverage(t.subarray(apogee, to + 1), speed.subarray(apogee, to + 1), 0.5);
  let k = from;
  while (k > apogee && Math.abs(-steady[k - 1 - apogee] - last) <= tolerance) k--;
  return { rate: -median(speed.subarray(k, to)), deployment: k };
}

/** Evenly spaced indices from lo to hi (inclusive), at most `max`, always including `keep`. */
export function downsampleIndices(lo: number, hi: number, max: number, keep: number[]): number[] {
  const count = hi - lo + 1;
  const inRange = keep.filter((k) => k >= lo && k <= hi);
  if (count <= max) return Array.from({ length: count }, (_, i) => lo + i);
  const step = Math.ceil(count / (max - inRange.length - 1));
  const picked = new Set<number>(inRange);
  for (let i = lo; i <= hi; i += step) picked.add(i);
  picked.add(hi);
  return [...picked].sort((a, b) => a - b);
}

/** Readings faster than this are averaged into bins of this length first (s). */
export const BIN_S = 0.01;

/**
 * Averages readings into bins of `binS` seconds when the logger sampled faster (a 1,000 Hz log becomes 100 Hz):
 * the smoothing costs grow with the samples per window, and averaging also lowers the noise.
 */
export function binSamples(samples: FlightSamples, binS: number): FlightSamples {
  const { t, pressurePa, accelG } = samples;
  const n = t.length;
  const bt = new Float64Array(n),
    bp = new Float64Array(n),
    ba = accelG ? new Float64Array(n) : null;
  let m = 0;
  for (let i = 0; i < n;) {
    const start = t[i];
    let k = i,
      st = 0,
      sp = 0,
      sa = 0;
    while (k < n && t[k] < start + binS) {
      st += t[k];
      sp += pressurePa[k];
      if (accelG) sa += accelG[k];
      k++;
    }
    const count = k - i;
    bt[m] = st / count;
    bp[m] = sp / count;
    if (ba) ba[m] = sa / count;
    m++;
    i = k;
  }
  return { t: bt.subarray(0, m), pressurePa: bp.subarray(0, m), accelG: ba ? ba.subarray(0, m) : null };
}

/** Altitude, events and summary of one log's samples; throws NoFlightFound when the log shows no flight. */
export function analyseSamples(logged: FlightSamples): FlightSampleAnalysis {
  if (logged.t.length < 10) throw new NoFlightFound('The log has fewer than 10 readings.');
  const samples = medianGap(logged.t) < BIN_S * 0.9 ? binSamples(logged, BIN_S) : logged;
  const { t, pressurePa } = samples;
  const n = t.length;
  const windowS = smoothingWindowSeconds(t);

  // A first pad pressure from the first second; refined below from everything before liftoff.
  const firstSecond = Math.max(5, firstIndexAtOrAfter(t, t[0] + 1));
  const pad0 = median(pressurePa.subarray(0, firstSecond));
  const alt = new Float64Array(n);
  for (let i = 0; i < n; i++) alt[i] = altitudeAbovePadMetres(pressurePa[i], pad0);
  const s = smoothQuadratic(t, alt, windowS);
  const accel = samples.accelG ? movingAverage(t, samples.accelG, ACCEL_WINDOW_S) : null;

  let apogee = 0;
  for (let i = 1; i < n; i++) if (s.value[i] > s.value[apogee]) apogee = i;
  if (s.value[apogee] - s.value[0] < MIN_APOGEE_M) throw new NoFlightFound('The log shows no climb of more than 3 m.');

  // Pad pressure: the median before liftoff (half a second of margin). The altitude shifts by a constant, and a
  // least-squares fit shifts with it, so the smoothing need not be redone.
  let liftoff = findLiftoff(t, s.value, s.slope, apogee, accel);
  const beforeLiftoff = firstIndexAtOrAfter(t, liftoff - 0.5);
  if (beforeLiftoff >= 5) {
    const shift = altitudeAbovePadMetres(median(pressurePa.subarray(0, beforeLiftoff)), pad0);
    for (let i = 0; i < n; i++) s.value[i] -= shift;
    liftoff = findLiftoff(t, s.value, s.slope, apogee, accel);
  }

  // Apogee between samples: the vertex of the quadratic fitted at the highest sample.
  let apogeeT = t[apogee];
  let apogeeM = s.value[apogee];
  if (s.curvature[apogee] < 0) {
    const d = -s.slope[apogee] / s.curvature[apogee];
    if (Math.abs(d) <= windowS / 2) {
      apogeeT += d;
      apogeeM += s.slope[apogee] * d + 0.5 * s.curvature[apogee] * d * d;
    }
  }

  const liftoffIndex = firstIndexAtOrAfter(t, liftoff);
  let maxSpeedIndex = liftoffIndex;
  for (let i = liftoffIndex; i <= apogee; i++) if (s.slope[i] > s.slope[maxSpeedIndex]) maxSpeedIndex = i;
  // The speed peaks at a corner (the push stops), where any smoothing window either shaves the peak or, on noisy
  // data, overshoots it; a fit with a corner in it reads the peak without either.
  const corner = findCorner(
    t,
    s.value,
    firstIndexAtOrAfter(t, t[maxSpeedIndex] - windowS / 2),
    firstIndexAtOrAfter(t, t[maxSpeedIndex] + windowS / 2),
    windowS,
  );
  const maxSpeed = corner && corner.slope > 0 ? corner.slope : s.slope[maxSpeedIndex];
  let burnoutT = corner && corner.slope > 0 ? corner.t : t[maxSpeedIndex];
  if (accel) {
    // Thrust no longer lifts the rocket once the reading falls under 1 g.
    for (let i = liftoffIndex; i <= apogee; i++) {
      if (accel[i] < 1 && t[i] > liftoff + 0.05) {
        burnoutT = t[i];
        break;
      }
    }
  }

  const landing = findLanding(t, s.value, apogee);
  const descent = findDescent(t, s.slope, apogee, landing ?? n - 1);
  const flightEnd = landing ?? n - 1;

  let peakAccelG: number | null = null;
  if (accel) {
    peakAccelG = -Infinity;
    for (let i = firstIndexAtOrAfter(t, liftoff - 0.5); i <= flightEnd; i++)
      peakAccelG = Math.max(peakAccelG, accel[i]);
  }

  const events: FlightEvent[] = [
    { kind: 'liftoff', t: 0 },
    { kind: 'burnout', t: round(burnoutT - liftoff, 3) },
    { kind: 'apogee', t: round(apogeeT - liftoff, 3) },
  ];
  if (descent) events.push({ kind: 'deployment', t: round(t[descent.deployment] - liftoff, 3) });
  if (landing !== null) events.push({ kind: 'landing', t: round(t[landing] - liftoff, 3) });

  const lo = Math.max(0, firstIndexAtOrAfter(t, liftoff - 2));
  const hi = Math.min(n - 1, firstIndexAtOrAfter(t, t[flightEnd] + 2));
  const series = downsampleIndices(lo, hi, MAX_SERIES_POINTS, [apogee, maxSpeedIndex]).map((i) => ({
    t: round(t[i] - liftoff, 3),
    altitudeM: round(s.value[i], 2),
    speedMps: round(s.slope[i], 2),
  }));

  return {
    summary: {
      apogeeMetres: round(apogeeM, 2),
      apogeeFeet: round(apogeeM * FEET_PER_METRE, 1),
      apogeeAtSeconds: round(apogeeT - liftoff, 3),
      maxSpeedMps: round(maxSpeed, 2),
      descentRateMps: descent ? round(descent.rate, 2) : null,
      peakAccelG: peakAccelG === null ? null : round(peakAccelG, 2),
      flightTimeSeconds: landing === null ? null : round(t[landing] - liftoff, 3),
      samples: logged.t.length,
    },
    series,
    events,
    filter: describeFilter(windowS, accel !== null, samples !== logged),
  };
}
