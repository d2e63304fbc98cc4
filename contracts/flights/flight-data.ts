/** What the server makes of a flight's altimeter log; the flight page and the build-log embed show it. */

/** What a flight came to. Times are seconds from liftoff. */
export interface FlightSummary {
  apogeeMetres: number;
  apogeeFeet: number;
  apogeeAtSeconds: number;
  maxSpeedMps: number;
  /** Descent rate under the main recovery device (m/s, positive); null when the log ends before there is one. */
  descentRateMps: number | null;
  /** The largest accelerometer reading in flight, in g (an accelerometer at rest reads 1 g); null without one. */
  peakAccelG: number | null;
  /** Liftoff to landing; null when the log ends before landing. */
  flightTimeSeconds: number | null;
  samples: number;
}

/** One moment of the flight, seconds from liftoff. */
export interface FlightEvent {
  kind: 'liftoff' | 'burnout' | 'apogee' | 'deployment' | 'landing';
  t: number;
}

/** One point of the chart: seconds from liftoff, smoothed altitude and vertical speed. */
export interface FlightSeriesPoint {
  t: number;
  altitudeM: number;
  speedMps: number;
}
