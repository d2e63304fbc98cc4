import type { FlightEvent, FlightSeriesPoint, FlightSummary } from '@contracts/flights/flight-data';

export type { FlightEvent, FlightSeriesPoint, FlightSummary };
export type { ColumnMapping } from '@contracts/flights/column-mapping';

/** Event names in Padside's words. */
export const EVENT_LABELS: Record<FlightEvent['kind'], string> = {
  liftoff: 'Liftoff',
  burnout: 'Motor burnout',
  apogee: 'Apogee (highest point)',
  deployment: 'Descent under the main recovery device',
  landing: 'Landing',
};
