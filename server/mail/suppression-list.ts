import type { Knex } from 'knex';

export type SuppressionReason = 'unsubscribed' | 'hard_bounce' | 'complaint' | 'manual';

/** A queued row as far as the suppression check needs it. */
export interface SuppressionCandidate {
  id: number;
  to_address: string;
  category: 'transactional' | 'commercial';
  list: string | null;
}

/**
 * The suppression list in PostgreSQL, so every process consults the same one. A suppression with `list` null covers
 * every commercial list; a hard bounce also stops transactional mail (the mailbox does not exist).
 */
export class SuppressionList {
  constructor(private readonly db: Knex) {}

  /** Records a suppression; a second one for the same address and list keeps the first. */
  async add(
    trx: Knex.Transaction,
    email: string,
    reason: SuppressionReason,
    opts: { list?: string | null; detail?: string } = {},
  ): Promise<void> {
    await trx.raw(
      `INSERT INTO email_suppressions (email, list, reason, detail) VALUES (?, ?, ?, ?) ON CONFLICT (email, COALESCE(list, '')) DO NOTHING`,
      [email.trim().toLowerCase(), opts.list ?? null, reason, opts.detail?.slice(0, 500) ?? null],
    );
  }

  /** Lifts an unsubscribe from one list (the person confirmed a new sign-up); bounces and complaints stay. */
  async liftUnsubscribe(trx: Knex.Transaction, email: string, list: string): Promise<void> {
    await trx('email_suppressions').where({ email: email.trim().toLowerCase(), list, reason: 'unsubscribed' }).delete();
  }

  /** Of these rows, the ids the list says must not be sent. */
  async blocked(rows: SuppressionCandidate[], db: Knex = this.db): Promise<Set<number>> {
    if (rows.length === 0) return new Set();
    const found: { email: string; list: string | null; reason: SuppressionReason }[] = await db('email_suppressions')
      .whereIn('email', [...new Set(rows.map((r) => r.to_address.toLowerCase()))])
      .select('email', 'list', 'reason');
    const out = new Set<number>();
    for (const r of rows) {
      const email = r.to_address.toLowerCase();
      const hit = found.some(
        (s) =>
          s.email === email &&
          (r.category === 'commercial' ? s.list === null || s.list === r.list : s.reason === 'hard_bounce'),
      );
      if (hit) out.add(r.id);
    }
    return out;
  }

  /** Addresses suppressed for a list (or every list), for leaving them out before anything is queued. */
  async emailsFor(list: string, db: Knex = this.db): Promise<Set<string>> {
    const rows = await db('email_suppressions')
      .where((q) => q.whereNull('list').orWhere('list', list))
      .select('email');
    return new Set(rows.map((r: { email: string }) => r.email));
  }
}
