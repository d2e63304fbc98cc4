import type { Knex } from 'knex';

/** One account's consecutive sign-in failures. */
export interface LockRow {
  account_key: string;
  failures_elsewhere: number;
  failures_familiar: number;
  last_elsewhere_at: Date | null;
  last_familiar_at: Date | null;
}

/** Plain reads and writes of `sign_in_lockouts` and `sign_in_addresses`. */
export class SignInLockRepository {
  constructor(private readonly db: Knex) {}

  /** The failure counts and last failures of one account, for deciding whether its sign-in is locked. */
  find(accountKey: string): Promise<LockRow | undefined> {
    return this.db<LockRow>('sign_in_lockouts').where('account_key', accountKey).first();
  }

  /** Adds one failure to the familiar or the elsewhere counter, atomically. */
  async countFailure(trx: Knex.Transaction, accountKey: string, familiar: boolean, at: Date): Promise<void> {
    // Fixed column names, never input: the two counters keep their own latest failure.
    const [count, last] = familiar
      ? ['failures_familiar', 'last_familiar_at']
      : ['failures_elsewhere', 'last_elsewhere_at'];
    await trx.raw(
      `INSERT INTO sign_in_lockouts (account_key, ${count}, ${last}, updated_at) VALUES (?, 1, ?, now())
       ON CONFLICT (account_key) DO UPDATE SET ${count} = sign_in_lockouts.${count} + 1, ${last} = EXCLUDED.${last}, updated_at = now()`,
      [accountKey, at],
    );
  }

  /** Forgets an account's failure counts, after a good sign-in, a password reset or an admin's unlock. */
  async clear(trx: Knex.Transaction, accountKey: string): Promise<void> {
    await trx('sign_in_lockouts').where('account_key', accountKey).delete();
  }

  /** Forgets the per-address blocks of one account (the shared limiter stores them as `prefix:account|ip`). */
  async clearPairBlocks(trx: Knex.Transaction, prefix: string, accountKey: string): Promise<void> {
    await trx('rate_limits')
      .whereRaw("key LIKE ? ESCAPE '\\'", [`${prefix}:${accountKey.replace(/[\\%_]/g, (c) => '\\' + c)}|%`])
      .delete();
  }

  /**
   * Whether the account signed in successfully from this address since `since`, so failures from its usual places are
   * counted apart from failures elsewhere.
   */
  async isFamiliar(userId: number, ip: string, since: Date): Promise<boolean> {
    return (
      (await this.db('sign_in_addresses')
        .where({ user_id: userId, ip })
        .where('last_success_at', '>=', since)
        .first()) !== undefined
    );
  }

  /** Remembers a successful sign-in's address; addresses not used since `forgetBefore` are dropped. */
  async rememberAddress(
    trx: Knex.Transaction,
    userId: number,
    ip: string,
    at: Date,
    forgetBefore: Date,
  ): Promise<void> {
    await trx('sign_in_addresses')
      .insert({ user_id: userId, ip, last_success_at: at })
      .onConflict(['user_id', 'ip'])
      .merge({ last_success_at: at });
    await trx('sign_in_addresses').where('user_id', userId).where('last_success_at', '<', forgetBefore).delete();
  }

  /** The lock state of several accounts, for the accounts page. */
  async byKeys(keys: string[]): Promise<LockRow[]> {
    return keys.length ? this.db<LockRow>('sign_in_lockouts').whereIn('account_key', keys) : [];
  }
}
