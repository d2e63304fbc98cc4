/** What the launch and flight routes answer: the server types its views with these; the app reads them. */
import type { FlightEvent, FlightSeriesPoint, FlightSummary } from '../flights/flight-data';
import type { FlightOutcome, FlightStatus, LaunchStatus } from '../labels/launch-statuses';

/** A launch day as every answer shows it. */
export interface LaunchView {
  id: number;
  title: string;
  /** The club-time calendar day, YYYY-MM-DD. */
  date: string;
  /** Club-time HH:MM. */
  startsAt: string;
  endsAt: string;
  status: LaunchStatus;
  statusLabel: string;
  callOffReason: string | null;
  site: { name: string; address: string | null; lat: number | null; lon: number | null };
  ceilingMetres: number | null;
  waiverVersion: string | null;
  notes: string;
  rsvpCount: number;
}

/** One motor as Padside read it from its designation (the server parses, stores and answers this shape). */
export interface MotorView {
  /** The designation as given, trimmed and upper-cased (`H128W-M`). */
  designation: string;
  /** The total-impulse class: `1/4A`, `1/2A`, `A` ... `O`. */
  impulseClass: string;
  averageThrustN: number;
  /** Seconds from burnout to the ejection charge; null when plugged or set by an adjustable delay with no number. */
  delayS: number | null;
  /** No ejection charge (`-P`): a booster's upper end is open, a plugged motor's is sealed. */
  plugged: boolean;
  /** The lower end of the class as classification tables print it (more than the class below's maximum). */
  totalImpulseMinNs: number;
  /** The upper end of the class, inclusive. */
  totalImpulseMaxNs: number;
}

/** A flight card as its flyer, the range officer and the public flight page see it. */
export interface FlightView {
  id: number;
  launchId: number;
  launchTitle: string;
  launchDate: string;
  flyer: { userId: number; name: string; certificationLevel: string };
  rocketName: string;
  postSlug: string | null;
  liftoffMassGrams: number;
  motors: MotorView[];
  expectedAltitudeMetres: number | null;
  recovery: string | null;
  pad: string | null;
  notes: string;
  thrustToWeight: number;
  warnings: { code: string; message: string }[];
  needsHighPower: boolean;
  status: FlightStatus;
  statusLabel: string;
  decisionReason: string | null;
  outcome: FlightOutcome | null;
  outcomeLabel: string | null;
  outcomeNotes: string | null;
  apogeeMetres: number | null;
  filedAt: string;
}

/** A flight's stored analysis: summary, the downsampled series for the chart, events, the column mapping and filter. */
export interface FlightDataView {
  summary: FlightSummary;
  series: FlightSeriesPoint[];
  events: FlightEvent[];
  mapping: unknown;
  filter: string;
  fileName: string | null;
  uploadedAt: string;
}

/** GET /api/launches and /api/admin/launches. */
export interface LaunchList {
  items: LaunchView[];
  timeZone: string;
}

/** GET /api/launches/:id: a signed-in caller also gets their own reply and check-in. */
export interface LaunchPage {
  launch: LaunchView;
  me: { going: boolean | null; checkedIn: boolean } | null;
  timeZone: string;
}

/** GET /api/launches/:id/results: the flown cards, the highest flight and the outcomes. */
export interface LaunchResults {
  launch: LaunchView;
  flights: FlightView[];
  highest: FlightView | null;
  outcomes: Record<string, number>;
  caution: string;
}

/** GET /api/flights/:id. */
export interface FlightPage {
  flight: FlightView;
  data: FlightDataView | null;
  caution: string;
}

/** GET /api/account/flights: a member's flights with their totals. */
export interface Logbook {
  items: FlightView[];
  totals: {
    flights: number;
    flown: number;
    motorsByClass: Record<string, number>;
    totalImpulseNs: { min: number; max: number };
    bestAltitude: { flightId: number; rocketName: string; apogeeMetres: number; launchDate: string } | null;
  };
  caution: string;
}

/** GET /api/admin/launches/:id/queue: every card of a launch, grouped by pad. */
export interface RangeQueue {
  launch: LaunchView;
  caution: string;
  pads: { pad: string | null; items: FlightView[] }[];
}

/** POST /api/launches/:id/check-in. */
export interface CheckInAnswer {
  checkedIn: boolean;
  alreadyCheckedIn: boolean;
  member: { memberNumber: string; name: string; status: string; certificationLevel: string | null };
}
