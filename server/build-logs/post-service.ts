import type { Knex } from 'knex';
import type { PostPreview, PostSaved } from '../../contracts/build-logs/post-answers';
import { creditMarkers, creditMarkerSlugs, renderMarkdown } from '../markdown/render-markdown';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { CreditService } from '../sponsors/credit-service';
import type { SponsorRepository } from '../sponsors/sponsor-repository';
import { needsHazardNotice } from './hazard-rule';
import type { PostStatus } from '../../contracts/labels/post-states';
import type { PostRepository, PostRow, PostWrite } from './post-repository';
import { slugify, uniqueSlug } from '../platform/slug';

/** What an editor sends to create or replace a post. */
export interface PostInput {
  title: string;
  slug?: string;
  markdown: string;
  summary?: string;
  coverUrl?: string | null;
  tags?: string[];
  membersOnly?: boolean;
  status: PostStatus;
  publishAt?: Date | null;
  credits?: number[];
  hazardNotice?: boolean;
}

/** Posts: writing, publishing (with sponsor credits), scheduling and the editor's preview; no HTTP here. */
export class PostService {
  constructor(
    private readonly db: Knex,
    private readonly posts: PostRepository,
    private readonly sponsors: SponsorRepository,
    private readonly credits: CreditService,
  ) {}

  /** Creates a post in one transaction with its address made unique from the title (or the one asked for, if free) and its sponsor credits recorded. */
  async create(input: PostInput, authorId: number | null, now: Date): Promise<PostSaved> {
    return this.db.transaction(async (trx) => {
      const slug =
        input.slug ?? uniqueSlug(slugify(input.title), await this.posts.slugsLike(slugify(input.title), trx));
      if (input.slug && (await this.posts.slugTaken(input.slug, null, trx)))
        throw conflict('slug_taken', 'Another post uses this address.', { slug: 'Already used by another post.' });
      const { sponsorIds, chosen } = await this.creditedSponsors(trx, input);
      const write = this.toWrite(input, slug, null, now);
      const id = await this.posts.insert(trx, write, authorId);
      await this.posts.setCredits(trx, id, sponsorIds);
      await this.credits.syncPostCredits(
        trx,
        { id, slug, title: write.title, published: write.status === 'published' },
        sponsorIds,
        now,
        chosen,
      );
      return { id, slug };
    });
  }

  /** Replaces a post; setting the status back to draft unpublishes it and withdraws its credits. */
  async update(id: number, input: PostInput, now: Date): Promise<PostSaved> {
    return this.db.transaction(async (trx) => {
      const current = await this.posts.lockById(trx, id);
      if (!current) throw notFound('No such post.');
      const slug = input.slug ?? current.slug;
      if (await this.posts.slugTaken(slug, id, trx))
        throw conflict('slug_taken', 'Another post uses this address.', { slug: 'Already used by another post.' });
      const { sponsorIds, chosen } = await this.creditedSponsors(trx, input);
      const write = this.toWrite(input, slug, current, now);
      await this.posts.update(trx, id, write);
      await this.posts.setCredits(trx, id, sponsorIds);
      await this.credits.syncPostCredits(
        trx,
        { id, slug, title: write.title, published: write.status === 'published' },
        sponsorIds,
        now,
        chosen,
      );
      return { id, slug };
    });
  }

  /** Publishes scheduled posts whose time has come (the scheduled job). */
  async publishDue(now: Date): Promise<{ published: number }> {
    return this.db.transaction(async (trx) => {
      const due = await this.posts.dueScheduled(trx, now);
      for (const p of due) {
        const input: PostInput = {
          title: p.title,
          markdown: p.markdown,
          summary: p.summary,
          coverUrl: p.cover_url,
          tags: p.tags,
          membersOnly: p.members_only,
          status: 'published',
          publishAt: p.publish_at,
          hazardNotice: p.hazard_requested,
        };
        const sponsorIds = (await this.posts.creditedSponsorIds([p.id], trx)).get(p.id) ?? [];
        await this.posts.update(trx, p.id, {
          ...this.toWrite(input, p.slug, p, now),
          publishedAt: p.publish_at ?? now,
        });
        const markers = creditMarkers(p.markdown);
        const chosen = this.chosenDeliverables(
          markers,
          await this.sponsors.bySlugs(
            markers.map((m) => m.slug),
            trx,
          ),
        );
        await this.credits.syncPostCredits(
          trx,
          { id: p.id, slug: p.slug, title: p.title, published: true },
          sponsorIds,
          now,
          chosen,
        );
      }
      return { published: due.length };
    });
  }

  /** The editor's live preview, through the same pipeline as the public page. */
  async preview(input: { markdown: string; title?: string; summary?: string; tags?: string[] }): Promise<PostPreview> {
    const slugs = creditMarkerSlugs(input.markdown);
    const found = await this.sponsors.bySlugs(slugs);
    return {
      html: renderMarkdown(input.markdown, { sponsorNames: new Map(found.map((s) => [s.slug, s.name])) }),
      hazardNotice: needsHazardNotice({
        title: input.title ?? '',
        summary: input.summary ?? '',
        markdown: input.markdown,
        tags: input.tags ?? [],
      }),
      unknownSponsors: slugs.filter((s) => !found.some((f) => f.slug === s)),
    };
  }

  /**
   * Sponsors from the editor's panel and from the credit markers in the body, with the deliverable each marker names
   * (by sponsor id). An unknown sponsor, or a marker naming a deliverable that is not one of that sponsor's, is a
   * field error on the text.
   */
  private async creditedSponsors(
    trx: Knex.Transaction,
    input: PostInput,
  ): Promise<{ sponsorIds: number[]; chosen: Map<number, number> }> {
    const ids = [...new Set(input.credits ?? [])];
    const byId = await this.sponsors.byIds(ids, trx);
    if (byId.length !== ids.length)
      throw badRequest('A credited sponsor does not exist.', { credits: 'Pick sponsors from the list.' });
    const markers = creditMarkers(input.markdown);
    const bySlug = await this.sponsors.bySlugs(
      markers.map((m) => m.slug),
      trx,
    );
    const unknown = markers.filter((m) => !bySlug.some((b) => b.slug === m.slug));
    if (unknown.length)
      throw badRequest('A credit marker names a sponsor that does not exist.', {
        markdown: `No sponsor with the address “${unknown[0].slug}”. Use the credit picker to insert a marker.`,
      });
    const chosen = this.chosenDeliverables(markers, bySlug);
    const owners = await this.credits.deliverableSponsors(trx, [...chosen.values()]);
    for (const [sponsorId, deliverableId] of chosen) {
      if (owners.get(deliverableId) === sponsorId) continue;
      const slug = bySlug.find((b) => b.id === sponsorId)!.slug;
      throw badRequest('A credit marker names a promise of another sponsor.', {
        markdown: `The marker for “${slug}” names promise #${deliverableId}, which is not one of that sponsor’s. Use the credit picker to insert a marker.`,
      });
    }
    return { sponsorIds: [...new Set([...ids, ...bySlug.map((s) => s.id)])].sort((a, b) => a - b), chosen };
  }

  /** The deliverable each credit marker names, by sponsor id (markers without `#id` leave the choice to the ledger). */
  private chosenDeliverables(
    markers: readonly { slug: string; deliverableId: number | null }[],
    sponsors: readonly { id: number; slug: string }[],
  ): Map<number, number> {
    const chosen = new Map<number, number>();
    for (const m of markers) {
      const sponsor = sponsors.find((s) => s.slug === m.slug);
      if (sponsor && m.deliverableId !== null) chosen.set(sponsor.id, m.deliverableId);
    }
    return chosen;
  }

  private toWrite(input: PostInput, slug: string, current: PostRow | null, now: Date): PostWrite {
    if (input.status === 'scheduled' && (!input.publishAt || input.publishAt <= now))
      throw badRequest('Pick a future time to schedule the post.', { publishAt: 'Must be in the future.' });
    const publishedAt =
      input.status === 'published'
        ? current?.status === 'published' && current.published_at
          ? current.published_at
          : now
        : null;
    return {
      slug,
      title: input.title,
      summary: input.summary ?? '',
      coverUrl: input.coverUrl ?? null,
      markdown: input.markdown,
      tags: [...new Set((input.tags ?? []).map((t) => t.toLowerCase()))],
      status: input.status,
      publishAt: input.status === 'scheduled' ? input.publishAt! : null,
      publishedAt,
      membersOnly: input.membersOnly ?? false,
      hazardRequested: input.hazardNotice ?? current?.hazard_requested ?? false,
    };
  }
}
