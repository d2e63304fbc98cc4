import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';

export interface Period {
  from: string;
  to: string;
}

export interface TaxLine {
  code: string;
  jurisdiction: string;
  taxableCents: number;
  taxCents: number;
  refundedCents: number;
  netCents: number;
}

/** The lines one tax authority gets a return for, with their totals. */
export interface TaxAuthority {
  authority: string;
  name: string;
  lines: TaxLine[];
  totals: Omit<TaxLine, 'code' | 'jurisdiction'>;
}

/** Sales into a province whose own sales tax the seller does not collect. */
export interface UnregisteredProvince {
  province: string;
  tax: string;
  orders: number;
  salesCents: number;
  threshold: string;
}

export interface TaxReport {
  lines: TaxLine[];
  authorities: TaxAuthority[];
  unregisteredProvinces: UnregisteredProvince[];
  timeZone: string;
  registrations: { sellerProvince: string; gstHstNumber: string; gstHstRegistered: boolean; provincialRegistrations: string[] } | null;
}

/** Money per month and source; income, refunds and net are net of tax. */
export interface IncomeFigures {
  grossCents: number;
  taxCents: number;
  incomeCents: number;
  refundsCents: number;
  refundedTaxCents: number;
  refundsNetCents: number;
  feesCents: number;
  netCents: number;
}

export interface RevenueRow extends IncomeFigures {
  month: string;
  source: 'merch' | 'dues' | 'sponsor';
}

export interface SponsorValue {
  season: string;
  items: { sponsor: string; tier: string | null; cashCents: number; inKindCents: number; totalCents: number; promised: number; delivered: number }[];
}

/** The card-fee estimate as the console types it: percentages (2.9 for 2.9 %) and the fixed part in cents. */
export interface FeeSettings {
  percent: number;
  fixedCents: number;
  internationalExtraPercent: number;
}

export interface Dashboard {
  today: string;
  salesTodayCents: number;
  salesMonthCents: number;
  duesMonthCents: number;
  ordersAwaitingShipment: number | null;
  runsClosingSoon: { id: number; name: string; closesAt: string }[] | null;
  overdueDeliverables: { sponsor: string; kind: string; dueOn: string; missing: number }[] | null;
  membersLapsingSoon: number | null;
  membersByStatus: Record<string, number> | null;
  launchSeason: { season: string; scheduled: number; calledOff: number; done: number; checkIns: number; flights: number; flown: number; bestApogeeMetres: number | null } | null;
  revenueByMonth: { month: string; source: string; netCents: number; grossCents: number; incomeCents: number }[];
}

/** The treasurer's reports. */
@Injectable({ providedIn: 'root' })
export class BooksApi {
  private readonly http = inject(HttpClient);

  tax(p: Period): Observable<TaxReport> {
    return this.http.get<TaxReport>('/api/admin/reports/tax', { params: new HttpParams({ fromObject: { ...p } }) });
  }
  revenue(p: Period): Observable<{ rows: RevenueRow[]; totals: IncomeFigures }> {
    return this.http.get<{ rows: RevenueRow[]; totals: IncomeFigures }>('/api/admin/reports/revenue', { params: new HttpParams({ fromObject: { ...p } }) });
  }
  sponsorValue(): Observable<SponsorValue> {
    return this.http.get<SponsorValue>('/api/admin/reports/sponsor-value');
  }
  dashboard(): Observable<Dashboard> {
    return this.http.get<Dashboard>('/api/admin/dashboard');
  }
  runs(): Observable<{ items: { id: number; name: string; productName: string; state: string }[] }> {
    return this.http.get<{ items: { id: number; name: string; productName: string; state: string }[] }>('/api/admin/runs');
  }
  unitsBySize(runId: number): Observable<{ items: { label: string; units: number }[] }> {
    return this.http.get<{ items: { label: string; units: number }[] }>('/api/admin/reports/units-by-size', { params: { runId } });
  }
  fees(): Observable<FeeSettings> {
    return this.http.get<FeeSettings>('/api/admin/settings/processor-fees');
  }
  saveFees(s: FeeSettings): Observable<FeeSettings> {
    return this.http.put<FeeSettings>('/api/admin/settings/processor-fees', s, { context: new HttpContext().set(QUIET_ERRORS, true) });
  }
  /** A link the browser downloads directly (the session cookie authorises it). */
  csvUrl(report: 'tax.csv' | 'ledger.csv', p: Period): string {
    return `/api/admin/reports/${report}?${new HttpParams({ fromObject: { ...p } }).toString()}`;
  }
}
