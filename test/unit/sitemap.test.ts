import { robotsTxt, sitemapXml } from '../../server/seo/sitemap';
import { loopbackOrigin } from '../../server/ssr/page-routes';
import type { Socket } from 'node:net';

describe('sitemapXml', () => {
  it('writes the sitemaps.org 0.9 urlset with absolute, entity-escaped addresses and W3C Datetime lastmod', () => {
    const xml = sitemapXml('https://padside.example', [
      { path: '/', lastModified: null },
      { path: "/build-logs/fins-&-tips'", lastModified: new Date('2027-03-04T05:06:07Z') },
    ]);
    // sitemaps.org protocol 0.9: XML declaration, urlset namespace, loc escaped per its "Entity escaping" table.
    expect(xml).toBe(
      [
        '<?xml version="1.0" encoding="UTF-8"?>',
        '<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">',
        '  <url><loc>https://padside.example/</loc></url>',
        '  <url><loc>https://padside.example/build-logs/fins-&amp;-tips&apos;</loc><lastmod>2027-03-04T05:06:07.000Z</lastmod></url>',
        '</urlset>',
        '',
      ].join('\n'),
    );
  });
});

describe('robotsTxt', () => {
  it('keeps every crawler out of the private paths and names the sitemap (RFC 9309)', () => {
    const text = robotsTxt('https://padside.example');
    expect(text.startsWith('User-agent: *\n')).toBe(true);
    for (const p of ['/api/', '/console', '/account', '/shop/checkout', '/sponsors/portal'])
      expect(text).toContain(`Disallow: ${p}\n`);
    expect(text).toContain('Sitemap: https://padside.example/sitemap.xml\n');
  });
});

describe('loopbackOrigin', () => {
  const socket = (localAddress: string, localPort: number) => ({ localAddress, localPort }) as Socket;
  it('is the address and port that accepted the request, IPv4-mapped addresses as plain IPv4, IPv6 in brackets', () => {
    expect(loopbackOrigin(socket('127.0.0.1', 4000))).toBe('http://127.0.0.1:4000');
    expect(loopbackOrigin(socket('::ffff:127.0.0.1', 4000))).toBe('http://127.0.0.1:4000');
    expect(loopbackOrigin(socket('::1', 4001))).toBe('http://[::1]:4001');
  });
});
