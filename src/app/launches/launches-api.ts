import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type { FlightEvent, FlightSummary } from '../flights/flight-data';
import { FLIGHT_OUTCOME_LABELS, FLIGHT_OUTCOMES, RECOVERY_LABELS, RECOVERY_METHODS, type FlightOutcome as Outcome, type FlightStatus, type LaunchStatus } from '@contracts/labels/launch-statuses';

export type { FlightEvent, FlightSummary } from '../flights/flight-data';

export type { LaunchStatus } from '@contracts/labels/launch-statuses';

/** A launch day as the API shows it. */
export interface Launch {
  id: number;
  title: string;
  date: string;
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

/** A launch as a launch director writes it. */
export interface LaunchInput {
  title: string;
  date: string;
  startsAt: string;
  endsAt: string;
  site: { name: string; address?: string | null; lat?: number | null; lon?: number | null };
  ceilingMetres?: number | null;
  notes?: string | null;
}

export interface Motor {
  designation: string;
  impulseClass: string;
  averageThrustN: number;
  delayS: number | null;
  plugged: boolean;
  totalImpulseMinNs: number;
  totalImpulseMaxNs: number;
}

export type { FlightStatus, FlightOutcome as Outcome } from '@contracts/labels/launch-statuses';

/** A flight card. */
export interface Flight {
  id: number;
  launchId: number;
  launchTitle: string;
  launchDate: string;
  flyer: { userId: number; name: string; certificationLevel: string };
  rocketName: string;
  postSlug: string | null;
  liftoffMassGrams: number;
  motors: Motor[];
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
  outcome: Outcome | null;
  outcomeLabel: string | null;
  outcomeNotes: string | null;
  apogeeMetres: number | null;
}

/** A flight page: the card, its analysed log (if any) and the caution. */
export interface FlightPageData {
  flight: Flight;
  data: { summary: FlightSummary; series: { t: number; altitudeM: number; speedMps: number }[]; events: FlightEvent[]; filter: string; fileName: string | null } | null;
  caution: string;
}

export interface FlightInput {
  rocketName: string;
  liftoffMassGrams: number | null;
  motors: string[];
  expectedAltitudeMetres?: number | null;
  recovery?: string | null;
  postSlug?: string | null;
  pad?: string | null;
  notes?: string | null;
}

export interface Logbook {
  items: Flight[];
  totals: { flights: number; flown: number; motorsByClass: Record<string, number>; totalImpulseNs: { min: number; max: number }; bestAltitude: { flightId: number; rocketName: string; apogeeMetres: number; launchDate: string } | null };
  caution: string;
}

export interface Queue {
  launch: Launch;
  caution: string;
  pads: { pad: string | null; items: Flight[] }[];
}

/** The impulse classes each certification level allows (a club setting: associations differ). */
export interface LaunchSettings {
  classesByLevel: Record<string, string[]>;
}

export interface CheckInAnswer {
  checkedIn: boolean;
  alreadyCheckedIn: boolean;
  member: { memberNumber: string; name: string; status: string; certificationLevel: string | null };
}

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** Launch days and flights. Form posts are quiet: their errors show beside the fields. */
@Injectable({ providedIn: 'root' })
export class LaunchesApi {
  private readonly http = inject(HttpClient);

  list(range: { from?: string } = {}): Observable<{ items: Launch[]; timeZone: string }> {
    return this.http.get<{ items: Launch[]; timeZone: string }>('/api/launches', { params: new HttpParams({ fromObject: { ...range } }) });
  }
  /** `personal` (someone is signed in) skips the server render's visitor copy, so `me` is the person's own reply. */
  show(id: number, personal = false): Observable<{ launch: Launch; me: { going: boolean | null; checkedIn: boolean } | null; timeZone: string }> {
    return this.http.get<{ launch: Launch; me: { going: boolean | null; checkedIn: boolean } | null; timeZone: string }>(`/api/launches/${id}`, { transferCache: !personal });
  }
  results(id: number): Observable<{ launch: Launch; flights: Flight[]; highest: Flight | null; outcomes: Record<string, number>; caution: string }> {
    return this.http.get<{ launch: Launch; flights: Flight[]; highest: Flight | null; outcomes: Record<string, number>; caution: string }>(`/api/launches/${id}/results`);
  }
  rsvp(id: number, going: boolean): Observable<{ going: boolean; launch: Launch }> {
    return this.http.post<{ going: boolean; launch: Launch }>(`/api/launches/${id}/rsvp`, { going });
  }
  fileFlight(launchId: number, body: FlightInput): Observable<{ flight: Flight; caution: string }> {
    return this.http.post<{ flight: Flight; caution: string }>(`/api/launches/${launchId}/flights`, body, quiet());
  }
  flight(id: number): Observable<FlightPageData> {
    return this.http.get<FlightPageData>(`/api/flights/${id}`);
  }
  logbook(): Observable<Logbook> {
    return this.http.get<Logbook>('/api/account/flights');
  }

  // The range officer's side.
  adminList(): Observable<{ items: Launch[]; timeZone: string }> {
    return this.http.get<{ items: Launch[]; timeZone: string }>('/api/admin/launches');
  }
  create(body: LaunchInput): Observable<{ launch: Launch }> {
    return this.http.post<{ launch: Launch }>('/api/admin/launches', body, quiet());
  }
  callOff(id: number, reason: string): Observable<{ launch: Launch; notified: number }> {
    return this.http.post<{ launch: Launch; notified: number }>(`/api/admin/launches/${id}/call-off`, { reason }, quiet());
  }
  markDone(id: number): Observable<{ launch: Launch }> {
    return this.http.post<{ launch: Launch }>(`/api/admin/launches/${id}/done`, {});
  }
  checkIn(id: number, token: string): Observable<CheckInAnswer> {
    return this.http.post<CheckInAnswer>(`/api/launches/${id}/check-in`, { token }, quiet());
  }
  settings(): Observable<LaunchSettings> {
    return this.http.get<LaunchSettings>('/api/admin/launches/settings');
  }
  saveSettings(body: LaunchSettings): Observable<LaunchSettings> {
    return this.http.put<LaunchSettings>('/api/admin/launches/settings', body, quiet());
  }
  queue(id: number): Observable<Queue> {
    return this.http.get<Queue>(`/api/admin/launches/${id}/queue`);
  }
  decide(flightId: number, approve: boolean, reason?: string): Observable<{ flight: Flight }> {
    return this.http.post<{ flight: Flight }>(`/api/admin/flights/${flightId}/decision`, { approve, reason }, quiet());
  }
  outcome(flightId: number, outcome: Outcome, notes?: string): Observable<{ flight: Flight }> {
    return this.http.post<{ flight: Flight }>(`/api/admin/flights/${flightId}/outcome`, { outcome, notes }, quiet());
  }
}

/** Padside's words for outcomes, in the order the range officer picks from. */
export const OUTCOMES: { value: Outcome; label: string }[] = FLIGHT_OUTCOMES.map((value) => ({ value, label: FLIGHT_OUTCOME_LABELS[value] }));

/** Padside's words for recovery methods, in the order the flight card offers them. */
export const RECOVERY: { value: string; label: string }[] = RECOVERY_METHODS.map((value) => ({ value, label: RECOVERY_LABELS[value] }));
