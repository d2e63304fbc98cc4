/** Who checked a member's claim, when (ISO time) and against what. */
export interface CheckedBy {
  at: string;
  by: string | null;
  against: string;
}

/** What launch-day check-in says about a scanned card: three separate answers and the overall verdict. */
export interface CheckInResult {
  status: 'active' | 'lapsing' | 'lapsed' | 'unknown';
  memberNumber: string | null;
  name: string | null;
  mayFly: boolean;
  termEnd: string | null;
  associationName?: string;
  dues: { answer: 'current' | 'grace' | 'not_current'; termEnd: string | null } | null;
  association: {
    answer: 'verified' | 'claimed' | 'expired' | 'not_on_file';
    number: string | null;
    expires: string | null;
    verified: CheckedBy | null;
  } | null;
  certification: {
    answer: 'verified' | 'claimed' | 'none';
    level: string;
    label: string;
    verified: CheckedBy | null;
  } | null;
}

/** The answer for a card Padside does not know (or a member not yet paid up): nothing about anyone, and no flying. */
export const UNKNOWN_CARD: CheckInResult = {
  status: 'unknown',
  memberNumber: null,
  name: null,
  mayFly: false,
  termEnd: null,
  dues: null,
  association: null,
  certification: null,
};
