import { type MembershipRow } from './membership-repository';
import { isInGoodStanding, type MembershipStatus } from './terms';

/**
 * Flying status as Padside records it: club dues, the national association membership (which carries the
 * insurance) and the certification level. The last two are what a member says until staff have seen the card or
 * certificate, so a claim is never shown as a fact. Pure: no clock, no database; `today` is passed in.
 */

/** What staff checked a value against, and when and by whom. */
export interface Verification {
  at: Date;
  byUserId: number | null;
  against: string;
}

/** The three separate answers of launch check-in and the overall verdict. */
export interface FlyingVerdict {
  dues: { answer: 'current' | 'grace' | 'not_current'; termEnd: string | null };
  association: {
    answer: 'verified' | 'claimed' | 'expired' | 'not_on_file';
    number: string | null;
    expires: string | null;
    verified: Verification | null;
  };
  certification: { answer: 'verified' | 'claimed' | 'none'; level: string; verified: Verification | null };
  /** Dues current and association membership both current and verified. */
  mayFly: boolean;
}

const verificationOf = (at: Date | null, by: number | null, against: string | null): Verification | null =>
  at && against ? { at, byUserId: by, against } : null;

/** The association verification on a record, or null while it is a claim. */
export const associationVerification = (m: MembershipRow) =>
  verificationOf(m.association_verified_at, m.association_verified_by, m.association_verified_against);

/** The certification verification on a record, or null while it is a claim. */
export const certificationVerification = (m: MembershipRow) =>
  verificationOf(m.certification_verified_at, m.certification_verified_by, m.certification_verified_against);

/** The check-in answers for a record whose dues status (from the dates) is `status`. */
export function flyingVerdict(m: MembershipRow, status: MembershipStatus, today: string): FlyingVerdict {
  const termEnd = m.term_end;
  const dues = {
    answer:
      status === 'active' ? ('current' as const) : status === 'lapsing' ? ('grace' as const) : ('not_current' as const),
    termEnd,
  };
  const expires = m.association_expires;
  const aVerified = associationVerification(m);
  const onFile = m.association_number !== null && m.association_number !== '' && expires !== null;
  const associationAnswer = !onFile ? 'not_on_file' : expires! < today ? 'expired' : aVerified ? 'verified' : 'claimed';
  const cVerified = certificationVerification(m);
  const certificationAnswer = m.certification_level === 'none' ? 'none' : cVerified ? 'verified' : 'claimed';
  return {
    dues,
    association: { answer: associationAnswer, number: m.association_number, expires, verified: aVerified },
    certification: { answer: certificationAnswer, level: m.certification_level, verified: cVerified },
    mayFly: isInGoodStanding(status) && associationAnswer === 'verified',
  };
}

const ASSOCIATION_COLUMNS = ['association_number', 'association_expires'] as const;
const CERTIFICATION_COLUMNS = ['certification_level', 'certification_date'] as const;

const sameValue = (a: unknown, b: unknown) => (a ?? null) === (b ?? null);

/**
 * The patch with any verification it voids: a changed association number or expiry voids the association
 * verification, a changed certification level or date the certification one. Re-sending the same value voids nothing.
 */
export function withVoidedVerifications<P extends Partial<MembershipRow>>(
  before: MembershipRow,
  patch: P,
): P & Partial<MembershipRow> {
  const changed = (cols: readonly (keyof MembershipRow)[]) =>
    cols.some((c) => c in patch && patch[c] !== undefined && !sameValue(before[c], patch[c]));
  const out: P & Partial<MembershipRow> = { ...patch };
  if (before.association_verified_at && changed(ASSOCIATION_COLUMNS))
    Object.assign(out, {
      association_verified_at: null,
      association_verified_by: null,
      association_verified_against: null,
    });
  if (before.certification_verified_at && changed(CERTIFICATION_COLUMNS))
    Object.assign(out, {
      certification_verified_at: null,
      certification_verified_by: null,
      certification_verified_against: null,
    });
  return out;
}
