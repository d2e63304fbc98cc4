import type { Knex } from 'knex';

export interface SponsorRow {
  id: number;
  slug: string;
  name: string;
  website: string | null;
  blurb: string | null;
  logo_url: string | null;
  created_at: Date;
}

export interface ContactRow {
  user_id: number;
  email: string;
  display_name: string;
}

/** Plain reads and writes of sponsors and their contacts (`sponsors`, `sponsor_contacts`). */
export class SponsorRepository {
  constructor(private readonly db: Knex) {}

  /** Every sponsor, by name. */
  all(trx: Knex = this.db): Promise<SponsorRow[]> {
    return trx<SponsorRow>('sponsors').orderBy('name');
  }

  /** One sponsor by id. */
  byId(id: number, trx: Knex = this.db): Promise<SponsorRow | undefined> {
    return trx<SponsorRow>('sponsors').where('id', id).first();
  }

  /** The sponsors with these ids, by name. */
  byIds(ids: readonly number[], trx: Knex = this.db): Promise<SponsorRow[]> {
    return ids.length ? trx<SponsorRow>('sponsors').whereIn('id', ids).orderBy('name') : Promise.resolve([]);
  }

  /** The sponsors with these slugs, as `%thanks` markers in posts name them. */
  bySlugs(slugs: readonly string[], trx: Knex = this.db): Promise<SponsorRow[]> {
    return slugs.length ? trx<SponsorRow>('sponsors').whereIn('slug', slugs) : Promise.resolve([]);
  }

  /** Locks the sponsor row so two publishes do not count against the same open deliverable at once. */
  async lock(trx: Knex.Transaction, id: number): Promise<void> {
    await trx('sponsors').where('id', id).forUpdate().first();
  }

  /** The slugs already taken by `base` and its numbered variants, so a new sponsor gets a free one. */
  async slugsLike(base: string, trx: Knex = this.db): Promise<Set<string>> {
    const rows = await trx('sponsors').where('slug', base).orWhereLike('slug', `${base}-%`).select('slug');
    return new Set(rows.map((r: { slug: string }) => r.slug));
  }

  /** Adds a sponsor with the slug the caller chose as free. */
  async insert(
    trx: Knex.Transaction,
    s: { slug: string; name: string; website: string | null; blurb: string | null; logoUrl: string | null },
  ): Promise<SponsorRow> {
    const [row] = await trx<SponsorRow>('sponsors')
      .insert({ slug: s.slug, name: s.name, website: s.website, blurb: s.blurb, logo_url: s.logoUrl })
      .returning('*');
    return row;
  }

  /** Saves a sponsor's name, website, blurb and logo; the slug stays, so links keep working. */
  async update(
    trx: Knex.Transaction,
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
  async addContact(trx: Knex.Transaction, sponsorId: number, userId: number): Promise<void> {
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
  contacts(sponsorId: number, trx: Knex = this.db): Promise<ContactRow[]> {
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

  /** Names of sponsors whose logo is one of `urls`. */
  async namesUsingLogo(urls: readonly string[]): Promise<string[]> {
    return (await this.db('sponsors').whereIn('logo_url', urls).orderBy('name').pluck('name')) as string[];
  }
}
