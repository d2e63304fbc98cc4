import type { Clock } from '../platform/clock';
import { sitemapXml } from './sitemap';
import type { SitemapRepository } from './sitemap-repository';

/** The section pages, listed without a date (what they show changes with everything else). */
const SECTIONS = ['/', '/shop', '/build-logs', '/launches', '/sponsors'];

/** The sitemap of the public pages, so search engines find every product, build log and launch day. */
export class SitemapService {
  constructor(
    private readonly pages: SitemapRepository,
    private readonly origin: string,
    private readonly clock: Clock,
  ) {}

  /** The sitemaps.org document: the section pages and every public product, build log and launch day. */
  async xml(): Promise<string> {
    const [products, posts, launches] = await Promise.all([
      this.pages.products(this.clock.now()),
      this.pages.posts(),
      this.pages.launches(),
    ]);
    return sitemapXml(this.origin, [
      ...SECTIONS.map((path) => ({ path, lastModified: null })),
      ...products,
      ...posts,
      ...launches,
    ]);
  }
}
