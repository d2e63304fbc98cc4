import type { Membership, Plan } from '../../contracts/membership/membership-answers';
import type { PaymentLine, RosterLine } from '../../contracts/membership/staff-member-answers';
import { type MembershipRow, type PaymentRow, type PlanRow, type RosterRow } from './membership-repository';
import type { MembershipSettings } from './membership-settings';
import { associationVerification, certificationVerification } from './flying-status';
import { addDays, renewalOpensOn, statusOn, type MembershipStatus, type TermPolicy } from './terms';

/** A plan as the API shows it. */
export function planView(p: PlanRow): Plan {
  return {
    id: p.id,
    code: p.code,
    name: p.name,
    description: p.description,
    eligibility: p.eligibility,
    duesCents: p.dues_cents,
    joiningFeeCents: p.joining_fee_cents,
    active: p.active,
    sortOrder: p.sort_order,
  };
}

/** The status the dates give today (the stored one may be up to a day old). */
export function liveStatus(m: MembershipRow, today: string, policy: TermPolicy): MembershipStatus {
  return statusOn(today, m.term_end, policy, m.renewal_failed_at !== null);
}

/** A membership as its member (and staff) see it. */
export function membershipView(
  m: MembershipRow,
  plan: PlanRow | undefined,
  today: string,
  policy: TermPolicy,
  s: MembershipSettings,
): Membership {
  const termEnd = m.term_end;
  return {
    id: m.id,
    memberNumber: m.member_number,
    status: liveStatus(m, today, policy),
    termStart: m.term_start,
    termEnd,
    graceEnds: termEnd ? addDays(termEnd, policy.graceDays) : null,
    renewalOpensOn: termEnd ? renewalOpensOn(termEnd) : null,
    renewalOpen: termEnd === null || today >= renewalOpensOn(termEnd),
    planId: m.plan_id,
    planCode: plan?.code ?? null,
    planName: plan?.name ?? null,
    legalName: m.legal_name,
    dateOfBirth: m.date_of_birth,
    address: m.address,
    phone: m.phone,
    emergencyContact: m.emergency_contact,
    associationNumber: m.association_number,
    associationExpires: m.association_expires,
    certificationLevel: m.certification_level,
    certificationDate: m.certification_date,
    // Claims until staff have seen the card or certificate; a changed value is a claim again.
    associationVerifiedAt: associationVerification(m)?.at.toISOString() ?? null,
    certificationVerifiedAt: certificationVerification(m)?.at.toISOString() ?? null,
    waiverVersion: m.waiver_version,
    waiverAcceptedAt: m.waiver_accepted_at.toISOString(),
    safetyCodeVersion: m.safety_code_version,
    safetyCodeAcceptedAt: m.safety_code_accepted_at.toISOString(),
    waiverCurrent: m.waiver_version === s.waiverVersion && m.safety_code_version === s.safetyCodeVersion,
    autoRenew: m.auto_renew,
    hasSavedCard: m.processor_customer_id !== null,
    /** Which card is on file, as the processor named it; null when none is, or it was saved before brands were kept. */
    savedCard:
      m.processor_customer_id !== null && m.card_brand && m.card_last4
        ? { brand: m.card_brand, last4: m.card_last4 }
        : null,
    renewalFailed: m.renewal_failed_at !== null,
  };
}

/** A roster line for the staff table and the CSV. */
export function rosterView(r: RosterRow, today: string, policy: TermPolicy): RosterLine {
  return {
    id: r.id,
    memberNumber: r.member_number,
    name: r.legal_name,
    email: r.email,
    planId: r.plan_id,
    planName: r.plan_name,
    status: liveStatus(r, today, policy),
    termEnd: r.term_end,
    certificationLevel: r.certification_level,
    associationNumber: r.association_number,
    associationExpires: r.association_expires,
    associationVerified: associationVerification(r) !== null,
    certificationVerified: certificationVerification(r) !== null,
    autoRenew: r.auto_renew,
    mailOptOut: r.marketing_opt_out,
  };
}

/** A payment or refund line. */
export function paymentView(p: PaymentRow): PaymentLine {
  return {
    id: p.id,
    entry: p.entry,
    status: p.status,
    method: p.method,
    amountCents: p.amount_cents,
    receiptNumber: p.receipt_number,
    termStart: p.term_start,
    termEnd: p.term_end,
    refundOf: p.refund_of,
    note: p.note,
    failureMessage: p.failure_message,
    createdAt: p.created_at.toISOString(),
  };
}
