import type { Knex } from 'knex';
import type { UserRepository } from '../auth/user-repository';
import type { ContactAdded, CreditRecorded } from '../../contracts/sponsors/sponsor-answers';
import type { PostTitles } from '../build-logs/build-logs-feature';
import { slugify, uniqueSlug } from '../platform/slug';
import { AppError, conflict, notFound } from '../platform/app-error';
import type { CreditRepository } from './credit-repository';
import type { CreditService } from './credit-service';
import type { DeliverableKind } from './sponsor-ledger';
import type { SponsorRepository } from './sponsor-repository';
import { toCredit, toView, type CreditView, type SponsorView } from './sponsor-views';

export interface SponsorInput {
  name: string;
  website?: string | null;
  blurb?: string | null;
  logoUrl?: string | null;
}

/** Sponsors, their contacts and the credits given to them; no HTTP here. */
export class SponsorService {
  constructor(
    private readonly db: Knex,
    private readonly repo: SponsorRepository,
    private readonly creditRows: CreditRepository,
    private readonly credits: CreditService,
    private readonly users: UserRepository,
    /** The crediting posts' addresses and titles, lent by the build logs. */
    private readonly posts: PostTitles,
  ) {}

  /** Adds a sponsor under a slug made from its name and not yet taken. */
  async create(input: SponsorInput): Promise<SponsorView> {
    return this.db.transaction(async (trx) => {
      const base = slugify(input.name);
      const slug = uniqueSlug(base, await this.repo.slugsLike(base, trx));
      return toView(
        await this.repo.insert(trx, {
          slug,
          name: input.name,
          website: input.website ?? null,
          blurb: input.blurb ?? null,
          logoUrl: input.logoUrl ?? null,
        }),
      );
    });
  }

  /** Saves a sponsor's public details; 404 when there is no such sponsor. */
  async update(id: number, input: SponsorInput): Promise<SponsorView> {
    const row = await this.db.transaction((trx) =>
      this.repo.update(trx, id, {
        name: input.name,
        website: input.website ?? null,
        blurb: input.blurb ?? null,
        logoUrl: input.logoUrl ?? null,
      }),
    );
    if (!row) throw notFound('No such sponsor.');
    return toView(row);
  }

  /** One sponsor as staff see it; 404 when there is none. */
  async get(id: number): Promise<SponsorView> {
    const row = await this.repo.byId(id);
    if (!row) throw notFound('No such sponsor.');
    return toView(row);
  }

  /** Every credit the sponsor was given, for the ledger. */
  async creditsOf(sponsorId: number): Promise<CreditView[]> {
    const rows = await this.creditRows.credits(sponsorId);
    // One lookup of the crediting posts' titles, lent by the build logs, for every credit at once.
    const posts = await this.posts.byIds([...new Set(rows.flatMap((c) => (c.post_id !== null ? [c.post_id] : [])))]);
    return rows.map((c) => toCredit(c, c.post_id !== null ? posts.get(c.post_id) : undefined));
  }

  /** Records a credit given by hand, counted against an open promise of its kind when there is one. */
  async recordCredit(
    sponsorId: number,
    input: {
      kind: DeliverableKind;
      url: string | null;
      videoTimestamp?: string | null;
      note?: string | null;
      creditedAt: Date;
    },
    userId: number,
  ): Promise<CreditRecorded> {
    await this.get(sponsorId);
    const r = await this.db.transaction((trx) =>
      this.credits.recordByHand(
        trx,
        sponsorId,
        { ...input, videoTimestamp: input.videoTimestamp ?? null, note: input.note ?? null },
        userId,
      ),
    );
    return { id: r.id, counted: r.deliverableId !== null };
  }

  /** Links an account as a contact; only accounts holding the `sponsor` role can be contacts. */
  async addContact(sponsorId: number, who: { userId?: number; email?: string }): Promise<ContactAdded> {
    await this.get(sponsorId);
    const user =
      who.userId !== undefined ? await this.users.byId(who.userId) : await this.users.byEmail(who.email ?? '');
    if (!user)
      throw new AppError(404, 'not_found', 'No account matches.', {
        [who.userId !== undefined ? 'userId' : 'email']: 'No account matches.',
      });
    if (!user.roles.includes('sponsor'))
      throw conflict(
        'not_a_sponsor_account',
        'That account does not hold the sponsor role; an admin can grant it on the accounts page.',
        { email: 'Needs the sponsor role first.' },
      );
    await this.db.transaction((trx) => this.repo.addContact(trx, sponsorId, user.id));
    return { userId: user.id };
  }

  /** Takes portal access away from an account; 404 when it was not a contact. */
  async removeContact(sponsorId: number, userId: number): Promise<void> {
    if (!(await this.db.transaction((trx) => this.repo.removeContact(trx, sponsorId, userId))))
      throw notFound('That account is not a contact of this sponsor.');
  }

  /** The accounts that can open the sponsor's portal. */
  async contacts(sponsorId: number): Promise<{ userId: number; email: string; displayName: string }[]> {
    return (await this.repo.contacts(sponsorId)).map((c) => ({
      userId: c.user_id,
      email: c.email,
      displayName: c.display_name,
    }));
  }

  /** The sponsor an account is a contact of; 404 when it is linked to none. */
  async sponsorOfUser(userId: number): Promise<SponsorView> {
    const row = await this.repo.sponsorOfUser(userId);
    if (!row)
      throw notFound('Your account is not linked to a sponsor yet. Ask the club’s treasurer to add you as a contact.');
    return toView(row);
  }
}
