import type { Knex } from 'knex';
import type { DeliverableKind } from './sponsor-ledger';

type Db = Knex | Knex.Transaction;

export interface SponsorRow {
  id: number;
  slug: string;
  name: string;
  website: string | null;
  blurb: string | null;
  logo_url: string | null;
  created_at: Date;
}

export interface AgreementRow {
  id: number;
  sponsor_id: number;
  season: string;
  cash_cents: number;
  cash_received_on: string | null;
  cash_movement_id: number | null;
  note: string | null;
  tax_treatment: 'promotion' | 'gift';
  tax_province: string | null;
  created_at: Date;
}

export interface InKindRow {
  id: number;
  agreement_id: number;
  description: string;
  value_cents: number;
  received_on: string | null;
}

export interface DeliverableRow {
  id: number;
  agreement_id: number;
  sponsor_id: number;
  kind: DeliverableKind;
  quantity: number;
  due_on: string;
  delivered: number;
  season: string;
}

export interface CreditRow {
  id: number;
  sponsor_id: number;
  deliverable_id: number | null;
  kind: DeliverableKind;
  url: string | null;
  video_timestamp: string | null;
  note: string | null;
  post_id: number | null;
  post_slug: string | null;
  post_title: string | null;
  credited_at: Date;
  withdrawn_at: Date | null;
}

export interface ContactRow {
  user_id: number;
  email: string;
  display_name: string;
}

/** Plain reads and writes of sponsors, their contacts, agreements, deliverables and credits. */
export class SponsorRepository {
  constructor(readonly db: Knex) {}

  /** Every sponsor, by name. */
  all(trx: Db = this.db): Promise<SponsorRow[]> {
    return trx<SponsorRow>('sponsors').orderBy('name');
  }

  /** One sponsor by id. */
  byId(id: number, trx: Db = this.db): Promise<SponsorRow | undefined> {
    return trx<SponsorRow>('sponsors').where('id', id).first();
  }

  /** The sponsors with these ids, in no particular order. */
  byIds(ids: readonly number[], trx: Db = this.db): Promise<SponsorRow[]> {
    return ids.length ? trx<SponsorRow>('sponsors').whereIn('id', ids) : Promise.resolve([]);
  }

  /** The sponsors with these slugs, as `%thanks` markers in posts name them. */
  bySlugs(slugs: readonly string[], trx: Db = this.db): Promise<SponsorRow[]> {
    return slugs.length ? trx<SponsorRow>('sponsors').whereIn('slug', slugs) : Promise.resolve([]);
  }

  /** Locks the sponsor row so two publishes do not count against the same open deliverable at once. */
  async lock(trx: Knex.Transaction, id: number): Promise<void> {
    await trx('sponsors').where('id', id).forUpdate().first();
  }

  /** The slugs already taken by `base` and its numbered variants, so a new sponsor gets a free one. */
  async slugsLike(base: string, trx: Db = this.db): Promise<Set<string>> {
    const rows = await trx('sponsors').where('slug', base).orWhereLike('slug', `${base}-%`).select('slug');
    return new Set(rows.map((r: { slug: string }) => r.slug));
  }

  /** Adds a sponsor with the slug the caller chose as free. */
  async insert(
    trx: Db,
    s: { slug: string; name: string; website: string | null; blurb: string | null; logoUrl: string | null },
  ): Promise<SponsorRow> {
    const [row] = await trx<SponsorRow>('sponsors')
      .insert({ slug: s.slug, name: s.name, website: s.website, blurb: s.blurb, logo_url: s.logoUrl })
      .returning('*');
    return row;
  }

  /** Saves a sponsor's name, website, blurb and logo; the slug stays, so links keep working. */
  async update(
    trx: Db,
    id: number,
    patch: { name: string; website: string | null; blurb: string | null; logoUrl: string | null },
  ): Promise<SponsorRow | undefined> {
    const [row] = await trx<SponsorRow>('sponsors')
      .where('id', id)
      .update({
        name: patch.name,
        website: patch.website,
        blurb: patch.blurb,
        logo_url: patch.logoUrl,
        updated_at: trx.fn.now() as unknown as Date,
      } as Partial<SponsorRow>)
      .returning('*');
    return row;
  }

  /** Makes an account a contact of the sponsor; adding one twice is harmless. */
  async addContact(trx: Db, sponsorId: number, userId: number): Promise<void> {
    await trx('sponsor_contacts')
      .insert({ sponsor_id: sponsorId, user_id: userId })
      .onConflict(['sponsor_id', 'user_id'])
      .ignore();
  }

  /** Removes an account from the sponsor's contacts, answering how many rows went (0 when it was not one). */
  async removeContact(trx: Knex.Transaction, sponsorId: number, userId: number): Promise<number> {
    return trx('sponsor_contacts').where({ sponsor_id: sponsorId, user_id: userId }).delete();
  }

  /** The accounts that can open the sponsor's portal, by display name. */
  contacts(sponsorId: number, trx: Db = this.db): Promise<ContactRow[]> {
    return trx('sponsor_contacts as c')
      .join('users as u', 'u.id', 'c.user_id')
      .where('c.sponsor_id', sponsorId)
      .orderBy('u.display_name')
      .select('u.id as user_id', 'u.email', 'u.display_name');
  }

  /** The sponsor an account is a contact of (the earliest link when there are several). */
  sponsorOfUser(userId: number): Promise<SponsorRow | undefined> {
    return this.db<SponsorRow>('sponsors as s')
      .join('sponsor_contacts as c', 'c.sponsor_id', 's.id')
      .where('c.user_id', userId)
      .orderBy('c.created_at')
      .select('s.*')
      .first();
  }

  /** Records a season's agreement in the caller's transaction, so its in-kind items and deliverables commit with it. */
  async insertAgreement(
    trx: Knex.Transaction,
    a: {
      sponsorId: number;
      season: string;
      cashCents: number;
      cashReceivedOn: string | null;
      note: string | null;
      taxTreatment: 'promotion' | 'gift';
      taxProvince: string | null;
    },
  ): Promise<number> {
    const [row] = await trx('sponsor_agreements')
      .insert({
        sponsor_id: a.sponsorId,
        season: a.season,
        cash_cents: a.cashCents,
        cash_received_on: a.cashReceivedOn,
        note: a.note,
        tax_treatment: a.taxTreatment,
        tax_province: a.taxProvince,
      })
      .returning('id');
    return row.id;
  }

  /** An agreement, locked for the transaction, so two staff changing it take turns. */
  async lockAgreement(trx: Knex.Transaction, id: number): Promise<AgreementRow | undefined> {
    return trx<AgreementRow>('sponsor_agreements').where('id', id).forUpdate().first();
  }

  /** Sets how an agreement is taxed. */
  async setTaxTreatment(
    trx: Knex.Transaction,
    id: number,
    treatment: 'promotion' | 'gift',
    province: string | null,
  ): Promise<void> {
    await trx('sponsor_agreements').where('id', id).update({ tax_treatment: treatment, tax_province: province });
  }

  /** Records the goods and services an agreement brings, in the agreement's transaction. */
  async insertInKind(
    trx: Knex.Transaction,
    agreementId: number,
    items: readonly { description: string; valueCents: number; receivedOn: string | null }[],
  ): Promise<void> {
    if (items.length)
      await trx('agreement_in_kind').insert(
        items.map((i) => ({
          agreement_id: agreementId,
          description: i.description,
          value_cents: i.valueCents,
          received_on: i.receivedOn,
        })),
      );
  }

  /** Records what the club promised in return, in the agreement's transaction. */
  async insertDeliverables(
    trx: Knex.Transaction,
    agreementId: number,
    items: readonly { kind: DeliverableKind; quantity: number; dueOn: string }[],
  ): Promise<void> {
    if (items.length)
      await trx('agreement_deliverables').insert(
        items.map((d) => ({ agreement_id: agreementId, kind: d.kind, quantity: d.quantity, due_on: d.dueOn })),
      );
  }

  /** One agreement with its cash-received day as `YYYY-MM-DD`. */
  agreementById(id: number, trx: Db = this.db): Promise<AgreementRow | undefined> {
    return trx<AgreementRow>('sponsor_agreements')
      .where('id', id)
      .first('*', trx.raw("to_char(cash_received_on, 'YYYY-MM-DD') as cash_received_on"));
  }

  /** Records the day the cash arrived and its money movement, in the transaction that books it. */
  async markCashReceived(
    trx: Knex.Transaction,
    id: number,
    receivedOn: string,
    movementId: number | null,
  ): Promise<void> {
    await trx('sponsor_agreements')
      .where('id', id)
      .update({ cash_received_on: receivedOn, cash_movement_id: movementId });
  }

  /** Agreements of one sponsor, or of everyone when `sponsorId` is null. */
  agreements(sponsorId: number | null, trx: Db = this.db): Promise<AgreementRow[]> {
    return trx<AgreementRow>('sponsor_agreements')
      .modify((q) => sponsorId !== null && q.where('sponsor_id', sponsorId))
      .select('*', trx.raw("to_char(cash_received_on, 'YYYY-MM-DD') as cash_received_on"))
      .orderBy([
        { column: 'season', order: 'desc' },
        { column: 'id', order: 'desc' },
      ]);
  }

  /** The in-kind items of these agreements, with received days as `YYYY-MM-DD`. */
  inKind(agreementIds: readonly number[], trx: Db = this.db): Promise<InKindRow[]> {
    if (!agreementIds.length) return Promise.resolve([]);
    return trx<InKindRow>('agreement_in_kind')
      .whereIn('agreement_id', agreementIds)
      .select('*', trx.raw("to_char(received_on, 'YYYY-MM-DD') as received_on"))
      .orderBy('id');
  }

  /** Deliverables with their live credit counts, of one sponsor or (null) of every sponsor. */
  deliverables(sponsorId: number | null, trx: Db = this.db): Promise<DeliverableRow[]> {
    return trx('agreement_deliverables as d')
      .join('sponsor_agreements as a', 'a.id', 'd.agreement_id')
      .modify((q) => sponsorId !== null && q.where('a.sponsor_id', sponsorId))
      .select(
        'd.id',
        'd.agreement_id',
        'a.sponsor_id',
        'a.season',
        'd.kind',
        'd.quantity',
        trx.raw("to_char(d.due_on, 'YYYY-MM-DD') as due_on"),
        trx.raw(
          '(SELECT count(*) FROM sponsor_credits c WHERE c.deliverable_id = d.id AND c.withdrawn_at IS NULL) as delivered',
        ),
      )
      .orderBy([{ column: 'd.due_on' }, { column: 'd.id' }]);
  }

  /** Records one credit given to a sponsor, against a promise when it names one. */
  async insertCredit(
    trx: Knex.Transaction,
    c: {
      sponsorId: number;
      deliverableId: number | null;
      kind: DeliverableKind;
      url: string | null;
      videoTimestamp: string | null;
      note: string | null;
      postId: number | null;
      recordedBy: number | null;
      creditedAt: Date;
    },
  ): Promise<number> {
    const [row] = await trx('sponsor_credits')
      .insert({
        sponsor_id: c.sponsorId,
        deliverable_id: c.deliverableId,
        kind: c.kind,
        url: c.url,
        video_timestamp: c.videoTimestamp,
        note: c.note,
        post_id: c.postId,
        recorded_by: c.recordedBy,
        credited_at: c.creditedAt,
      })
      .returning('id');
    return row.id;
  }

  /** Sponsor ids with a live credit from the post. */
  async liveCreditSponsors(trx: Db, postId: number): Promise<number[]> {
    const rows = await trx('sponsor_credits').where('post_id', postId).whereNull('withdrawn_at').select('sponsor_id');
    return rows.map((r: { sponsor_id: number }) => r.sponsor_id);
  }

  /** Withdraws a post's live credits for these sponsors (the post no longer thanks them), keeping the rows for the ledger's history. */
  async withdrawPostCredits(
    trx: Knex.Transaction,
    postId: number,
    sponsorIds: readonly number[],
    at: Date,
  ): Promise<number> {
    if (!sponsorIds.length) return 0;
    return trx('sponsor_credits')
      .where('post_id', postId)
      .whereIn('sponsor_id', sponsorIds)
      .whereNull('withdrawn_at')
      .update({ withdrawn_at: at });
  }

  /** Live credits of a sponsor, newest first, with the crediting post. */
  credits(sponsorId: number, trx: Db = this.db): Promise<CreditRow[]> {
    return trx('sponsor_credits as c')
      .leftJoin('posts as p', 'p.id', 'c.post_id')
      .where('c.sponsor_id', sponsorId)
      .whereNull('c.withdrawn_at')
      .select('c.*', 'p.slug as post_slug', 'p.title as post_title')
      .orderBy([
        { column: 'c.credited_at', order: 'desc' },
        { column: 'c.id', order: 'desc' },
      ]);
  }

  /** Season totals per sponsor id: cash plus declared in-kind value. */
  async seasonTotals(season: string, trx: Db = this.db): Promise<Map<number, number>> {
    const rows = await trx('sponsor_agreements as a')
      .where('a.season', season)
      .select(
        'a.sponsor_id',
        trx.raw(
          'sum(a.cash_cents + coalesce((SELECT sum(value_cents) FROM agreement_in_kind i WHERE i.agreement_id = a.id), 0))::bigint as total',
        ),
      )
      .groupBy('a.sponsor_id');
    return new Map(rows.map((r: { sponsor_id: number; total: number }) => [r.sponsor_id, r.total]));
  }

  /** Published posts that credit each sponsor, newest first. */
  creditingPosts(trx: Db = this.db): Promise<{ sponsor_id: number; slug: string; title: string }[]> {
    return trx('post_credits as pc')
      .join('posts as p', 'p.id', 'pc.post_id')
      .where('p.status', 'published')
      .select('pc.sponsor_id', 'p.slug', 'p.title')
      .orderBy('p.published_at', 'desc');
  }

  /** Names of sponsors whose logo is one of `urls`. */
  async namesUsingLogo(urls: readonly string[]): Promise<string[]> {
    return (await this.db('sponsors').whereIn('logo_url', urls).orderBy('name').pluck('name')) as string[];
  }
}
