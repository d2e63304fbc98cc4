import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  DuesQuote,
  MemberCard,
  Membership,
  MembershipPolicy,
  Plan,
} from '@contracts/membership/membership-answers';
import type { AutoRenewInput, JoinInput, ProfileEditInput, RenewInput } from '@contracts/membership/membership-schemas';
import { QUIET_ERRORS } from '../core/error-interceptor';

// Form errors are shown beside the fields, so these calls skip the global snack bar.
const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** Club dues: plans, quotes, joining, renewing and the member card. */
@Injectable({ providedIn: 'root' })
export class MembershipApi {
  private readonly http = inject(HttpClient);

  /** The dues plans open to join. */
  plans(): Observable<{ items: Plan[] }> {
    return this.http.get<{ items: Plan[] }>('/api/membership/plans');
  }

  /** The current waiver and safety-code versions a member must accept. */
  policy(): Observable<MembershipPolicy> {
    return this.http.get<MembershipPolicy>('/api/membership/policy');
  }

  /** What joining on a plan costs today (dues, joining fee, insurance). */
  quote(planId: number): Observable<DuesQuote> {
    return this.http.post<DuesQuote>('/api/membership/quote', { planId }, quiet());
  }

  /** The caller's membership; null before they join. */
  me(): Observable<{ membership: Membership | null }> {
    return this.http.get<{ membership: Membership | null }>('/api/membership/me', quiet());
  }

  /** Joins the club and pays the dues; refusals come back for the fields. */
  join(body: JoinInput): Observable<{ membership: Membership }> {
    return this.http.post<{ membership: Membership }>('/api/membership', body, quiet());
  }

  /** Pays the next term's dues, with the card on file or a new token. */
  renew(body: RenewInput): Observable<{ membership: Membership }> {
    return this.http.post<{ membership: Membership }>('/api/membership/renew', body, quiet());
  }

  /** Saves the member's association number and certification. */
  updateProfile(patch: ProfileEditInput): Observable<{ membership: Membership }> {
    return this.http.patch<{ membership: Membership }>('/api/membership/me', patch, quiet());
  }

  /** Switches automatic renewal on (with a card) or off. */
  setAutoRenew(autoRenew: boolean, paymentToken?: string): Observable<{ membership: Membership }> {
    const body: AutoRenewInput = { autoRenew, ...(paymentToken ? { paymentToken } : {}) };
    return this.http.post<{ membership: Membership }>('/api/membership/auto-renew', body, quiet());
  }

  /** The member card with its check-in QR code. */
  card(): Observable<{ card: MemberCard }> {
    return this.http.get<{ card: MemberCard }>('/api/membership/card');
  }
}
