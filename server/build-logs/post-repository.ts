import type { Knex } from 'knex';
import type { AdminPost } from '../../contracts/build-logs/post-answers';
import type { PostStatus } from '../../contracts/labels/post-states';

export interface PostRow {
  id: number;
  slug: string;
  title: string;
  summary: string;
  cover_url: string | null;
  markdown: string;
  tags: string[];
  author_id: number | null;
  author_name?: string | null;
  status: PostStatus;
  publish_at: Date | null;
  published_at: Date | null;
  members_only: boolean;
  hazard_requested: boolean;
  created_at: Date;
  updated_at: Date;
}

/** The editable fields of a post as the editor form holds them, with instants as dates and the editor's hazard choice. */
export interface PostWrite extends Pick<
  AdminPost,
  'slug' | 'title' | 'summary' | 'coverUrl' | 'markdown' | 'tags' | 'status' | 'membersOnly'
> {
  publishAt: Date | null;
  publishedAt: Date | null;
  hazardRequested: boolean;
}

const columns = (p: PostWrite) => ({
  slug: p.slug,
  title: p.title,
  summary: p.summary,
  cover_url: p.coverUrl,
  markdown: p.markdown,
  tags: p.tags,
  status: p.status,
  publish_at: p.publishAt,
  published_at: p.publishedAt,
  members_only: p.membersOnly,
  hazard_requested: p.hazardRequested,
});

/** Plain reads and writes of posts and the sponsors each thanks (`posts`, `post_credits`); sponsor names are the sponsors feature's. */
export class PostRepository {
  constructor(private readonly db: Knex) {}

  private withAuthor(trx: Knex) {
    return trx<PostRow>('posts as p')
      .leftJoin('users as u', 'u.id', 'p.author_id')
      .select('p.*', 'u.display_name as author_name');
  }

  /** A post of any state with its author's display name. */
  byId(id: number, trx: Knex = this.db): Promise<PostRow | undefined> {
    return this.withAuthor(trx).where('p.id', id).first();
  }

  /** Locks the row for an update in the same transaction. */
  lockById(trx: Knex.Transaction, id: number): Promise<PostRow | undefined> {
    return trx<PostRow>('posts').where('id', id).forUpdate().first();
  }

  /** A post by its address, only once published, so drafts and scheduled posts stay unreachable from outside. */
  publishedBySlug(slug: string): Promise<PostRow | undefined> {
    return this.withAuthor(this.db).where({ 'p.slug': slug, 'p.status': 'published' }).first();
  }

  /** The addresses already taken by `base` and its numbered variants (`base-2`, ...), so a new one can pick the next free one. */
  async slugsLike(base: string, trx: Knex = this.db): Promise<Set<string>> {
    const rows = await trx('posts').where('slug', base).orWhereLike('slug', `${base}-%`).select('slug');
    return new Set(rows.map((r: { slug: string }) => r.slug));
  }

  /** Whether another post (other than `exceptId`) already uses this address. */
  async slugTaken(slug: string, exceptId: number | null, trx: Knex = this.db): Promise<boolean> {
    const row = await trx('posts')
      .where('slug', slug)
      .modify((q) => exceptId !== null && q.whereNot('id', exceptId))
      .first('id');
    return Boolean(row);
  }

  /** Inserts a post and returns its new id. */
  async insert(trx: Knex.Transaction, p: PostWrite, authorId: number | null): Promise<number> {
    const [row] = await trx('posts')
      .insert({ ...columns(p), author_id: authorId })
      .returning('id');
    return row.id;
  }

  /** Overwrites a post's editable fields and stamps the change time. */
  async update(trx: Knex.Transaction, id: number, p: PostWrite): Promise<void> {
    await trx('posts')
      .where('id', id)
      .update({ ...columns(p), updated_at: trx.fn.now() });
  }

  /** Replaces the post's sponsor credits with exactly `sponsorIds`. */
  async setCredits(trx: Knex.Transaction, postId: number, sponsorIds: readonly number[]): Promise<void> {
    await trx('post_credits').where('post_id', postId).delete();
    if (sponsorIds.length)
      await trx('post_credits').insert(sponsorIds.map((sponsor_id) => ({ post_id: postId, sponsor_id })));
  }

  /** The ids of the sponsors each of these posts credits, by post id (posts crediting none are left out). */
  async creditedSponsorIds(postIds: readonly number[], trx: Knex = this.db): Promise<Map<number, number[]>> {
    const out = new Map<number, number[]>();
    if (!postIds.length) return out;
    const rows: { post_id: number; sponsor_id: number }[] = await trx('post_credits')
      .whereIn('post_id', postIds)
      .select('post_id', 'sponsor_id');
    for (const r of rows) out.set(Number(r.post_id), [...(out.get(Number(r.post_id)) ?? []), Number(r.sponsor_id)]);
    return out;
  }

  /** Published posts with the sponsor each credits, newest first, for the sponsors page. */
  async publishedCredits(): Promise<{ sponsorId: number; slug: string; title: string }[]> {
    const rows: { sponsor_id: number; slug: string; title: string }[] = await this.db('post_credits as pc')
      .join('posts as p', 'p.id', 'pc.post_id')
      .where('p.status', 'published')
      .select('pc.sponsor_id', 'p.slug', 'p.title')
      .orderBy('p.published_at', 'desc');
    return rows.map((r) => ({ sponsorId: Number(r.sponsor_id), slug: r.slug, title: r.title }));
  }

  /** The address and title of each of these posts, whatever its state, by post id. */
  async titlesByIds(ids: readonly number[]): Promise<Map<number, { slug: string; title: string }>> {
    if (!ids.length) return new Map();
    const rows: { id: number; slug: string; title: string }[] = await this.db('posts')
      .whereIn('id', ids)
      .select('id', 'slug', 'title');
    return new Map(rows.map((r) => [Number(r.id), { slug: r.slug, title: r.title }]));
  }

  /** One page of published posts, newest first (id breaks ties so pages never overlap), with the total count. */
  async publishedPage(opts: {
    tag?: string;
    page: number;
    pageSize: number;
  }): Promise<{ items: PostRow[]; total: number }> {
    const base = this.db<PostRow>('posts')
      .where('status', 'published')
      .modify((q) => opts.tag && q.whereRaw('? = ANY(tags)', [opts.tag]));
    const [{ count }] = await base.clone().count<{ count: number }[]>({ count: '*' });
    const items = await base
      .clone()
      .orderBy([
        { column: 'published_at', order: 'desc' },
        { column: 'id', order: 'desc' },
      ])
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize);
    return { items, total: count };
  }

  /** Each tag used by a published post with its count, counted in SQL over the tags array. */
  async tagCounts(): Promise<{ tag: string; count: number }[]> {
    const rows = await this.db.raw(
      "SELECT t AS tag, count(*) AS count FROM posts, unnest(tags) t WHERE status = 'published' GROUP BY t ORDER BY count(*) DESC, t",
    );
    return rows.rows.map((r: { tag: string; count: string }) => ({ tag: r.tag, count: r.count }));
  }

  /** Every post for the editors' table, with sorting and paging done in SQL. */
  async adminPage(opts: {
    status?: PostStatus;
    q?: string;
    sort: 'updated' | 'title' | 'published';
    dir: 'asc' | 'desc';
    page: number;
    pageSize: number;
  }): Promise<{ items: PostRow[]; total: number }> {
    const base = this.db<PostRow>('posts').modify((q) => {
      if (opts.status) q.where('status', opts.status);
      if (opts.q) q.whereILike('title', `%${opts.q}%`);
    });
    const [{ count }] = await base.clone().count<{ count: number }[]>({ count: '*' });
    const column = { updated: 'updated_at', title: 'title', published: 'published_at' }[opts.sort];
    const items = await base
      .clone()
      .orderByRaw(`${column} ${opts.dir} NULLS LAST, id desc`)
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize);
    return { items, total: count };
  }

  /** Scheduled posts whose time has come, locked so two processes do not publish the same one. */
  dueScheduled(trx: Knex.Transaction, now: Date): Promise<PostRow[]> {
    return trx<PostRow>('posts')
      .where('status', 'scheduled')
      .where('publish_at', '<=', now)
      .forUpdate()
      .skipLocked()
      .orderBy('publish_at');
  }

  /** The newest published posts with their authors, for the feeds. */
  latestPublished(limit: number): Promise<PostRow[]> {
    return this.withAuthor(this.db).where('p.status', 'published').orderBy('p.published_at', 'desc').limit(limit);
  }

  /** Titles of posts whose cover or body shows one of `urls`. */
  async titlesUsingImage(urls: readonly string[]): Promise<string[]> {
    const rows = await this.db('posts')
      .where((q) => {
        q.whereIn('cover_url', urls);
        for (const url of urls) q.orWhere('markdown', 'like', `%${url}%`);
      })
      .orderBy('title')
      .pluck('title');
    return rows as string[];
  }
}
