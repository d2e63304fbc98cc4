/** One address in the sitemap and when what it shows last changed. */
export interface SitemapEntry {
  path: string;
  lastModified: Date | null;
}

const XML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' };
const escapeXml = (text: string) => text.replace(/[&<>"']/g, (c) => XML_ESCAPES[c]);

/**
 * A sitemap in the sitemaps.org protocol 0.9: absolute `loc` (entity-escaped), `lastmod` in W3C Datetime. The protocol
 * allows 50,000 addresses per file; Padside's public pages stay far below that (common practice, no source).
 */
export function sitemapXml(origin: string, entries: SitemapEntry[]): string {
  const urls = entries.map((e) => {
    const lastmod = e.lastModified ? `<lastmod>${e.lastModified.toISOString()}</lastmod>` : '';
    return `  <url><loc>${escapeXml(new URL(e.path, origin).toString())}</loc>${lastmod}</url>`;
  });
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    '<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">',
    ...urls,
    '</urlset>',
    '',
  ].join('\n');
}

/** Paths crawlers are asked to keep out of: the console, personal pages, checkout and the API. */
export const PRIVATE_PATHS = [
  '/api/',
  '/console',
  '/account',
  '/shop/cart',
  '/shop/checkout',
  '/shop/orders',
  '/membership/card',
  '/sponsors/portal',
];

/** robots.txt (RFC 9309): every crawler kept out of the private paths, pointed at the sitemap. */
export function robotsTxt(origin: string): string {
  return [
    'User-agent: *',
    ...PRIVATE_PATHS.map((p) => `Disallow: ${p}`),
    'Allow: /',
    '',
    `Sitemap: ${new URL('/sitemap.xml', origin).toString()}`,
    '',
  ].join('\n');
}
