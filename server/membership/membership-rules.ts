import { badRequest } from '../platform/app-error';
import { termPolicy } from './dues-settlement';
import { type MembershipRow, type PlanRow } from './membership-repository';
import type { ProfileInput, RenewInput } from './membership-service';
import type { MembershipSettings } from './membership-settings';
import { duesFor, isJuniorOn, termForPayment, type Term } from './terms';

/** The price and term of paying for `plan` on `today`: a renewal when `m` already has a term, so no joining fee. */
export function priceFor(plan: PlanRow, m: MembershipRow | undefined, today: string, s: MembershipSettings) {
  const policy = termPolicy(s);
  const currentEnd = m?.term_end ?? null;
  const term = termForPayment(today, currentEnd, policy);
  const duesCents = duesFor(plan.dues_cents, term, policy);
  const joiningFeeCents = currentEnd ? 0 : plan.joining_fee_cents;
  return { term, duesCents, joiningFeeCents, amountCents: duesCents + joiningFeeCents };
}

/** Refuses a waiver or safety code version other than the current one, so nobody pays on terms they did not read. */
export function checkAcceptance(s: MembershipSettings, waiverVersion?: string, safetyCodeVersion?: string): void {
  if (waiverVersion !== s.waiverVersion)
    throw badRequest('Read and accept the current waiver.', {
      waiverVersion: `Accept waiver version ${s.waiverVersion}.`,
    });
  if (safetyCodeVersion !== undefined && safetyCodeVersion !== s.safetyCodeVersion) {
    throw badRequest('Read and accept the current safety code.', {
      safetyCodeVersion: `Accept safety code version ${s.safetyCodeVersion}.`,
    });
  }
}

/** The columns a member's profile edit changes; `field` names the form field a bad certification level is shown on. */
export function profilePatch(
  s: MembershipSettings,
  p: NonNullable<RenewInput['profile']>,
  field = 'profile.certificationLevel',
): Partial<MembershipRow> {
  const patch: Partial<MembershipRow> = {};
  if (p.associationNumber !== undefined) patch.association_number = p.associationNumber;
  if (p.associationExpires !== undefined) patch.association_expires = p.associationExpires;
  if (p.certificationLevel !== undefined) patch.certification_level = checkLevel(s, p.certificationLevel, field);
  if (p.certificationDate !== undefined) patch.certification_date = p.certificationDate;
  if (p.address !== undefined) patch.address = p.address;
  if (p.phone !== undefined) patch.phone = p.phone;
  if (p.emergencyContact !== undefined) patch.emergency_contact = p.emergencyContact;
  return patch;
}

function checkLevel(s: MembershipSettings, level: string, field = 'profile.certificationLevel'): string {
  if (!s.certificationLevels.some((l) => l.code === level))
    throw badRequest('Choose a certification level from the list.', { [field]: 'Choose a level from the list.' });
  return level;
}

/** Refuses a join profile the plan does not cover: a birth date in the future, an adult on the junior plan, family on a single plan. */
export function checkProfile(p: ProfileInput, plan: PlanRow, term: Term, s: MembershipSettings): void {
  if (p.dateOfBirth > term.start)
    throw badRequest('Check the date of birth.', { 'profile.dateOfBirth': 'The date of birth is in the future.' });
  if (plan.eligibility === 'junior' && !isJuniorOn(p.dateOfBirth, term.start)) {
    throw badRequest('The junior plan is for members under 18 on the first day of the term.', {
      planId: 'You are 18 or over on the first day of the term; choose another plan.',
    });
  }
  if (plan.eligibility !== 'family' && p.familyMembers?.length)
    throw badRequest('Only the family plan covers more people.', {
      'profile.familyMembers': 'Choose the family plan to add family members.',
    });
  checkLevel(s, p.certificationLevel ?? 'none');
}

/** For the audit: which verifications an edit voided. */
export const voidedNote = (patch: Partial<MembershipRow>) => {
  const voided = [
    ...('association_verified_at' in patch ? ['association'] : []),
    ...('certification_verified_at' in patch ? ['certification'] : []),
  ];
  return voided.length ? { verificationVoided: voided } : {};
};
