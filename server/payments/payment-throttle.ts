import type { Knex } from 'knex';
import pLimit from 'p-limit';
import { AppError } from '../platform/app-error';
import { FailureLimiter } from '../platform/rate-limit';

/** Declined payments allowed per key in the window before the key must wait (common practice, no source). */
export const PAYMENT_FAILURES = { points: 5, windowSeconds: 10 * 60 } as const;

/** Who is paying, as far as a card tester can be recognised: the browser session, the e-mail, the address. */
export interface PayerKeys {
  sessionId?: string;
  email?: string;
  /** The postal address the order goes to (Padside holds no other), or a member's account. */
  address?: { line1: string | null; postalCode: string | null; country: string };
  accountId?: number;
}

/** The limiter keys of a payer; addresses and e-mails are normalised so case and spacing tricks count as one. */
export function payerKeys(p: PayerKeys): string[] {
  const keys: string[] = [];
  if (p.sessionId) keys.push(`session:${p.sessionId}`);
  if (p.email) keys.push(`email:${p.email.trim().toLowerCase()}`);
  // A pickup order has no street address; all pickups must not share one counter.
  if (p.address?.line1)
    keys.push(
      `address:${[p.address.line1, p.address.postalCode ?? '', p.address.country].map((x) => x.toLowerCase().replace(/[^a-z0-9]/g, '')).join('|')}`,
    );
  if (p.accountId !== undefined) keys.push(`account:${p.accountId}`);
  return keys;
}

/**
 * Payment attempts one throttle (one per feature) works on at once in a process; the rest wait their turn in memory. Each attempt reads and writes
 * the database a score of times, one query after another: 500 buyers pressing Pay together would otherwise queue
 * thousands of queries for the pool's 10 connections and some would wait past its 5 s and fail. A small multiple of
 * the pool (common practice, no source); the processor's answer is awaited inside the slot, so with a processor
 * taking a second this still allows a few dozen checkouts a second per process.
 */
export const PAYMENTS_AT_ONCE = 32;

const isDecline = (err: unknown) => err instanceof AppError && err.status === 402 && err.code === 'payment_declined';

/**
 * Card testing defence: declined payments count per session, e-mail and address in PostgreSQL (shared by every
 * process); once any of them has used its budget, payments from it answer 429 until the window passes. A payment
 * that goes through starts that payer's counts again.
 */
export class PaymentThrottle {
  private readonly failures: FailureLimiter;
  private readonly slots = pLimit(PAYMENTS_AT_ONCE);

  constructor(db: Knex) {
    this.failures = new FailureLimiter(db, 'payment-failures', PAYMENT_FAILURES.points, PAYMENT_FAILURES.windowSeconds);
  }

  /**
   * Runs one payment attempt for the payer: refused with 429 before it starts when the payer is throttled, counted
   * when it ends in a decline, and resetting the counts when `paid(result)` says it went through.
   */
  attempt<T>(payer: PayerKeys, pay: () => Promise<T>, paid: (result: T) => boolean): Promise<T> {
    return this.slots(() => this.attemptNow(payer, pay, paid));
  }

  private async attemptNow<T>(payer: PayerKeys, pay: () => Promise<T>, paid: (result: T) => boolean): Promise<T> {
    const keys = payerKeys(payer);
    const standings = await this.failures.standings(keys);
    const wait = Math.max(0, ...standings.map((s) => s.blockedMs));
    if (wait > 0) {
      const seconds = Math.ceil(wait / 1000);
      const message = `Too many declined payments. Try again in ${Math.ceil(seconds / 60)} minute(s).`;
      throw new AppError(
        429,
        'payment_attempts_limited',
        message,
        { paymentToken: message },
        { 'Retry-After': String(seconds) },
      );
    }
    let result: T;
    try {
      result = await pay();
    } catch (err) {
      if (isDecline(err)) await Promise.all(keys.map((k) => this.failures.fail(k)));
      throw err;
    }
    // Only keys with failures counted have anything to reset; a failure counted meanwhile stays (the stricter side).
    if (paid(result)) await Promise.all(keys.filter((_, i) => standings[i].counted).map((k) => this.failures.reset(k)));
    return result;
  }
}
