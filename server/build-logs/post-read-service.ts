import type {
  AdminPost,
  AdminPostRow,
  PostCredit,
  PostDetail,
  PostPage,
  PostSummary,
  TagCount,
} from '../../contracts/build-logs/post-answers';
import { renderMarkdown } from '../markdown/render-markdown';
import { notFound } from '../platform/app-error';
import type { Role } from '../platform/roles';
import type { SponsorRepository } from '../sponsors/sponsor-repository';
import type { StoredImage } from '../uploads/image-uploads';
import { needsHazardNotice } from './hazard-rule';
import type { PostRepository, PostRow } from './post-repository';

/** Roles that may read members-only bodies. */
const BODY_READERS: readonly Role[] = ['member', 'editor', 'admin'];

/** Reading posts: the public list and page, the editors' table and form, and the feeds; no HTTP here. */
export class PostReadService {
  constructor(
    private readonly posts: PostRepository,
    private readonly sponsors: SponsorRepository,
    /** Sizes and thumbnail of an uploaded cover, so the page can give it a srcset and reserve its space. */
    private readonly describeImages: (urls: readonly string[]) => Promise<Map<string, StoredImage>> = async () =>
      new Map(),
  ) {}

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
  tags(): Promise<TagCount[]> {
    return this.posts.tagCounts();
  }

  /** A published post; members-only bodies are withheld (html null) from callers without a reading role. */
  async publicPost(slug: string, roles: readonly Role[]): Promise<PostDetail> {
    const p = await this.posts.publishedBySlug(slug);
    if (!p) throw notFound('No build log at this address.');
    const credits = (await this.creditsOf([p.id])).get(p.id) ?? [];
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
    const credits = (await this.creditsOf([id])).get(id) ?? [];
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
    const credits = await this.creditsOf(rows.map((p) => p.id));
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

  /** The sponsors each of these posts credits, by name, by post id: one lookup of the posts' credits and one of the sponsors. */
  private async creditsOf(postIds: readonly number[]): Promise<Map<number, PostCredit[]>> {
    const ids = await this.posts.creditedSponsorIds(postIds);
    const sponsors = await this.sponsors.byIds([...new Set([...ids.values()].flat())]);
    return new Map(
      [...ids].map(([postId, sponsorIds]) => [
        postId,
        sponsors.filter((s) => sponsorIds.includes(s.id)).map((s) => ({ sponsorId: s.id, name: s.name, slug: s.slug })),
      ]),
    );
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
