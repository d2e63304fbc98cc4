/** A membership's status (the `memberships.status` codes). */
export type MembershipStatus = 'pending' | 'active' | 'lapsing' | 'lapsed';

export const MEMBERSHIP_STATUS_LABELS: Readonly<Record<MembershipStatus, string>> = {
  pending: 'Awaiting first dues',
  active: 'Current',
  lapsing: 'In grace period',
  lapsed: 'Lapsed',
};

/** One dues payment or refund line (the `membership_payments.status` codes). */
export type DuesPaymentStatus = 'attempted' | 'paid' | 'declined' | 'unknown' | 'refunded' | 'requested' | 'failed';

export const DUES_PAYMENT_STATUS_LABELS: Readonly<Record<DuesPaymentStatus, string>> = {
  attempted: 'Being charged',
  paid: 'Paid',
  declined: 'Declined',
  unknown: 'Waiting for the processor',
  refunded: 'Refunded',
  requested: 'Refund under way',
  failed: 'Refund failed',
};

/** Who a membership plan is for (the `membership_plans.eligibility` codes). */
export type PlanEligibility = 'any' | 'junior' | 'family';

export const PLAN_ELIGIBILITY_LABELS: Readonly<Record<PlanEligibility, string>> = {
  any: 'Anyone',
  junior: 'Under 18 on the first day of the term',
  family: 'A household at one address',
};

/** Whether a dues line brought money in or gave it back (the `membership_payments.entry` codes). */
export type DuesEntry = 'payment' | 'refund';

export const DUES_ENTRY_LABELS: Readonly<Record<DuesEntry, string>> = { payment: 'Payment', refund: 'Refund' };

/** What happened to a membership record (the membership audit's `action` codes). */
export const MEMBERSHIP_AUDIT_LABELS: Readonly<Record<string, string>> = {
  joined: 'Joined',
  profile_resubmitted: 'Sent the form again',
  profile_updated: 'Member changed their details',
  record_edited: 'Staff corrected the record',
  renewal_started: 'Renewal started',
  term_paid: 'Term paid',
  status_changed: 'Status changed',
  refunded: 'Dues refunded',
  auto_renew_changed: 'Auto-renew switched',
  auto_renew_declined: 'Auto-renew card declined',
  auto_renew_failed: 'Auto-renew could not charge',
  association_verified: 'Association membership checked',
  certification_verified: 'Certification checked',
  association_verification_withdrawn: 'Association check withdrawn',
  certification_verification_withdrawn: 'Certification check withdrawn',
};
