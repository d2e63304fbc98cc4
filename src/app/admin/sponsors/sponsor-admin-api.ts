import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';
import type {
  AdminSponsorRow,
  AgreementCreated,
  CashReceived,
  ContactAdded,
  CreditRecorded,
  OverdueItem,
  SponsorCreated,
  SponsorDetail,
  SponsorSaved,
  StaffAgreement,
  TaxTreatmentAnswer,
} from '@contracts/sponsors/sponsor-answers';
import type {
  AgreementBodyInput,
  CashReceivedInput,
  ContactInput,
  HandCreditInput,
  SponsorBodyInput,
  TaxTreatmentInput,
  Tiers,
} from '@contracts/sponsors/sponsor-schemas';

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** Staff endpoints for sponsors, agreements, contacts, credits and tiers. */
@Injectable({ providedIn: 'root' })
export class SponsorAdminApi {
  private readonly http = inject(HttpClient);

  /** Every sponsor with what they gave and what is still owed to them. */
  list(): Observable<{ items: AdminSponsorRow[] }> {
    return this.http.get<{ items: AdminSponsorRow[] }>('/api/admin/sponsors');
  }
  /** Promised credits past their due date, across sponsors. */
  overdue(): Observable<{ items: OverdueItem[] }> {
    return this.http.get<{ items: OverdueItem[] }>('/api/admin/sponsors/overdue');
  }
  /** Adds a sponsor. */
  create(body: SponsorBodyInput): Observable<SponsorCreated> {
    return this.http.post<SponsorCreated>('/api/admin/sponsors', body, quiet());
  }
  /** One sponsor's record for the console. */
  detail(id: number): Observable<SponsorDetail> {
    return this.http.get<SponsorDetail>(`/api/admin/sponsors/${id}`);
  }
  /** Saves a sponsor's name, website, blurb and logo. */
  update(id: number, body: SponsorBodyInput): Observable<SponsorSaved> {
    return this.http.put<SponsorSaved>(`/api/admin/sponsors/${id}`, body, quiet());
  }
  /** A sponsor's agreements with what each promised and what was delivered. */
  ledger(id: number): Observable<{ agreements: StaffAgreement[] }> {
    return this.http.get<{ agreements: StaffAgreement[] }>(`/api/admin/sponsors/${id}/ledger`);
  }
  /** Records a new agreement (cash or parts, and the credits promised in return). */
  addAgreement(id: number, body: AgreementBodyInput): Observable<AgreementCreated> {
    return this.http.post<AgreementCreated>(`/api/admin/sponsors/${id}/agreements`, body, quiet());
  }
  /** Records whether an agreement is paid promotion or a gift, which decides the tax on it. */
  setTaxTreatment(agreementId: number, body: TaxTreatmentInput): Observable<TaxTreatmentAnswer> {
    return this.http.put<TaxTreatmentAnswer>(
      `/api/admin/sponsors/agreements/${agreementId}/tax-treatment`,
      body,
      quiet(),
    );
  }
  /** A link the browser downloads directly (the session cookie authorises it). */
  invoiceUrl(agreementId: number): string {
    return `/api/admin/sponsors/agreements/${agreementId}/invoice.pdf`;
  }
  /** Records the day and way an agreement's cash arrived. */
  cashReceived(agreementId: number, body: CashReceivedInput): Observable<CashReceived> {
    return this.http.post<CashReceived>(`/api/admin/sponsors/agreements/${agreementId}/cash-received`, body, quiet());
  }
  /** Records a credit given (a post, a video, a listing) and whether it counts towards a promise. */
  addCredit(id: number, body: HandCreditInput): Observable<CreditRecorded> {
    return this.http.post<CreditRecorded>(`/api/admin/sponsors/${id}/credits`, body, quiet());
  }
  /** Invites an address to the sponsor's portal. */
  addContact(id: number, email: string): Observable<ContactAdded> {
    const body: ContactInput = { email };
    return this.http.post<ContactAdded>(`/api/admin/sponsors/${id}/contacts`, body, quiet());
  }
  /** The sponsor tiers and the amount each starts at. */
  tiers(): Observable<Tiers> {
    return this.http.get<Tiers>('/api/admin/sponsors/tiers');
  }
  /** Saves the sponsor tiers. */
  setTiers(tiers: Tiers['tiers']): Observable<unknown> {
    const body: Tiers = { tiers };
    return this.http.put('/api/admin/sponsors/tiers', body, quiet());
  }
}
