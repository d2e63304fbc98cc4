import type { Feature, Platform } from '../feature';
import { robotsRoutes, sitemapRoutes } from './seo-routes';
import { SitemapRepository } from './sitemap-repository';
import { SitemapService } from './sitemap-service';

/** Findability: the sitemap and robots.txt at the site's root (the pages' own tags come from the server render). */
export function seoFeature(platform: Platform): Feature {
  const { db, clock, config } = platform.deps;
  return {
    name: 'seo',
    mount() {},
    mountSite(site) {
      site('/sitemap.xml', sitemapRoutes(new SitemapService(new SitemapRepository(db), config.publicUrl, clock)));
      site('/robots.txt', robotsRoutes(config.publicUrl));
    },
  };
}
