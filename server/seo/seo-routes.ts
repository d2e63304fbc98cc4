import { Router } from 'express';
import type { Clock } from '../platform/clock';
import { robotsTxt, sitemapXml } from './sitemap';
import type { SitemapRepository } from './sitemap-repository';

/** The section pages, listed without a date (what they show changes with everything else). */
const SECTIONS = ['/', '/shop', '/build-logs', '/launches', '/sponsors'];

/** GET /sitemap.xml: the section pages and every public product, build log and launch day. */
export function sitemapRoutes(pages: SitemapRepository, origin: string, clock: Clock): Router {
  const r = Router();
  r.get('/', async function sitemap(_req, res) {
    const [products, posts, launches] = await Promise.all([
      pages.products(clock.now()),
      pages.posts(),
      pages.launches(),
    ]);
    res.type('application/xml').setHeader('Cache-Control', 'public, max-age=3600');
    res.send(
      sitemapXml(origin, [
        ...SECTIONS.map((path) => ({ path, lastModified: null })),
        ...products,
        ...posts,
        ...launches,
      ]),
    );
  });
  return r;
}

/** GET /robots.txt. */
export function robotsRoutes(origin: string): Router {
  const r = Router();
  r.get('/', function robots(_req, res) {
    res.type('text/plain').setHeader('Cache-Control', 'public, max-age=86400');
    res.send(robotsTxt(origin));
  });
  return r;
}
