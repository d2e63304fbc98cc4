import type { Knex } from 'knex';
import { AppError, tooManyRequests } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import { FailureLimiter } from '../platform/rate-limit';
import { accountVerdict, LOCKOUT } from './lockout-policy';
import { SignInLockRepository, type LockRow } from './sign-in-lock-repository';

const PAIR_PREFIX = 'signin-pair';
const DAY_MS = 86400_000;

/** What the accounts page shows about one account's sign-in failures. */
export interface LockState {
  failures: number;
  locked: boolean;
}

/**
 * Sign-in throttling an attacker cannot aim at someone else: one account from one address gets a short block, one
 * address across accounts a longer one, and an account's consecutive failures slow down (then lock) only the kind of
 * address they came from, so failures from elsewhere never lock the owner out of the places they usually sign in from.
 */
export class SignInGuard {
  private readonly pair: FailureLimiter;
  private readonly ip: FailureLimiter;
  private readonly repo: SignInLockRepository;

  constructor(
    private readonly db: Knex,
    private readonly clock: Clock,
  ) {
    this.pair = new FailureLimiter(db, PAIR_PREFIX, LOCKOUT.pairFailures, LOCKOUT.pairWindowSeconds);
    this.ip = new FailureLimiter(db, 'signin-ip', LOCKOUT.ipFailures, LOCKOUT.ipWindowSeconds);
    this.repo = new SignInLockRepository(db);
  }

  /** Throws 429 when this attempt may not be checked now. `userId` is null for an address without an account. */
  async check(accountKey: string, ip: string, userId: number | null): Promise<{ familiar: boolean }> {
    await this.ip.check(ip);
    await this.pair.check(`${accountKey}|${ip}`);
    const familiar = userId !== null && (await this.repo.isFamiliar(userId, ip, this.daysAgo(LOCKOUT.familiarDays)));
    const row = await this.repo.find(accountKey);
    const verdict = row
      ? accountVerdict(
          familiar ? row.failures_familiar : row.failures_elsewhere,
          familiar ? row.last_familiar_at : row.last_elsewhere_at,
          this.clock.now(),
        )
      : accountVerdict(0, null, this.clock.now());
    if (verdict.kind === 'wait') throw tooManyRequests(verdict.seconds);
    if (verdict.kind === 'locked') {
      throw new AppError(
        429,
        'account_locked',
        'Sign-in to this account is locked after too many failed attempts. Reset the password by e-mail, or ask an admin to clear the lock.',
      );
    }
    return { familiar };
  }

  /** Counts a failed sign-in against the account and address pair, the address alone and the account's lock, so guessing is slowed on every front. */
  async fail(accountKey: string, ip: string, familiar: boolean): Promise<void> {
    await Promise.all([
      this.pair.fail(`${accountKey}|${ip}`),
      this.ip.fail(ip),
      this.db.transaction((trx) => this.repo.countFailure(trx, accountKey, familiar, this.clock.now())),
    ]);
  }

  /** A right password: the account's counters start again and the address becomes familiar. */
  async succeed(accountKey: string, ip: string, userId: number): Promise<void> {
    await Promise.all([
      this.db.transaction((trx) => this.repo.clear(trx, accountKey)),
      this.pair.reset(`${accountKey}|${ip}`),
      this.db.transaction((trx) =>
        this.repo.rememberAddress(trx, userId, ip, this.clock.now(), this.daysAgo(LOCKOUT.familiarDays)),
      ),
    ]);
  }

  /** Lifts every lock and block on the account (staff, or a new password). */
  async clear(accountKey: string): Promise<void> {
    await this.db.transaction(async (trx) => {
      await this.repo.clear(trx, accountKey);
      await this.repo.clearPairBlocks(trx, PAIR_PREFIX, accountKey);
    });
  }

  /** Lock state per account key, for the accounts page. */
  async states(keys: string[]): Promise<Map<string, LockState>> {
    const rows = await this.repo.byKeys(keys);
    return new Map(
      rows.map((r: LockRow) => [
        r.account_key,
        {
          failures: r.failures_elsewhere + r.failures_familiar,
          locked: Math.max(r.failures_elsewhere, r.failures_familiar) >= LOCKOUT.hardLockAfter,
        },
      ]),
    );
  }

  private daysAgo(days: number): Date {
    return new Date(this.clock.now().getTime() - days * DAY_MS);
  }
}
