import type { Knex } from 'knex';
import type { SitemapEntry } from './sitemap';

/** The public pages with a record behind them and when each last changed; reads only, for the sitemap. */
export class SitemapRepository {
  constructor(private readonly db: Knex) {}

  /**
   * Products on sale. What a product page shows changes with the product and with its latest run, whose state turns
   * when its window opens or closes, so those instants count once they are past.
   */
  async products(now: Date): Promise<SitemapEntry[]> {
    const rows: { slug: string; changed: Date }[] = await this.db('shop_products as p')
      .leftJoin('shop_runs as r', 'r.product_id', 'p.id')
      .where('p.active', true)
      .groupBy('p.id')
      .orderBy([{ column: 'p.position' }, { column: 'p.id' }])
      .select(
        'p.slug',
        this.db.raw(
          'GREATEST(p.updated_at, MAX(r.created_at), MAX(CASE WHEN r.opens_at <= ? THEN r.opens_at END), MAX(CASE WHEN r.closes_at <= ? THEN r.closes_at END)) AS changed',
          [now, now],
        ),
      );
    return rows.map((r) => ({ path: `/shop/p/${r.slug}`, lastModified: new Date(r.changed) }));
  }

  /** Published build logs (members-only ones too: their page shows the summary to everyone). */
  async posts(): Promise<SitemapEntry[]> {
    const rows: { slug: string; published_at: Date; updated_at: Date }[] = await this.db('posts')
      .where('status', 'published')
      .orderBy('published_at', 'desc')
      .select('slug', 'published_at', 'updated_at');
    return rows.map((r) => ({
      path: `/build-logs/${r.slug}`,
      lastModified: new Date(Math.max(r.published_at.getTime(), r.updated_at.getTime())),
    }));
  }

  /** Every launch day on the public calendar. */
  async launches(): Promise<SitemapEntry[]> {
    const rows: { id: number; updated_at: Date }[] = await this.db('launches')
      .orderBy('launch_date', 'desc')
      .select('id', 'updated_at');
    return rows.map((r) => ({ path: `/launches/${r.id}`, lastModified: r.updated_at }));
  }
}
