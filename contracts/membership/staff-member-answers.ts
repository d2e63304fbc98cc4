/** What the treasurer's membership routes answer: the server types its views with these; the console reads them. */
import type { CheckedBy } from './check-in-answers';
import type { Membership, MembershipStatus, Plan } from './membership-answers';
import type { VerifiedPart } from './staff-member-schemas';

/** One roster line, for the staff table and the CSV. */
export interface RosterLine {
  id: number;
  memberNumber: string;
  name: string;
  email: string;
  planId: number;
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

/** One page of the filtered, sorted roster. */
export interface RosterPage {
  items: RosterLine[];
  total: number;
  page: number;
  pageSize: number;
}

/** A dues payment or refund on a member's record; `createdAt` is an ISO instant. */
export interface PaymentLine {
  id: number;
  entry: 'payment' | 'refund';
  status: 'attempted' | 'paid' | 'declined' | 'unknown' | 'refunded' | 'requested' | 'failed';
  method: 'card' | 'cash' | 'e-transfer' | 'cheque';
  amountCents: number;
  receiptNumber: string | null;
  termStart: string | null;
  termEnd: string | null;
  /** The payment a refund gives back; null on a payment. */
  refundOf: number | null;
  note: string | null;
  failureMessage: string | null;
  createdAt: string;
}

/** One entry of a member's audit trail; `at` is an ISO instant, `actor` the staff name (null for the system). */
export interface MemberAuditEntry {
  id: number;
  action: string;
  detail: Record<string, unknown>;
  actor: string | null;
  at: string;
}

/** Staff checks of the association and certification claims; null while a value is the member's own word. */
export type Verifications = Record<VerifiedPart, CheckedBy | null>;

/** One member's record for staff: profile, family, payments, verifications and audit trail. */
export interface MemberDetail {
  /** The membership as its member sees it, with the account's address and marketing choice for staff. */
  member: Omit<Membership, 'familyMembers'> & { email: string | null; mailOptOut: boolean };
  verifications: Verifications;
  familyMembers: { name: string; dateOfBirth: string }[];
  payments: PaymentLine[];
  audit: MemberAuditEntry[];
}

/** The dues season at a glance: dues collected per month and plan (net of refunds) and members by status. */
export interface DuesSummary {
  collected: { month: string; planCode: string; planName: string; cents: number; payments: number }[];
  byStatus: Record<MembershipStatus, number>;
}

/** What a roster e-mail queued and whom it left out. */
export interface RosterMailResult {
  queued: number;
  skippedOptedOut: number;
  skippedLapsedConsent: number;
  skippedSuppressed: number;
}

/** Every dues plan, switched-off ones too. */
export interface StaffPlanList {
  items: Plan[];
}

/** A plan just added or changed. */
export interface StaffPlanAnswer {
  plan: Plan;
}
