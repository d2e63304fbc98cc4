import type { Knex } from 'knex';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { tooManyRequests } from './app-error';

/** A failure counter kept in PostgreSQL, so every server process shares it. */
export class FailureLimiter {
  private readonly limiter: RateLimiterPostgres;

  constructor(db: Knex, keyPrefix: string, points: number, durationSeconds: number) {
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
    const res = await this.limiter.get(key);
    return { blockedMs: res && res.remainingPoints <= 0 ? Math.max(1, res.msBeforeNext) : 0, counted: res !== null && res.consumedPoints > 0 };
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

  async reset(key: string): Promise<void> {
    await this.limiter.delete(key);
  }
}
