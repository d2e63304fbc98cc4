import { Router } from 'express';
import { robotsTxt } from './sitemap';
import type { SitemapService } from './sitemap-service';

/** GET /sitemap.xml: the section pages and every public product, build log and launch day. */
export function sitemapRoutes(pages: SitemapService): Router {
  const r = Router();
  r.get('/', async function sitemap(_req, res) {
    const xml = await pages.xml();
    res.type('application/xml').setHeader('Cache-Control', 'public, max-age=3600');
    res.send(xml);
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
