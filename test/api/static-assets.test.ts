import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';

// A stand-in build folder with the build's own naming: content hashes of eight capitals and digits, and the
// client-rendered shell (index.csr.html). It has no server bundle, so every page address gets the shell.
const dist = mkdtempSync(path.join(tmpdir(), 'padside-dist-'));
const script = `console.log(${JSON.stringify('padside '.repeat(400))});\n`;
let t: TestApp;

beforeAll(() => {
  mkdirSync(path.join(dist, 'media'));
  writeFileSync(
    path.join(dist, 'index.csr.html'),
    `<!doctype html><html><body>${'<p>Padside</p>'.repeat(200)}</body></html>`,
  );
  writeFileSync(path.join(dist, 'main-K3QZ7A2B.js'), script);
  writeFileSync(path.join(dist, 'padside-mark.svg'), '<svg xmlns="http://www.w3.org/2000/svg"></svg>');
  writeFileSync(path.join(dist, 'media', 'montserrat-latin-400-normal-Q7WX2M4C.woff2'), Buffer.alloc(2048, 7));
  t = buildTestApp({ env: { BROWSER_DIST: dist } });
});
afterAll(async () => {
  await t.close();
  rmSync(dist, { recursive: true, force: true });
});

describe('the app files', () => {
  it('sends scripts compressed to a browser that accepts gzip, and whole to one that does not', async () => {
    const gz = await request(t.app).get('/main-K3QZ7A2B.js').set('Accept-Encoding', 'gzip');
    expect(gz.status).toBe(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toBe(script);
    const plain = await request(t.app).get('/main-K3QZ7A2B.js').set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(Number(plain.headers['content-length'])).toBe(Buffer.byteLength(script));
  });

  it('sends the page shell compressed for every client-side route', async () => {
    const res = await request(t.app).get('/shop/p/anything').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.text).toContain('<p>Padside</p>');
  });

  // RFC 9111 section 5.2.2.1 (max-age) and RFC 8246 (immutable): a name that changes with the content may be kept for a year.
  it.each([['/main-K3QZ7A2B.js'], ['/media/montserrat-latin-400-normal-Q7WX2M4C.woff2']])(
    'lets browsers keep %s for a year',
    async (file) => {
      const res = await request(t.app).get(file);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    },
  );

  it.each([['/padside-mark.svg'], ['/index.csr.html']])(
    'asks browsers to check %s again after an hour, its name being the same in every build',
    async (file) => {
      const res = await request(t.app).get(file);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('public, max-age=3600');
    },
  );

  // BREACH (CVE-2013-3587): a compressed answer that holds a secret beside text an attacker chose leaks the secret by its length.
  it('never compresses API answers, which carry the CSRF token', async () => {
    const res = await request(t.app).get('/api/auth/csrf').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.body.csrfToken).toEqual(expect.any(String));
    expect(res.headers['content-encoding']).toBeUndefined();
  });
});
