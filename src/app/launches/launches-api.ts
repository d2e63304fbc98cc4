import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type {
  CheckInAnswer,
  FlightPage,
  FlightView,
  LaunchList,
  LaunchPage,
  LaunchResults,
  LaunchView,
  Logbook,
  RangeQueue,
} from '@contracts/launches/launch-answers';
import type { FlightInput, LaunchInput, LaunchSettings } from '@contracts/launches/launch-schemas';
import {
  FLIGHT_OUTCOME_LABELS,
  FLIGHT_OUTCOMES,
  RECOVERY_LABELS,
  RECOVERY_METHODS,
  type FlightOutcome,
  type RecoveryMethod,
} from '@contracts/labels/launch-statuses';

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** Launch days and flights. Form posts are quiet: their errors show beside the fields. */
@Injectable({ providedIn: 'root' })
export class LaunchesApi {
  private readonly http = inject(HttpClient);

  /** Launch days from a date on (by default the coming ones). */
  list(range: { from?: string } = {}): Observable<LaunchList> {
    return this.http.get<LaunchList>('/api/launches', { params: new HttpParams({ fromObject: { ...range } }) });
  }
  /** `personal` (someone is signed in) skips the server render's visitor copy, so `me` is the person's own reply. */
  show(id: number, personal = false): Observable<LaunchPage> {
    return this.http.get<LaunchPage>(`/api/launches/${id}`, { transferCache: !personal });
  }
  /** A finished launch day's flights and outcomes. */
  results(id: number): Observable<LaunchResults> {
    return this.http.get<LaunchResults>(`/api/launches/${id}/results`);
  }
  /** Says whether the signed-in member is coming to a launch day. */
  rsvp(id: number, going: boolean): Observable<{ going: boolean; launch: LaunchView }> {
    return this.http.post<{ going: boolean; launch: LaunchView }>(`/api/launches/${id}/rsvp`, { going });
  }
  /** Files a flight card for a launch day; the answer carries the safety caution to show. */
  fileFlight(launchId: number, body: FlightInput): Observable<{ flight: FlightView; caution: string }> {
    return this.http.post<{ flight: FlightView; caution: string }>(`/api/launches/${launchId}/flights`, body, quiet());
  }
  /** One flight card with its decision, outcome and data. */
  flight(id: number): Observable<FlightPage> {
    return this.http.get<FlightPage>(`/api/flights/${id}`);
  }
  /** The signed-in flyer's flights across launch days. */
  logbook(): Observable<Logbook> {
    return this.http.get<Logbook>('/api/account/flights');
  }

  // The range officer's side.
  /** Every launch day, for the console. */
  adminList(): Observable<LaunchList> {
    return this.http.get<LaunchList>('/api/admin/launches');
  }
  /** Schedules a launch day; refusals come back for the fields. */
  create(body: LaunchInput): Observable<{ launch: LaunchView }> {
    return this.http.post<{ launch: LaunchView }>('/api/admin/launches', body, quiet());
  }
  /** Calls off a launch day and tells those who replied; the answer says how many. */
  callOff(id: number, reason: string): Observable<{ launch: LaunchView; notified: number }> {
    return this.http.post<{ launch: LaunchView; notified: number }>(
      `/api/admin/launches/${id}/call-off`,
      { reason },
      quiet(),
    );
  }
  /** Marks a launch day over so its results can be published. */
  markDone(id: number): Observable<{ launch: LaunchView }> {
    return this.http.post<{ launch: LaunchView }>(`/api/admin/launches/${id}/done`, {});
  }
  /** Checks a member in at the field with the token from their card. */
  checkIn(id: number, token: string): Observable<CheckInAnswer> {
    return this.http.post<CheckInAnswer>(`/api/launches/${id}/check-in`, { token }, quiet());
  }
  /** Which certification classes each level may fly. */
  settings(): Observable<LaunchSettings> {
    return this.http.get<LaunchSettings>('/api/admin/launches/settings');
  }
  /** Saves the certification classes per level. */
  saveSettings(body: LaunchSettings): Observable<LaunchSettings> {
    return this.http.put<LaunchSettings>('/api/admin/launches/settings', body, quiet());
  }
  /** The range table's queue of flight cards for a launch day. */
  queue(id: number): Observable<RangeQueue> {
    return this.http.get<RangeQueue>(`/api/admin/launches/${id}/queue`);
  }
  /** Records the range safety officer's approval or refusal of a flight card. */
  decide(flightId: number, approve: boolean, reason?: string): Observable<{ flight: FlightView }> {
    return this.http.post<{ flight: FlightView }>(
      `/api/admin/flights/${flightId}/decision`,
      { approve, reason },
      quiet(),
    );
  }
  /** Records how a flight went, with notes. */
  outcome(flightId: number, outcome: FlightOutcome, notes?: string): Observable<{ flight: FlightView }> {
    return this.http.post<{ flight: FlightView }>(
      `/api/admin/flights/${flightId}/outcome`,
      { outcome, notes },
      quiet(),
    );
  }
}

/** Padside's words for outcomes, in the order the range officer picks from. */
export const OUTCOMES: { value: FlightOutcome; label: string }[] = FLIGHT_OUTCOMES.map((value) => ({
  value,
  label: FLIGHT_OUTCOME_LABELS[value],
}));

/** Padside's words for recovery methods, in the order the flight card offers them. */
export const RECOVERY: { value: RecoveryMethod; label: string }[] = RECOVERY_METHODS.map((value) => ({
  value,
  label: RECOVERY_LABELS[value],
}));
