import type { Knex } from 'knex';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { tooManyRequests } from './app-error';

/** A failure counter kept in PostgreSQL, so every server process shares it. */
export class FailureLimiter {
  private readonly limiter: RateLimiterPostgres;

  constructor(
    private readonly db: Knex,
    private readonly keyPrefix: string,
    private readonly points: number,
    durationSeconds: number,
  ) {
    this.limiter = new RateLimiterPostgres({
      storeClient: db,
      storeType: 'knex',
      tableName: 'rate_limits',
      tableCreated: true,
      keyPrefix,
      points,
      duration: durationSeconds,
      blockDuration: durationSeconds,
    });
  }

  /** Throws 429 with Retry-After when the key has used up its failures. */
  async check(key: string): Promise<void> {
    const ms = await this.blockedMs(key);
    if (ms > 0) throw tooManyRequests(ms / 1000);
  }

  /** Milliseconds until the key may try again; 0 while it has failures left. */
  async blockedMs(key: string): Promise<number> {
    return (await this.standing(key)).blockedMs;
  }

  /** `blockedMs`, and whether any failure is counted against the key now (so a reset has something to do). */
  async standing(key: string): Promise<{ blockedMs: number; counted: boolean }> {
    return (await this.standings([key]))[0];
  }

  /**
   * `standing` of several keys in one query (a payment checks three). It reads the limiter's rows as
   * rate-limiter-flexible's `get` does (`prefix:key`, points consumed, expiry in epoch ms; an expired row counts as
   * none), rather than one `get` per key.
   */
  async standings(keys: string[]): Promise<{ blockedMs: number; counted: boolean }[]> {
    const now = Date.now();
    const rows: { key: string; points: number; expire: number | null }[] = await this.db('rate_limits')
      .whereIn(
        'key',
        keys.map((k) => `${this.keyPrefix}:${k}`),
      )
      .where((q) => q.where('expire', '>', now).orWhereNull('expire'))
      .select('key', 'points', 'expire');
    const byKey = new Map(rows.map((r) => [r.key, r]));
    return keys.map((k) => {
      const r = byKey.get(`${this.keyPrefix}:${k}`);
      if (!r) return { blockedMs: 0, counted: false };
      const msBeforeNext = r.expire === null ? -1 : Math.max(r.expire - now, 0);
      return { blockedMs: r.points >= this.points ? Math.max(1, msBeforeNext) : 0, counted: r.points > 0 };
    });
  }

  /** Counts one failure. */
  async fail(key: string): Promise<void> {
    try {
      await this.limiter.consume(key);
    } catch (e) {
      // consume rejects with RateLimiterRes once the budget is spent; the next check() answers 429.
      if (!(e instanceof RateLimiterRes)) throw e;
    }
  }

  /** Forgets the failures counted for a key, after the thing they guarded went right. */
  async reset(key: string): Promise<void> {
    await this.limiter.delete(key);
  }
}
