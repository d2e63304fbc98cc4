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
