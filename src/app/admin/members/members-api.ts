import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';
import type { MembershipSettings } from '@contracts/membership/club-rules-schemas';
import type { RosterFormQuery, RosterMailPurpose } from '@contracts/membership/roster-schemas';
import type { CheckedBy } from '@contracts/membership/check-in-answers';
import type { Membership, MembershipStatus, Plan } from '@contracts/membership/membership-answers';

export interface RosterLine {
  id: number;
  memberNumber: string;
  name: string;
  email: string;
  planName: string;
  status: MembershipStatus;
  termEnd: string | null;
  certificationLevel: string;
  associationNumber: string | null;
  associationExpires: string | null;
  associationVerified: boolean;
  certificationVerified: boolean;
  autoRenew: boolean;
  mailOptOut: boolean;
}

export interface PaymentLine {
  id: number;
  entry: 'payment' | 'refund';
  status: string;
  method: string;
  amountCents: number;
  receiptNumber: string | null;
  termStart: string | null;
  termEnd: string | null;
  note: string | null;
  failureMessage: string | null;
  createdAt: string;
}

/** Which self-entered part of a record staff check. */
export type VerifiedPart = 'association' | 'certification';

/** What staff send to mark a claim checked: the document, and the values they saw. */
export interface VerifyRequest {
  what: VerifiedPart;
  against: string;
  associationNumber?: string | null;
  associationExpires?: string | null;
  certificationLevel?: string;
}

export interface MemberDetail {
  /** The membership as its member sees it, with the account's address and marketing choice for staff. */
  member: Omit<Membership, 'familyMembers'> & { email: string | null; mailOptOut: boolean };
  /** Staff checks of the association and certification claims; null while a value is the member's own word. */
  verifications: Record<VerifiedPart, CheckedBy | null>;
  familyMembers: { name: string; dateOfBirth: string }[];
  payments: PaymentLine[];
  audit: { id: number; action: string; detail: Record<string, unknown>; actor: string | null; at: string }[];
}

export interface DuesSummary {
  collected: { month: string; planCode: string; planName: string; cents: number; payments: number }[];
  byStatus: Record<MembershipStatus, number>;
}

/** What staff may change on a plan; the code and who may hold it are fixed once members can hold it. */
export type PlanChanges = Pick<Plan, 'name' | 'description' | 'duesCents' | 'joiningFeeCents' | 'active' | 'sortOrder'>;

/** Who may hold a plan, as staff read it (the server checks junior ages and family members). */
export { PLAN_ELIGIBILITY_LABELS as ELIGIBILITY_LABELS } from '@contracts/labels/membership-statuses';

/** A new plan. */
export type NewPlan = PlanChanges & Pick<Plan, 'code' | 'eligibility'>;

/** Only the filters that are set, so URLs and the CSV link stay short. */
export function filterParams(q: Partial<RosterFormQuery>): HttpParams {
  let params = new HttpParams();
  for (const [k, v] of Object.entries(q))
    if (v !== '' && v !== undefined && v !== null) params = params.set(k, String(v));
  return params;
}

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** The treasurer's membership endpoints. */
/** What a roster e-mail queued and whom it left out. */
export interface RosterMailResult {
  queued: number;
  skippedOptedOut: number;
  skippedLapsedConsent: number;
  skippedSuppressed: number;
}

@Injectable({ providedIn: 'root' })
export class MembersApi {
  private readonly http = inject(HttpClient);

  /** One page of the filtered, sorted member roster. */
  roster(q: RosterFormQuery): Observable<{ items: RosterLine[]; total: number }> {
    return this.http.get<{ items: RosterLine[]; total: number }>('/api/admin/members', { params: filterParams(q) });
  }

  /** One member's record: terms, payments, verifications and history. */
  detail(id: number): Observable<MemberDetail> {
    return this.http.get<MemberDetail>(`/api/admin/members/${id}`);
  }

  /** Records dues paid in person (cash or cheque) with its receipt number. */
  recordPayment(
    id: number,
    body: { amountCents: number; method: string; receiptNumber: string; note?: string },
  ): Observable<MemberDetail> {
    return this.http.post<MemberDetail>(`/api/admin/members/${id}/payments`, body, quiet());
  }

  /** `key` (the Idempotency-Key) belongs to one refund: a double click or retry refunds once. */
  refund(
    id: number,
    body: { paymentId: number; amountCents: number; reason: string },
    key: string,
  ): Observable<MemberDetail> {
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
  plans(): Observable<{ items: Plan[] }> {
    return this.http.get<{ items: Plan[] }>('/api/admin/members/plans');
  }

  /** Adds a dues plan. */
  createPlan(plan: NewPlan): Observable<{ plan: Plan }> {
    return this.http.post<{ plan: Plan }>('/api/admin/members/plans', plan, quiet());
  }

  /** Changes only the plan fields sent, so the rest stay as they were. */
  updatePlan(id: number, patch: Partial<PlanChanges>): Observable<{ plan: Plan }> {
    return this.http.patch<{ plan: Plan }>(`/api/admin/members/plans/${id}`, patch, quiet());
  }
}
