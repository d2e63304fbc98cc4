import type { Knex } from 'knex';

/** What a single-use link is for. */
export type TokenPurpose = 'password_reset' | 'verify_email';

/** A stored single-use link: only the hash of its token is kept. */
export interface AuthTokenRow {
  id: number;
  user_id: number;
  purpose: TokenPurpose;
  token_hash: string;
  expires_at: Date;
  used_at: Date | null;
}

/** The single-use links (password reset, e-mail verification) and the stored sessions they end. */
export class AuthTokenRepository {
  /** Stores a new link's hash. */
  async insert(
    trx: Knex.Transaction,
    token: { userId: number; purpose: TokenPurpose; hash: string; expiresAt: Date },
  ): Promise<void> {
    await trx('auth_tokens').insert({
      user_id: token.userId,
      purpose: token.purpose,
      token_hash: token.hash,
      expires_at: token.expiresAt,
    });
  }

  /** Marks every unused link of this purpose for the user as used, so only the newest one works. */
  async retire(trx: Knex.Transaction, userId: number, purpose: TokenPurpose, at: Date): Promise<void> {
    await trx('auth_tokens').where({ user_id: userId, purpose }).whereNull('used_at').update({ used_at: at });
  }

  /** The link with this hash and purpose, locked for the transaction so it is used once. */
  async lockByHash(trx: Knex.Transaction, hash: string, purpose: TokenPurpose): Promise<AuthTokenRow | undefined> {
    return trx('auth_tokens').where({ token_hash: hash, purpose }).forUpdate().first();
  }

  /** Marks one link as used. */
  async markUsed(trx: Knex.Transaction, id: number, at: Date): Promise<void> {
    await trx('auth_tokens').where('id', id).update({ used_at: at });
  }

  /** Deletes the user's stored sessions (kept as JSON with passport.user), except `keepSessionId`. */
  async endSessions(trx: Knex.Transaction, userId: number, keepSessionId?: string): Promise<void> {
    await trx('session')
      .whereRaw(`(sess->'passport'->>'user') = ?`, [String(userId)])
      .modify((q) => keepSessionId && q.whereNot('sid', keepSessionId))
      .delete();
  }
}
