import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';
import type { MembershipSettings } from '@contracts/membership/club-rules-schemas';
import type { RosterFormQuery, RosterMailPurpose } from '@contracts/membership/roster-schemas';
import type {
  DuesSummary,
  MemberDetail,
  RosterMailResult,
  RosterPage,
  StaffPlanAnswer,
  StaffPlanList,
} from '@contracts/membership/staff-member-answers';
import type {
  ManualPaymentRequest,
  NewPlan,
  PlanChanges,
  RefundRequest,
  VerifiedPart,
  VerifyRequest,
} from '@contracts/membership/staff-member-schemas';

/** Who may hold a plan, as staff read it (the server checks junior ages and family members). */
export { PLAN_ELIGIBILITY_LABELS as ELIGIBILITY_LABELS } from '@contracts/labels/membership-statuses';

/** Only the filters that are set, so URLs and the CSV link stay short. */
export function filterParams(q: Partial<RosterFormQuery>): HttpParams {
  let params = new HttpParams();
  for (const [k, v] of Object.entries(q))
    if (v !== '' && v !== undefined && v !== null) params = params.set(k, String(v));
  return params;
}

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** The treasurer's membership endpoints. */
@Injectable({ providedIn: 'root' })
export class MembersApi {
  private readonly http = inject(HttpClient);

  /** One page of the filtered, sorted member roster. */
  roster(q: RosterFormQuery): Observable<RosterPage> {
    return this.http.get<RosterPage>('/api/admin/members', { params: filterParams(q) });
  }

  /** One member's record: terms, payments, verifications and history. */
  detail(id: number): Observable<MemberDetail> {
    return this.http.get<MemberDetail>(`/api/admin/members/${id}`);
  }

  /** Records dues paid in person (cash or cheque) with its receipt number. */
  recordPayment(id: number, body: ManualPaymentRequest): Observable<MemberDetail> {
    return this.http.post<MemberDetail>(`/api/admin/members/${id}/payments`, body, quiet());
  }

  /** `key` (the Idempotency-Key) belongs to one refund: a double click or retry refunds once. */
  refund(id: number, body: RefundRequest, key: string): Observable<MemberDetail> {
    return this.http.post<MemberDetail>(`/api/admin/members/${id}/refunds`, body, {
      ...quiet(),
      headers: { 'Idempotency-Key': key },
    });
  }

  /** Records that staff checked a member's association number or certification. */
  verify(id: number, body: VerifyRequest): Observable<MemberDetail> {
    return this.http.post<MemberDetail>(`/api/admin/members/${id}/verifications`, body, quiet());
  }

  /** Takes back a verification staff recorded by mistake. */
  withdrawVerification(id: number, what: VerifiedPart): Observable<MemberDetail> {
    return this.http.delete<MemberDetail>(`/api/admin/members/${id}/verifications/${what}`, quiet());
  }

  /** The dues season at a glance: members by status and dues collected. */
  summary(): Observable<DuesSummary> {
    return this.http.get<DuesSummary>('/api/admin/members/summary');
  }

  /** Mails the members the filters pick, as club news (follows consent) or club business. */
  emailRoster(
    filters: Partial<RosterFormQuery>,
    subject: string,
    text: string,
    purpose: RosterMailPurpose,
  ): Observable<RosterMailResult> {
    return this.http.post<RosterMailResult>('/api/admin/members/email', { filters, subject, text, purpose }, quiet());
  }

  /** The club rules that dues and flying status follow. */
  settings(): Observable<{ settings: MembershipSettings }> {
    return this.http.get<{ settings: MembershipSettings }>('/api/admin/members/settings');
  }

  /** Saves the club rules; refusals come back for the fields. */
  saveSettings(settings: MembershipSettings): Observable<{ settings: MembershipSettings }> {
    return this.http.put<{ settings: MembershipSettings }>('/api/admin/members/settings', settings, quiet());
  }

  /** Every dues plan, switched off ones included. */
  plans(): Observable<StaffPlanList> {
    return this.http.get<StaffPlanList>('/api/admin/members/plans');
  }

  /** Adds a dues plan. */
  createPlan(plan: NewPlan): Observable<StaffPlanAnswer> {
    return this.http.post<StaffPlanAnswer>('/api/admin/members/plans', plan, quiet());
  }

  /** Changes only the plan fields sent, so the rest stay as they were. */
  updatePlan(id: number, patch: Partial<PlanChanges>): Observable<StaffPlanAnswer> {
    return this.http.patch<StaffPlanAnswer>(`/api/admin/members/plans/${id}`, patch, quiet());
  }
}
