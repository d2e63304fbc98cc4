import type { Knex } from 'knex';
import type {
  AdminPost,
  AdminPostRow,
  PostDetail,
  PostPage,
  PostPreview,
  PostSummary,
} from '../../contracts/build-logs/post-answers';
import { creditMarkers, creditMarkerSlugs, renderMarkdown } from '../markdown/render-markdown';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Role } from '../platform/roles';
import type { CreditService } from '../sponsors/credit-service';
import type { SponsorRepository } from '../sponsors/sponsor-repository';
import { needsHazardNotice } from './hazard-rule';
import type { PostStatus } from '../../contracts/labels/post-states';
import type { PostRepository, PostRow, PostWrite } from './post-repository';
import { slugify, uniqueSlug } from '../platform/slug';
import type { StoredImage } from '../uploads/image-uploads';

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

/** Roles that may read members-only bodies. */
const BODY_READERS: readonly Role[] = ['member', 'editor', 'admin'];

/** Posts: writing, publishing (with sponsor credits), scheduling and reading; no HTTP here. */
export class PostService {
  constructor(
    private readonly db: Knex,
    private readonly posts: PostRepository,
    private readonly sponsors: SponsorRepository,
    private readonly credits: CreditService,
    /** Sizes and thumbnail of an uploaded cover, so the page can give it a srcset and reserve its space. */
    private readonly describeImages: (urls: readonly string[]) => Promise<Map<string, StoredImage>> = async () =>
      new Map(),
  ) {}

  /** Creates a post in one transaction with its address made unique from the title (or the one asked for, if free) and its sponsor credits recorded. */
  async create(input: PostInput, authorId: number | null, now: Date): Promise<{ id: number; slug: string }> {
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
  async update(id: number, input: PostInput, now: Date): Promise<{ id: number; slug: string }> {
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
        const sponsorIds = [...((await this.posts.creditsOf([p.id], trx)).get(p.id) ?? [])].map((c) => c.sponsorId);
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

  /** One page of published posts, newest first, optionally for one tag, with each cover's stored description for its alt text. */
  async publicPage(opts: { tag?: string; page: number; pageSize: number }): Promise<PostPage<PostSummary>> {
    const { items, total } = await this.posts.publishedPage(opts);
    const covers = await this.describeImages(items.flatMap((p) => (p.cover_url ? [p.cover_url] : [])));
    return {
      items: items.map((p) => ({
        slug: p.slug,
        title: p.title,
        summary: p.summary,
        coverUrl: p.cover_url,
        cover: coverOf(covers, p.cover_url),
        publishedAt: p.published_at!.toISOString(),
        tags: p.tags,
        membersOnly: p.members_only,
      })),
      total,
      page: opts.page,
      pageSize: opts.pageSize,
    };
  }

  /** Tags of published posts with how many posts carry each, most used first, for the tag filter on the list. */
  tags() {
    return this.posts.tagCounts();
  }

  /** A published post; members-only bodies are withheld (html null) from callers without a reading role. */
  async publicPost(slug: string, roles: readonly Role[]): Promise<PostDetail> {
    const p = await this.posts.publishedBySlug(slug);
    if (!p) throw notFound('No build log at this address.');
    const credits = (await this.posts.creditsOf([p.id])).get(p.id) ?? [];
    const mayRead = !p.members_only || roles.some((r) => BODY_READERS.includes(r));
    return {
      slug: p.slug,
      title: p.title,
      summary: p.summary,
      coverUrl: p.cover_url,
      cover: coverOf(p.cover_url ? await this.describeImages([p.cover_url]) : new Map(), p.cover_url),
      author: p.author_name ?? null,
      html: mayRead ? this.render(p, credits) : null,
      publishedAt: p.published_at!.toISOString(),
      // The last edit, for the page's structured data and the sitemap; never before publishing.
      updatedAt: new Date(Math.max(p.updated_at.getTime(), p.published_at!.getTime())).toISOString(),
      tags: p.tags,
      membersOnly: p.members_only,
      credits,
      hazardNotice: this.hazardOf(p),
    };
  }

  /** One page of every post whatever its state, for the editors' table. */
  async adminPage(opts: Parameters<PostRepository['adminPage']>[0]): Promise<PostPage<AdminPostRow>> {
    const { items, total } = await this.posts.adminPage(opts);
    return {
      items: items.map((p) => ({
        id: p.id,
        slug: p.slug,
        title: p.title,
        status: p.status,
        publishAt: p.publish_at?.toISOString() ?? null,
        publishedAt: p.published_at?.toISOString() ?? null,
        updatedAt: p.updated_at.toISOString(),
        membersOnly: p.members_only,
        tags: p.tags,
      })),
      total,
      page: opts.page,
      pageSize: opts.pageSize,
    };
  }

  /** One post of any state with its credited sponsors, in the shape the editor form loads; a 404 for an unknown id. */
  async adminGet(id: number): Promise<AdminPost> {
    const p = await this.posts.byId(id);
    if (!p) throw notFound('No such post.');
    const credits = (await this.posts.creditsOf([id])).get(id) ?? [];
    return {
      id,
      slug: p.slug,
      title: p.title,
      summary: p.summary,
      coverUrl: p.cover_url,
      markdown: p.markdown,
      tags: p.tags,
      status: p.status,
      publishAt: p.publish_at?.toISOString() ?? null,
      publishedAt: p.published_at?.toISOString() ?? null,
      membersOnly: p.members_only,
      hazardNotice: this.hazardOf(p),
      hazardRequired: needsHazardNotice(p),
      credits,
      author: p.author_name ?? null,
    };
  }

  /** Latest published posts for the feeds; members-only bodies never go into a feed. */
  async feedItems(limit: number) {
    const rows = await this.posts.latestPublished(limit);
    const credits = await this.posts.creditsOf(rows.map((p) => p.id));
    return rows.map((p) => ({
      slug: p.slug,
      title: p.title,
      summary: p.summary,
      author: p.author_name ?? null,
      publishedAt: p.published_at!,
      tags: p.tags,
      membersOnly: p.members_only,
      hazardNotice: this.hazardOf(p),
      html: p.members_only ? null : this.render(p, credits.get(p.id) ?? []),
    }));
  }

  private render(p: PostRow, credits: { name: string; slug: string }[]): string {
    return renderMarkdown(p.markdown, { sponsorNames: new Map(credits.map((c) => [c.slug, c.name])) });
  }

  private hazardOf(p: Pick<PostRow, 'hazard_requested' | 'title' | 'summary' | 'markdown' | 'tags'>): boolean {
    return p.hazard_requested || needsHazardNotice(p);
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
    for (const [sponsorId, deliverableId] of chosen) {
      if ((await this.sponsors.deliverables(sponsorId, trx)).some((d) => d.id === deliverableId)) continue;
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

/** An uploaded cover's sizes and thumbnail, for the page's srcset and reserved space; null for none or another host. */
function coverOf(
  covers: Map<string, StoredImage>,
  url: string | null,
): { url: string; thumbnailUrl: string; width: number; height: number } | null {
  const c = url ? covers.get(url) : undefined;
  return c ? { url: c.url, thumbnailUrl: c.thumbnailUrl, width: c.width, height: c.height } : null;
}
