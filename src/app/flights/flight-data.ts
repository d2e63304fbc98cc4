/** What the server makes of a flight's altimeter log (server/flights/flight-log): times are seconds from liftoff. */
export interface FlightSummary {
  apogeeMetres: number;
  apogeeFeet?: number;
  apogeeAtSeconds: number;
  maxSpeedMps: number;
  /** Descent rate under the main recovery device; null when the log ends before there is one. */
  descentRateMps: number | null;
  /** Largest accelerometer reading in g (1 g at rest); null when the log has no accelerometer. */
  peakAccelG: number | null;
  /** Null when the log ends before landing. */
  flightTimeSeconds: number | null;
  samples: number;
}

/** One moment of the flight. */
export interface FlightEvent {
  kind: 'liftoff' | 'burnout' | 'apogee' | 'deployment' | 'landing';
  t: number;
}

/** One chart point: seconds from liftoff, smoothed altitude above the pad, vertical speed. */
export interface FlightSeriesPoint {
  t: number;
  altitudeM: number;
  speedMps: number;
}

/** Which columns of a log hold what (the `columns` field of an upload). */
export interface ColumnMapping {
  time: { column: string; unit: 's' | 'ms' };
  pressure: { column: string; unit: 'Pa' | 'hPa' };
  temperature?: { column: string; unit: 'C' };
  acceleration?: { columns: string[]; unit: 'g' | 'm/s2' };
}

/** A flight's analysed log. */
export interface FlightData {
  summary: FlightSummary | null;
  series: FlightSeriesPoint[] | null;
  events: FlightEvent[] | null;
}

/**
 * `GET /api/flights/:id`: the card and, once a log is in, its summary and chart series, either beside the card or
 * under `data` (null before a log is in); the embed reads both.
 */
export interface FlightDetail extends Partial<FlightData> {
  flight: { id: number; rocketName?: string; [key: string]: unknown };
  data?: FlightData | null;
}

/** Event names in Padside's words. */
export const EVENT_LABELS: Record<FlightEvent['kind'], string> = {
  liftoff: 'Liftoff',
  burnout: 'Motor burnout',
  apogee: 'Apogee (highest point)',
  deployment: 'Descent under the main recovery device',
  landing: 'Landing',
};
