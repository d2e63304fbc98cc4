/**
 * The sign-in lockout rules, pure. NIST SP 800-63B 5.2.2 (and 800-63B-4): at most 100 consecutive failed attempts on
 * one account; OWASP ASVS 4.0.3 2.2.1: at most 100 failures an hour per account. The numbers below are Padside's
 * (common practice, no source).
 */
export const LOCKOUT = {
  /** One account from one address: a short block, enough for a person who mistypes a few times. */
  pairFailures: 5,
  pairWindowSeconds: 15 * 60,
  /** One address across every account: a longer block. */
  ipFailures: 100,
  ipWindowSeconds: 60 * 60,
  /** Consecutive failures on an account before each further attempt waits, doubling from one second. */
  freeFailures: 5,
  maxDelaySeconds: 15 * 60,
  /** Consecutive failures (from familiar addresses, or from everywhere else) that lock until cleared. */
  hardLockAfter: 100,
  /** A successful sign-in makes its address familiar for this long. */
  familiarDays: 180,
} as const;

/** What an account's failure count allows right now. */
export type AccountVerdict = { kind: 'open' } | { kind: 'wait'; seconds: number } | { kind: 'locked' };

/** Seconds to wait after the latest failure, given the consecutive failures so far. */
export function delayAfter(failures: number): number {
  if (failures < LOCKOUT.freeFailures) return 0;
  return Math.min(LOCKOUT.maxDelaySeconds, 2 ** Math.min(30, failures - LOCKOUT.freeFailures));
}

/** Judges one failure counter (familiar or elsewhere) at `now`. */
export function accountVerdict(failures: number, lastFailureAt: Date | null, now: Date): AccountVerdict {
  if (failures >= LOCKOUT.hardLockAfter) return { kind: 'locked' };
  const delay = delayAfter(failures);
  if (delay === 0 || !lastFailureAt) return { kind: 'open' };
  const waitMs = lastFailureAt.getTime() + delay * 1000 - now.getTime();
  return waitMs > 0 ? { kind: 'wait', seconds: Math.ceil(waitMs / 1000) } : { kind: 'open' };
}
