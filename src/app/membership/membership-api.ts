import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { AutoRenewInput, JoinInput, ProfileEditInput, RenewInput } from '@contracts/membership/membership-schemas';
import { QUIET_ERRORS } from '../core/error-interceptor';

export type MembershipStatus = 'pending' | 'active' | 'lapsing' | 'lapsed';

export interface Plan {
  id: number;
  code: string;
  name: string;
  description: string;
  eligibility: 'any' | 'junior' | 'family';
  duesCents: number;
  joiningFeeCents: number;
}

export interface MembershipPolicy {
  termRule: 'calendar' | 'anniversary';
  lateSeasonFrom: string;
  graceDays: number;
  waiverVersion: string;
  waiverText: string;
  safetyCodeVersion: string;
  associationName: string;
  certificationLevels: { code: string; label: string }[];
}

export interface Quote {
  amountCents: number;
  duesCents: number;
  joiningFeeCents: number;
  termStart: string;
  termEnd: string;
  renewal: boolean;
}

export interface Membership {
  memberNumber: string;
  status: MembershipStatus;
  termStart: string | null;
  termEnd: string | null;
  graceEnds: string | null;
  /** The first day the next term can be paid; before it the member is already paid a term ahead. */
  renewalOpensOn: string | null;
  /** Whether the next term can be paid today (the club's today, so the server says). */
  renewalOpen: boolean;
  planId: number;
  planName: string | null;
  legalName: string;
  associationNumber: string | null;
  associationExpires: string | null;
  certificationLevel: string;
  certificationDate: string | null;
  /** When club staff checked the association card or the certificate; null while the value is the member's own word. */
  associationVerifiedAt: string | null;
  certificationVerifiedAt: string | null;
  waiverCurrent: boolean;
  autoRenew: boolean;
  hasSavedCard: boolean;
  /** The card on file as the processor named it; null when none is, or it was saved before brands were kept. */
  savedCard: SavedCard | null;
  renewalFailed: boolean;
}

/** Brand and last four digits of the card kept with the processor. */
export interface SavedCard {
  brand: string;
  last4: string;
}

export interface MemberCard {
  name: string;
  memberNumber: string;
  planName: string | null;
  status: MembershipStatus;
  termEnd: string | null;
  certificationLevel: string;
  certificationLabel: string;
  associationName: string;
  associationNumber: string | null;
  associationExpires: string | null;
  associationVerified: boolean;
  certificationVerified: boolean;
  token: string;
  qrSvg: string;
}

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
  quote(planId: number): Observable<Quote> {
    return this.http.post<Quote>('/api/membership/quote', { planId }, quiet());
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
