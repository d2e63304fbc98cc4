import { HttpClient, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { FlightPage } from '@contracts/launches/launch-answers';
import type { ColumnMapping, FlightSummary } from './flight-data';

/** The flight-data endpoints: a flight with its analysed log, and the log upload. */
@Injectable({ providedIn: 'root' })
export class FlightDataApi {
  private readonly http = inject(HttpClient);

  /** A flight with its summary, events and chart points. */
  get(id: number): Observable<FlightPage> {
    return this.http.get<FlightPage>(`/api/flights/${id}`);
  }

  /** Sends the log (multipart `log`) with its column mapping (`columns`, JSON), reporting upload progress. */
  uploadLog(id: number, file: File, columns: ColumnMapping | null): Observable<HttpEvent<{ summary: FlightSummary }>> {
    const body = new FormData();
    body.append('log', file);
    if (columns) body.append('columns', JSON.stringify(columns));
    return this.http.post<{ summary: FlightSummary }>(`/api/flights/${id}/data`, body, {
      reportProgress: true,
      observe: 'events',
    });
  }
}
