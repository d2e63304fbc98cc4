/**
 * Term arithmetic for club dues. Pure and date-only: every date is a `YYYY-MM-DD` string in the club's time zone
 * and "today" is always passed in.
 */

import type { MembershipStatus } from '../../contracts/membership/membership-answers';

export type { MembershipStatus };
export type TermRule = 'calendar' | 'anniversary';

/** The club's term settings that the arithmetic needs. */
export interface TermPolicy {
  rule: TermRule;
  /** Month and day (`MM-DD`) from which a calendar-year join also covers all of next year. */
  lateSeasonFrom: string;
  graceDays: number;
  prorate: boolean;
}

/** A term: first and last day, both inclusive. */
export interface Term {
  start: string;
  end: string;
}

const pad = (n: number, width = 2) => String(n).padStart(width, '0');

function parts(date: string): [number, number, number] {
  const [y, m, d] = date.split('-').map(Number);
  return [y, m, d];
}

function fromUtc(ms: number): string {
  const d = new Date(ms);
  return `${pad(d.getUTCFullYear(), 4)}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
}

/** The date `days` after (or before, if negative) `date`. */
export function addDays(date: string, days: number): string {
  const [y, m, d] = parts(date);
  return fromUtc(Date.UTC(y, m - 1, d + days));
}

/** Whole days from `a` to `b` (positive when b is later). */
export function daysBetween(a: string, b: string): number {
  const [ay, am, ad] = parts(a);
  const [by, bm, bd] = parts(b);
  return Math.round((Date.UTC(by, bm - 1, bd) - Date.UTC(ay, am - 1, ad)) / 86_400_000);
}

/** Gregorian leap year: divisible by 4, except centuries not divisible by 400. */
export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

/** The same month and day `years` later; a Feb 29 with no match becomes Mar 1 (the day after Feb 28). */
function addYears(date: string, years: number): string {
  const [y, m, d] = parts(date);
  if (m === 2 && d === 29 && !isLeapYear(y + years)) return `${pad(y + years, 4)}-03-01`;
  return `${pad(y + years, 4)}-${pad(m)}-${pad(d)}`;
}

/** A new term starting on `start`: Dec 31 under the calendar rule (or of next year from the late-season date on). */
export function newTerm(start: string, policy: TermPolicy): Term {
  const [y] = parts(start);
  if (policy.rule === 'anniversary') return { start, end: addDays(addYears(start, 1), -1) };
  const late = start.slice(5) >= policy.lateSeasonFrom;
  return { start, end: `${pad(late ? y + 1 : y, 4)}-12-31` };
}

/** The term that follows one ending on `end`, starting the next day. */
export function nextTerm(end: string, policy: TermPolicy): Term {
  const start = addDays(end, 1);
  if (policy.rule === 'anniversary') return { start, end: addDays(addYears(start, 1), -1) };
  return { start, end: `${start.slice(0, 4)}-12-31` };
}

/**
 * The term a payment made on `today` buys. Before the old term ends, or within grace, it follows on from the old
 * end (never from today); after grace, or with no earlier term, a new term starts today.
 */
export function termForPayment(
  today: string,
  currentEnd: string | null,
  policy: TermPolicy,
): Term & { renewal: boolean } {
  if (currentEnd && today <= addDays(currentEnd, policy.graceDays))
    return { ...nextTerm(currentEnd, policy), renewal: true };
  return { ...newTerm(today, policy), renewal: false };
}

/**
 * The first day a renewal can be paid: one year before the paid term ends, so a member is never more than one term
 * ahead and a second click after a finished renewal cannot buy the year after (common practice, no source).
 */
export function renewalOpensOn(termEnd: string): string {
  return addDays(addYears(termEnd, -1), 1);
}

/** Status on `today`: active to the term end, lapsing through grace, lapsed after; pending until the first payment. */
export function statusOn(
  today: string,
  termEnd: string | null,
  policy: Pick<TermPolicy, 'graceDays'>,
  renewalFailed = false,
): MembershipStatus {
  if (!termEnd) return 'pending';
  if (today <= termEnd) return 'active';
  if (renewalFailed) return 'lapsed';
  return today <= addDays(termEnd, policy.graceDays) ? 'lapsing' : 'lapsed';
}

/** Whether the status lets the member fly (and holds the `member` role). */
export function isInGoodStanding(status: MembershipStatus): boolean {
  return status === 'active' || status === 'lapsing';
}

/** Age in whole years on `on` for someone born on `dateOfBirth`; the birthday itself counts as the new year. */
export function ageOn(dateOfBirth: string, on: string): number {
  const [by, bm, bd] = parts(dateOfBirth);
  const [y, m, d] = parts(on);
  const hadBirthday = m > bm || (m === bm && d >= bd);
  return y - by - (hadBirthday ? 0 : 1);
}

/** Junior: under 18 on the first day of the term. */
export function isJuniorOn(dateOfBirth: string, termStart: string): boolean {
  return ageOn(dateOfBirth, termStart) < 18;
}

/**
 * Dues for a term. Proration (off by default) applies only to a new calendar-year term that starts before the
 * late-season date: whole months left in the year including the current one, rounded half-up to the cent.
 */
export function duesFor(duesCents: number, term: Term & { renewal: boolean }, policy: TermPolicy): number {
  if (!policy.prorate || policy.rule !== 'calendar' || term.renewal) return duesCents;
  if (term.start.slice(5) >= policy.lateSeasonFrom) return duesCents;
  const monthsLeft = 13 - parts(term.start)[1];
  return Math.floor((duesCents * monthsLeft) / 12 + 0.5);
}
