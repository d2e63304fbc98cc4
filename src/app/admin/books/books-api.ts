import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';
import type { Dashboard, RevenueReport, SponsorValue, TaxReport } from '@contracts/books/books-answers';
import type { DateRange, FeePercent } from '@contracts/books/books-schemas';

/** The treasurer's reports. */
@Injectable({ providedIn: 'root' })
export class BooksApi {
  private readonly http = inject(HttpClient);

  /** Tax collected and to remit for a period, by jurisdiction. */
  tax(p: DateRange): Observable<TaxReport> {
    return this.http.get<TaxReport>('/api/admin/reports/tax', { params: new HttpParams({ fromObject: { ...p } }) });
  }
  /** Income by month for a period, with its totals (tax kept apart). */
  revenue(p: DateRange): Observable<RevenueReport> {
    return this.http.get<RevenueReport>('/api/admin/reports/revenue', {
      params: new HttpParams({ fromObject: { ...p } }),
    });
  }
  /** The cash and parts sponsors have given, against what they were promised. */
  sponsorValue(): Observable<SponsorValue> {
    return this.http.get<SponsorValue>('/api/admin/reports/sponsor-value');
  }
  /** The figures and charts of the console's first page. */
  dashboard(): Observable<Dashboard> {
    return this.http.get<Dashboard>('/api/admin/dashboard');
  }
  /** Every print run, to pick one for the units-by-size report. */
  runs(): Observable<{ items: { id: number; name: string; productName: string; state: string }[] }> {
    return this.http.get<{ items: { id: number; name: string; productName: string; state: string }[] }>(
      '/api/admin/runs',
    );
  }
  /** How many units of a run sold in each size. */
  unitsBySize(runId: number): Observable<{ items: { label: string; units: number }[] }> {
    return this.http.get<{ items: { label: string; units: number }[] }>('/api/admin/reports/units-by-size', {
      params: { runId },
    });
  }
  /** The processor fee rates the books use. */
  fees(): Observable<FeePercent> {
    return this.http.get<FeePercent>('/api/admin/settings/processor-fees');
  }
  /** Saves the processor fee rates; refusals come back for the fields. */
  saveFees(s: FeePercent): Observable<FeePercent> {
    return this.http.put<FeePercent>('/api/admin/settings/processor-fees', s, {
      context: new HttpContext().set(QUIET_ERRORS, true),
    });
  }
  /** A link the browser downloads directly (the session cookie authorises it). */
  csvUrl(report: 'tax.csv' | 'ledger.csv', p: DateRange): string {
    return `/api/admin/reports/${report}?${new HttpParams({ fromObject: { ...p } }).toString()}`;
  }
}
