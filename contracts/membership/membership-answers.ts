/** What the member's dues routes answer: the server types its views with these; the app reads them. */

/** A membership's dues status: pending until the first payment, then active, lapsing through grace, lapsed. */
export type MembershipStatus = 'pending' | 'active' | 'lapsing' | 'lapsed';

/** A dues plan as the plan lists (the member's and the staff's) show it. */
export interface Plan {
  id: number;
  code: string;
  name: string;
  description: string;
  eligibility: 'any' | 'junior' | 'family';
  duesCents: number;
  joiningFeeCents: number;
  active: boolean;
  sortOrder: number;
}

/** What the join form shows: the term rule, the waiver and safety-code versions and the certification levels. */
export interface MembershipPolicy {
  termRule: 'calendar' | 'anniversary';
  /** Month and day (`MM-DD`) from which a calendar-year join also covers all of next year. */
  lateSeasonFrom: string;
  graceDays: number;
  prorate: boolean;
  waiverVersion: string;
  waiverText: string;
  safetyCodeVersion: string;
  associationName: string;
  certificationLevels: { code: string; label: string }[];
}

/** The price and term of paying for a plan today, as a renewal when the caller already has a term. */
export interface DuesQuote {
  amountCents: number;
  duesCents: number;
  joiningFeeCents: number;
  termStart: string;
  termEnd: string;
  renewal: boolean;
}

/** Brand and last four digits of the card kept with the processor. */
export interface SavedCard {
  brand: string;
  last4: string;
}

/** A membership as its member (and staff) see it; dates are `YYYY-MM-DD`, the `...At` times ISO strings. */
export interface Membership {
  id: number;
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
  planCode: string | null;
  planName: string | null;
  legalName: string;
  dateOfBirth: string | null;
  address: string;
  phone: string;
  emergencyContact: string;
  associationNumber: string | null;
  associationExpires: string | null;
  certificationLevel: string;
  certificationDate: string | null;
  /** When club staff checked the association card or the certificate; null while the value is the member's own word. */
  associationVerifiedAt: string | null;
  certificationVerifiedAt: string | null;
  waiverVersion: string;
  waiverAcceptedAt: string;
  safetyCodeVersion: string;
  safetyCodeAcceptedAt: string;
  waiverCurrent: boolean;
  autoRenew: boolean;
  hasSavedCard: boolean;
  /** The card on file as the processor named it; null when none is, or it was saved before brands were kept. */
  savedCard: SavedCard | null;
  renewalFailed: boolean;
  /** The family members on the plan; sent with the member's own record (`/me`), not after joining or renewing. */
  familyMembers?: { name: string; dateOfBirth: string }[];
}

/** The printable member card: who, number, plan, term end, certification and the signed check-in token as a QR code. */
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
