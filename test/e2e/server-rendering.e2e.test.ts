import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { serve } from '../helpers/browser';
import { jsonLdOf, linkHref, metaContent, schemaOrgProblems } from '../helpers/schema-org';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { createUser, signedIn, type Client } from '../helpers/users';
import { createLaunch } from '../api/launch-fixtures';
import { CatalogueService } from '../../server/shop/catalogue-service';

/**
 * The public pages as a client without JavaScript gets them (a link preview, a crawler, a phone on a slow line): the
 * server-rendered HTML itself, fetched with plain HTTP.
 */
let t: TestApp;
let site: { baseUrl: string; stop(): Promise<void> };
let staff: Client;
const tag = randomUUID().slice(0, 6);
let product: { slug: string; name: string };
let post: { slug: string; title: string };
let membersPost: { slug: string; secret: string };
let launchId: number;
let coverUrl: string;
let upload: { url: string; width: number; height: number };

/** A page fetched as a client without JavaScript, optionally with a cookie. */
async function page(path: string, cookie?: string): Promise<{ status: number; html: string; headers: Headers }> {
  const res = await fetch(site.baseUrl + path, { headers: cookie ? { cookie } : {}, redirect: 'manual' });
  return { status: res.status, html: await res.text(), headers: res.headers };
}

beforeAll(async () => {
  t = buildTestApp();
  site = await serve(t);
  staff = (await signedIn(t.app, t.deps.db, ['fan', 'editor', 'treasurer', 'range_officer'])).client;
  const png = await sharp({ create: { width: 900, height: 600, channels: 3, background: '#3b6e8f' } })
    .png()
    .toBuffer();
  const uploaded = await staff.agent
    .post('/api/admin/uploads')
    .set('X-CSRF-Token', await staff.token())
    .attach('file', png, { filename: 'tee.png', contentType: 'image/png' });
  expect(uploaded.status).toBe(201);
  upload = uploaded.body;
  const image = {
    url: upload.url,
    thumbnailUrl: uploaded.body.thumbnailUrl,
    alt: 'The tee laid flat',
    width: upload.width,
    height: upload.height,
  };
  const made = await staff.post('/api/admin/products', {
    name: `Coulee Tee ${tag}`,
    description: 'Heavy cotton tee with the **pad** mark on the back.',
    priceCents: 3200,
    weightGrams: 210,
    images: [image],
    variants: [{ label: 'One size', sku: `CT-${tag}` }],
    sizeChart: { columns: ['Size', 'Chest (cm)'], rows: [['One size', '104']] },
    run: {
      cap: 40,
      opensAt: new Date(Date.now() - 86400_000).toISOString(),
      closesAt: new Date(Date.now() + 5 * 86400_000).toISOString(),
      unitCostCents: 900,
    },
  });
  expect(made.status).toBe(201);
  product = { slug: made.body.product.slug, name: `Coulee Tee ${tag}` };
  coverUrl = image.url;
  const written = await staff.post('/api/admin/posts', {
    title: `Nose cone sanding ${tag}`,
    summary: 'How we smooth printed cones.',
    coverUrl,
    markdown: 'Wet sanding at 400 grit takes the layer lines off.\n\nThen a coat of filler primer.',
    status: 'published',
  });
  expect(written.status).toBe(201);
  post = { slug: written.body.post?.slug ?? written.body.slug, title: `Nose cone sanding ${tag}` };
  const secret = `Members-only body ${randomUUID()}`;
  const hidden = await staff.post('/api/admin/posts', {
    title: `Altimeter bay wiring ${tag}`,
    summary: 'The wiring of the bay.',
    markdown: secret,
    status: 'published',
    membersOnly: true,
  });
  expect(hidden.status).toBe(201);
  membersPost = { slug: hidden.body.post?.slug ?? hidden.body.slug, secret };
  launchId = await createLaunch(staff, '2031-06-14', { title: `Summer shoot ${tag}` });
});
afterAll(async () => {
  await site?.stop();
  await t?.close();
});

describe('the home page without JavaScript', () => {
  it('holds a place for the sign-up form, which the browser makes, and none of the form fields’ styles', async () => {
    const { status, html } = await page('/');
    expect(status).toBe(200);
    expect(html).toContain('data-testid="sign-up-slot"');
    // Inlined for the server's form, the text field's and checkbox's styles were most of the page's bytes.
    expect(html).not.toContain('.mdc-text-field');
    expect(html).not.toContain('.mdc-checkbox');
  });
});

describe('a product page without JavaScript', () => {
  it('holds the name, price and availability, its preview tags and its Product JSON-LD', async () => {
    const { status, html, headers } = await page(`/shop/p/${product.slug}`);
    expect(status).toBe(200);
    expect(headers.get('content-type')).toMatch(/^text\/html/);
    expect(html).toMatch(new RegExp(`<h1[^>]*>${product.name}</h1>`));
    expect(html).toContain('$32.00');
    expect(html).toContain('Taking orders');
    expect(html).toContain('40 of 40 left');
    expect(html).toMatch(/<title>Coulee Tee [a-f0-9]{6} — Padside<\/title>/);
    expect(metaContent(html, 'description')).toBe('Heavy cotton tee with the pad mark on the back.');
    expect(linkHref(html, 'canonical')).toBe(`${t.config.publicUrl}/shop/p/${product.slug}`);
    expect(metaContent(html, 'og:title')).toBe(product.name);
    expect(metaContent(html, 'og:type')).toBe('product');
    expect(metaContent(html, 'og:description')).toBe('Heavy cotton tee with the pad mark on the back.');
    expect(metaContent(html, 'twitter:card')).toBe('summary_large_image');
    expect(metaContent(html, 'twitter:title')).toBe(product.name);
    const ogImage = metaContent(html, 'og:image')!;
    expect(ogImage).toMatch(/^http:\/\/.+\/uploads\/[a-z0-9]+\.png$/);
    // A real image: the same path on this server answers with the picture's bytes.
    const picture = await fetch(site.baseUrl + new URL(ogImage).pathname);
    expect(picture.status).toBe(200);
    expect(picture.headers.get('content-type')).toBe('image/png');
    expect((await sharp(Buffer.from(await picture.arrayBuffer())).metadata()).width).toBe(900);
    expect(metaContent(html, 'og:image:width')).toBe('900');

    // The size chart is the browser's own disclosure, readable without script.
    expect(html).toMatch(/<details[^>]*class="size-chart"[^>]*><summary[^>]*>Size chart<\/summary>/);
    expect(html).toMatch(/<td[^>]*>One size<\/td>(<!--[^>]*-->)*<td[^>]*>104<\/td>/);

    const [data] = jsonLdOf(html);
    expect(schemaOrgProblems(data)).toEqual([]);
    expect(data).toMatchObject({
      '@type': 'Product',
      name: product.name,
      offers: { '@type': 'Offer', price: '32.00', priceCurrency: 'CAD', availability: 'https://schema.org/InStock' },
    });
  });

  it('preloads its largest image and gives every photo its size and a WebP copy in the srcset', async () => {
    const { html } = await page(`/shop/p/${product.slug}`);
    const preload = [...html.matchAll(/<link\b[^>]*rel="preload"[^>]*>/g)]
      .map((m) => m[0])
      .find((l) => l.includes('as="image"'));
    expect(preload).toMatch(/href="\/uploads\/[a-z0-9]+\.png"/);
    expect(preload).toMatch(/imagesrcset="\/uploads\/[a-z0-9]+-thumb\.webp 480w, \/uploads\/[a-z0-9]+\.png 900w"/);
    const main = /<img\b[^>]*fetchpriority="high"[^>]*>/.exec(html)?.[0];
    expect(main).toMatch(/width="900"/);
    expect(main).toMatch(/height="600"/);
    expect(main).toMatch(/srcset="\/uploads\/[a-z0-9]+-thumb\.webp 480w/);
  });

  it('answers 404 with the not-found words for a product that does not exist', async () => {
    const { status, html } = await page('/shop/p/no-such-item-here');
    expect(status).toBe(404);
    expect(html).toContain('Item not found');
  });

  it('answers 503 with a way to try again, not the not-found words, when the shop cannot answer', async () => {
    const failing = jest
      .spyOn(CatalogueService.prototype, 'storefrontProduct')
      .mockRejectedValueOnce(new Error('database went away'));
    try {
      const { status, html } = await page(`/shop/p/${product.slug}`);
      expect(failing).toHaveBeenCalledWith(product.slug);
      expect(status).toBe(503);
      expect(html).toContain('This item could not be loaded');
      expect(html).toMatch(/<button\b[^>]*type="button"[^>]*>(?:(?!<\/button>)[\s\S])*>Try again<\/span>/);
      expect(html).not.toContain('Item not found');
    } finally {
      failing.mockRestore();
    }
    // The next visitor gets the product again.
    expect((await page(`/shop/p/${product.slug}`)).status).toBe(200);
  });
});

describe('a build log without JavaScript', () => {
  it('holds its title and first paragraph, its preview tags, BlogPosting JSON-LD and the preloaded cover', async () => {
    const { status, html } = await page(`/build-logs/${post.slug}`);
    expect(status).toBe(200);
    expect(html).toMatch(new RegExp(`<h1[^>]*>${post.title}</h1>`));
    expect(html).toContain('<p>Wet sanding at 400 grit takes the layer lines off.</p>');
    expect(metaContent(html, 'og:type')).toBe('article');
    expect(metaContent(html, 'og:description')).toBe('How we smooth printed cones.');
    expect(metaContent(html, 'og:image')).toBe(t.config.publicUrl + coverUrl);
    const preload = [...html.matchAll(/<link\b[^>]*rel="preload"[^>]*>/g)]
      .map((m) => m[0])
      .find((l) => l.includes('as="image"'));
    expect(preload).toContain(`href="${coverUrl}"`);
    const cover = /<img\b[^>]*class="cover"[^>]*>/.exec(html)?.[0];
    expect(cover).toMatch(/width="900"/);
    expect(cover).toMatch(/srcset="\/uploads\/[a-z0-9]+-thumb\.webp 480w/);
    const [data] = jsonLdOf(html);
    expect(schemaOrgProblems(data)).toEqual([]);
    expect(data).toMatchObject({
      '@type': 'BlogPosting',
      headline: post.title,
      image: [t.config.publicUrl + coverUrl],
    });
  });

  it('without a cover, a members-only post shows its summary and is shared with the site picture, a real image', async () => {
    const { status, html } = await page(`/build-logs/${membersPost.slug}`);
    expect(status).toBe(200);
    expect(html).toContain('The wiring of the bay.');
    expect(html).not.toContain(membersPost.secret);
    const ogImage = metaContent(html, 'og:image')!;
    expect(ogImage).toBe(`${t.config.publicUrl}/share-card.png`);
    const picture = await fetch(site.baseUrl + '/share-card.png');
    expect(picture.headers.get('content-type')).toBe('image/png');
    expect((await sharp(Buffer.from(await picture.arrayBuffer())).metadata()).width).toBe(1200);
    const [data] = jsonLdOf(html);
    expect(schemaOrgProblems(data)).toEqual([]);
    expect(data).toMatchObject({ '@type': 'BlogPosting', isAccessibleForFree: false, image: [ogImage] });
  });

  it('answers 404 for a build log that does not exist, and for an address that leads nowhere', async () => {
    const missingPost = await page('/build-logs/no-such-post-here');
    expect(missingPost.status).toBe(404);
    expect(missingPost.html).toContain('Build log not found');
    const nowhere = await page('/no/such/page');
    expect(nowhere.status).toBe(404);
    expect(nowhere.html).toContain('Off the pad');
  });
});

describe('a detail page address that can never exist', () => {
  it.each([
    '/launches/abc',
    '/launches/0',
    '/launches/-3',
    '/launches/1.5',
    '/launches/99999999999',
    '/shop/p/Coulee-Tee',
    '/shop/p/tee%20shirt!',
    '/shop/p/' + 'x'.repeat(81),
    '/build-logs/%E2%9C%93-cone',
    '/build-logs/-sanding',
    '/build-logs/' + 'y'.repeat(121),
  ])("%s answers 404 with the not-found page, not the API's refusal", async (path) => {
    const { status, html } = await page(path);
    expect(status).toBe(404);
    expect(html).toContain('Off the pad');
    expect(html).not.toMatch(/could not be (found|loaded)|Item not found|Build log not found/);
  });
});

describe('every page the app routes to', () => {
  it('renders the privacy page on the server, and leaves the mailed-link pages to the browser instead of a 404', async () => {
    const privacy = await page('/privacy');
    expect(privacy.status).toBe(200);
    expect(privacy.html).toMatch(/<h1[^>]*>[^<]*[Pp]rivacy/);
    for (const path of ['/subscriptions/confirm?token=abc', '/subscriptions/unsubscribe?token=abc']) {
      const { status, html } = await page(path);
      expect(status).toBe(200);
      expect(html).not.toContain('Off the pad');
    }
  });
});

describe('a launch day without JavaScript', () => {
  it('holds its title and Event JSON-LD with the start in the club time zone', async () => {
    const { status, html } = await page(`/launches/${launchId}`);
    expect(status).toBe(200);
    expect(html).toContain(`Summer shoot ${tag}`);
    const [data] = jsonLdOf(html);
    expect(schemaOrgProblems(data)).toEqual([]);
    // Gopher Flats keeps Central time: 10:00 on 14 June 2031 is daylight time, UTC-5 (IANA America/Winnipeg, from memory).
    expect(data).toMatchObject({
      '@type': 'Event',
      name: `Summer shoot ${tag}`,
      startDate: '2031-06-14T10:00:00-05:00',
      eventStatus: 'https://schema.org/EventScheduled',
      location: { '@type': 'Place', name: 'Coulee Field' },
    });
  });
});

describe('the sponsors page without JavaScript', () => {
  // The sponsors page is shared by suites running at the same time: only a logo that loads is added here (the box for
  // a logo without a stored size is checked in sponsor-wall.spec.ts).
  it('gives every logo a width and height, the stored size of the uploaded image', async () => {
    // The wall lists sponsors with an agreement this season (the year, in the club's time zone).
    const season = new Intl.DateTimeFormat('en-CA', { timeZone: t.config.clubTimeZone }).format(new Date()).slice(0, 4);
    const stored = await staff.post('/api/admin/sponsors', { name: `Prairie Resin Works ${tag}`, logoUrl: upload.url });
    expect(stored.status).toBe(201);
    const agreed = await staff.post(`/api/admin/sponsors/${stored.body.id}/agreements`, {
      season,
      cashCents: 25_000,
      deliverables: [{ kind: 'sponsors_page', quantity: 1, dueOn: `${season}-12-31` }],
    });
    expect(agreed.status).toBe(201);
    const { status, html } = await page('/sponsors');
    expect(status).toBe(200);
    const logos = [...html.matchAll(/<img\b[^>]*class="logo"[^>]*>/g)].map((m) => m[0]);
    expect(logos.length).toBeGreaterThanOrEqual(1);
    for (const img of logos) {
      expect([img, /\swidth="[1-9][0-9]*"/.test(img)]).toEqual([img, true]);
      expect([img, /\sheight="[1-9][0-9]*"/.test(img)]).toEqual([img, true]);
    }
    const ours = logos.find((img) => img.includes(`alt="Prairie Resin Works ${tag} logo"`));
    expect(ours).toMatch(
      new RegExp(
        `width="${upload.width}"[^>]*height="${upload.height}"|height="${upload.height}"[^>]*width="${upload.width}"`,
      ),
    );
    expect(upload).toMatchObject({ width: 900, height: 600 });
  });
});

describe('GET /sitemap.xml and /robots.txt', () => {
  it('lists every public product, post and launch with its last change', async () => {
    const res = await fetch(site.baseUrl + '/sitemap.xml');
    expect(res.headers.get('content-type')).toMatch(/^application\/xml/);
    const xml = await res.text();
    expect(xml).toMatch(
      /^<\?xml version="1.0" encoding="UTF-8"\?>\n<urlset xmlns="http:\/\/www.sitemaps.org\/schemas\/sitemap\/0.9">/,
    );
    for (const path of [
      `/shop/p/${product.slug}`,
      `/build-logs/${post.slug}`,
      `/build-logs/${membersPost.slug}`,
      `/launches/${launchId}`,
    ]) {
      const entry = new RegExp(`<url><loc>${t.config.publicUrl}${path}</loc><lastmod>([^<]+)</lastmod></url>`).exec(
        xml,
      );
      expect(entry).not.toBeNull();
      // Made in this test run: the last change is within the last hour (sitemaps.org: W3C Datetime).
      expect(Date.now() - Date.parse(entry![1])).toBeLessThan(3600_000);
    }
    expect(xml).not.toContain('/console');
  });

  it('keeps crawlers out of the console, the account pages and the API', async () => {
    const text = await (await fetch(site.baseUrl + '/robots.txt')).text();
    for (const p of ['/console', '/account', '/api/', '/shop/checkout']) expect(text).toContain(`Disallow: ${p}\n`);
    expect(text).toContain(`Sitemap: ${t.config.publicUrl}/sitemap.xml`);
  });
});

describe('server-rendered HTML with a session cookie', () => {
  it('holds nothing of the signed-in person: it is the visitor page', async () => {
    const name = `Wren Quillfeather ${tag}`;
    const member = await createUser(t.deps.db, ['fan', 'member'], name);
    const login = await fetch(site.baseUrl + '/api/auth/csrf');
    const csrfCookie = login.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    const { csrfToken } = (await login.json()) as { csrfToken: string };
    const signIn = await fetch(site.baseUrl + '/api/auth/login', {
      method: 'POST',
      headers: { cookie: csrfCookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
      body: JSON.stringify({ email: member.email, password: member.password }),
    });
    expect(signIn.status).toBe(200);
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    expect(cookie).toContain('padside.sid=');
    // The cookie really is a member's session: the API gives it the members-only body.
    const own = await fetch(`${site.baseUrl}/api/posts/${membersPost.slug}`, { headers: { cookie } });
    expect(((await own.json()) as { html: string }).html).toContain(membersPost.secret);

    for (const path of [
      '/',
      '/shop',
      `/shop/p/${product.slug}`,
      `/build-logs/${membersPost.slug}`,
      '/build-logs',
      `/launches/${launchId}`,
      '/launches',
      '/sponsors',
    ]) {
      const { status, html, headers } = await page(path, cookie);
      expect([path, status]).toEqual([path, 200]);
      for (const secret of [name, member.email, membersPost.secret, csrfToken])
        expect([path, html.includes(secret)]).toEqual([path, false]);
      expect(html).toContain('Sign in');
      expect(headers.get('set-cookie')).toBeNull();
    }
  });
});

describe('the Content-Security-Policy of a server-rendered page', () => {
  it('allows inline script only with a nonce that is new for every response and on every script of the page', async () => {
    const first = await page(`/shop/p/${product.slug}`);
    const second = await page(`/shop/p/${product.slug}`);
    const nonceOf = (headers: Headers) =>
      /script-src ([^;]*)/.exec(headers.get('content-security-policy') ?? '')?.[1] ?? '';
    expect(nonceOf(first.headers)).not.toContain('unsafe-inline');
    const nonce = /'nonce-([A-Za-z0-9+/=]{22,})'/.exec(nonceOf(first.headers))?.[1];
    expect(nonce).toBeDefined();
    expect(nonceOf(second.headers)).not.toContain(nonce!);
    const scripts = [...first.html.matchAll(/<script\b[^>]*>/g)]
      .map((m) => m[0])
      .filter((s) => !s.includes('application/ld+json') && !s.includes('application/json'));
    // The event-replay contract (inline), its start-up call (inline) and the app's module.
    expect(scripts.length).toBeGreaterThanOrEqual(3);
    for (const s of scripts) expect(s).toContain(`nonce="${nonce}"`);
  });
});
