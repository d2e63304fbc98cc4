import type { Topic } from './topics';

/** What an implied consent rests on: a purchase, or a club membership. */
export type ImpliedBasis = 'purchase' | 'membership';

/**
 * How long implied consent lasts, in years after its date: two years after a purchase, and two years after a
 * membership ends (from memory: Canada's anti-spam law, "existing business relationship" and "existing non-business
 * relationship"; see the regulator's CASL guidance, and take legal advice).
 */
export const IMPLIED_CONSENT_YEARS = 2;

/** The lists an implied consent covers: buyers hear about drops, members about everything the club and team do. */
export const IMPLIED_TOPICS: Record<ImpliedBasis, readonly Topic[]> = {
  purchase: ['drops'],
  membership: ['drops', 'launches', 'build-logs'],
};

/**
 * The first day on which an implied consent dated `basisOn` (YYYY-MM-DD: the purchase day, or the last day of the
 * membership) no longer counts. A 29 February basis lapses on 28 February, the earlier of the two candidate days, to
 * stay on the safe side (common practice, no source).
 */
export function impliedConsentLapsesOn(basisOn: string): string {
  const [y, m, d] = basisOn.split('-').map(Number);
  const year = y + IMPLIED_CONSENT_YEARS;
  const lastDay = new Date(Date.UTC(year, m, 0)).getUTCDate();
  return `${String(year).padStart(4, '0')}-${String(m).padStart(2, '0')}-${String(Math.min(d, lastDay)).padStart(2, '0')}`;
}

/** Whether an implied consent dated `basisOn` still counts on `today` (both YYYY-MM-DD in the club's time zone). */
export function impliedConsentHolds(basisOn: string, today: string): boolean {
  return today < impliedConsentLapsesOn(basisOn);
}
