import type { FlightEvent, FlightSeriesPoint, FlightSummary } from '@contracts/flights/flight-data';

export type { FlightEvent, FlightSeriesPoint, FlightSummary };
export type { ColumnMapping } from '@contracts/flights/column-mapping';

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
