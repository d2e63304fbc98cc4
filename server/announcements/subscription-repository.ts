import type { Knex } from 'knex';
import type { ImpliedBasis } from './implied-consent';
import type { MailList, Topic } from './topics';

/** One express consent record, as stored. */
export interface SubscriptionRow {
  id: number;
  email: string;
  topic: Topic;
  product_id: number | null;
  user_id: number | null;
  wording_version: string;
  wording_text: string;
  source_page: string;
  source_ip: string;
  requested_at: Date;
  confirm_token_hash: string | null;
  confirm_expires_at: Date | null;
  confirmed_at: Date | null;
  confirmed_ip: string | null;
  confirmed_how: string | null;
  withdrawn_at: Date | null;
  withdrawn_how: string | null;
}

/** What a sign-up writes for one list. */
export interface ConsentRequest {
  email: string;
  topic: Topic;
  productId: number | null;
  userId: number | null;
  wordingVersion: string;
  wordingText: string;
  sourcePage: string;
  sourceIp: string;
  tokenHash: string;
  expiresAt: Date;
  now: Date;
}

/** An address that may receive a list, with what its consent rests on. */
export interface AudienceRow {
  email: string;
  /** `express` with the confirmation instant, or an implied basis with its date. */
  basis: 'express' | ImpliedBasis;
  since: string;
}

const LIVE = (q: Knex.QueryBuilder) => q.whereNull('withdrawn_at');

/** SQL for consent records, implied consents and the audiences they make. */
export class SubscriptionRepository {
  constructor(private readonly db: Knex) {}

  /**
   * Writes a pending consent, or refreshes the pending one for the same address, list and product; leaves a
   * confirmed one alone. Returns false when the consent was already confirmed.
   */
  async requestConsent(trx: Knex.Transaction, r: ConsentRequest): Promise<boolean> {
    const live: SubscriptionRow | undefined = await trx('subscriptions')
      .where({ email: r.email, topic: r.topic })
      .whereRaw('COALESCE(product_id, 0) = ?', [r.productId ?? 0])
      .modify(LIVE)
      .forUpdate()
      .first();
    if (live?.confirmed_at) return false;
    const values = {
      user_id: r.userId ?? live?.user_id ?? null,
      wording_version: r.wordingVersion,
      wording_text: r.wordingText,
      source_page: r.sourcePage,
      source_ip: r.sourceIp,
      requested_at: r.now,
      confirm_token_hash: r.tokenHash,
      confirm_expires_at: r.expiresAt,
    };
    if (live) {
      await trx('subscriptions').where('id', live.id).update(values);
      return true;
    }
    // Two sign-ups of one address at once: the partial unique index lets one insert win, the other refreshes it.
    const inserted = await trx.raw(
      `INSERT INTO subscriptions (email, topic, product_id, user_id, wording_version, wording_text, source_page, source_ip, requested_at, confirm_token_hash, confirm_expires_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)
       ON CONFLICT (email, topic, COALESCE(product_id, 0)) WHERE withdrawn_at IS NULL DO NOTHING RETURNING id`,
      [
        r.email,
        r.topic,
        r.productId,
        values.user_id,
        r.wordingVersion,
        r.wordingText,
        r.sourcePage,
        r.sourceIp,
        r.now,
        r.tokenHash,
        r.expiresAt,
      ],
    );
    if (inserted.rows.length === 0) {
      await trx('subscriptions')
        .where({ email: r.email, topic: r.topic })
        .whereRaw('COALESCE(product_id, 0) = ?', [r.productId ?? 0])
        .modify(LIVE)
        .whereNull('confirmed_at')
        .update(values);
    }
    return true;
  }

  /** The pending consents a confirmation token stands for, locked. */
  pendingByToken(trx: Knex.Transaction, tokenHash: string): Promise<SubscriptionRow[]> {
    return trx('subscriptions')
      .where('confirm_token_hash', tokenHash)
      .whereNull('confirmed_at')
      .modify(LIVE)
      .forUpdate();
  }

  /** Marks the subscriptions confirmed by the e-mail link, keeping when and from where as proof of consent, and spends the token. */
  async confirm(trx: Knex.Transaction, ids: number[], at: Date, ip: string): Promise<void> {
    await trx('subscriptions').whereIn('id', ids).update({
      confirmed_at: at,
      confirmed_ip: ip,
      confirmed_how: 'email-link',
      confirm_token_hash: null,
      confirm_expires_at: null,
    });
  }

  /** Withdraws every live consent of an address for a list (or for all lists); returns how many there were. */
  async withdraw(trx: Knex.Transaction, email: string, topic: MailList | null, at: Date, how: string): Promise<number> {
    return trx('subscriptions')
      .where('email', email)
      .modify((q) => topic && q.where('topic', topic))
      .modify(LIVE)
      .update({ withdrawn_at: at, withdrawn_how: how, confirm_token_hash: null });
  }

  /** The live consents of an address, with the product names of drop requests. */
  byEmail(email: string): Promise<(SubscriptionRow & { product_name: string | null })[]> {
    return this.db('subscriptions as s')
      .leftJoin('shop_products as p', 'p.id', 's.product_id')
      .where('s.email', email)
      .whereNull('s.withdrawn_at')
      .orderBy('s.id')
      .select('s.*', 'p.name as product_name');
  }

  /** Whether a product exists, so a drop request cannot name one that does not. */
  async productExists(id: number): Promise<boolean> {
    return Boolean(await this.db('shop_products').where('id', id).first('id'));
  }

  /** A product's name, for the confirmation mail of a drop request; null when there is no such product. */
  async productName(trx: Knex.Transaction, id: number): Promise<string | null> {
    return (await trx('shop_products').where('id', id).first('name'))?.name ?? null;
  }

  /**
   * Addresses with a confirmed express consent for the list. `productId` narrows drop requests to those for that
   * product or for every product; without it, product requests count too (they asked about drops).
   */
  expressAudience(db: Knex, topic: Topic, productId?: number): Promise<{ email: string; since: Date }[]> {
    return db('subscriptions')
      .where('topic', topic)
      .whereNotNull('confirmed_at')
      .modify(LIVE)
      .modify(
        (q) => productId !== undefined && q.where((w) => w.whereNull('product_id').orWhere('product_id', productId)),
      )
      .groupBy('email')
      .select('email', db.raw('MIN(confirmed_at) AS since'));
  }

  /** The latest implied consent date of each address, per basis; an account that turned off news mail has none. */
  impliedConsents(
    db: Knex,
    bases: ImpliedBasis[],
  ): Promise<{ email: string; basis: ImpliedBasis; basis_on: string }[]> {
    return db('implied_consents as ic')
      .whereIn('ic.basis', bases)
      .whereNotExists((q) =>
        q.select(1).from('users as u').whereRaw('lower(u.email) = ic.email').andWhere('u.marketing_opt_out', true),
      )
      .groupBy('ic.email', 'ic.basis')
      .select('ic.email', 'ic.basis', db.raw("to_char(MAX(ic.basis_on), 'YYYY-MM-DD') AS basis_on"));
  }

  /**
   * Records the implied consents that purchases and memberships give, with their dates: a paid order's day (in the
   * club's time zone) and the last day of a membership's term. Re-running only moves a membership's date forward.
   */
  async recordImpliedConsents(trx: Knex.Transaction, timeZone: string): Promise<void> {
    await trx.raw(
      `INSERT INTO implied_consents (email, basis, basis_ref, basis_on)
       SELECT lower(o.email), 'purchase', o.id::text, (o.paid_at AT TIME ZONE ?)::date FROM shop_orders o
       WHERE o.paid_at IS NOT NULL
       ON CONFLICT (basis, basis_ref) DO NOTHING`,
      [timeZone],
    );
    await trx.raw(
      `INSERT INTO implied_consents (email, basis, basis_ref, basis_on)
       SELECT lower(u.email), 'membership', m.id::text, m.term_end FROM memberships m JOIN users u ON u.id = m.user_id
       WHERE m.term_end IS NOT NULL
       ON CONFLICT (basis, basis_ref) DO UPDATE SET basis_on = GREATEST(implied_consents.basis_on, EXCLUDED.basis_on), email = EXCLUDED.email`,
    );
  }
}
