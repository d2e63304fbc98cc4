import http from 'node:http';
import type { PadsideApp } from '../server/app';
import { withBaseline, type BenchResult } from './bench-result';
import { listen } from './catalogue';

const REQUESTS = 40;

/** Milliseconds from sending a GET to its answer's first byte (the status line and headers). */
function firstByteMs(url: string): Promise<{ ms: number; status: number; type: string; body: Promise<string> }> {
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    http
      .get(url, { headers: { accept: 'text/html,application/json' } }, (res) => {
        const ms = performance.now() - t0;
        const chunks: Buffer[] = [];
        const body = new Promise<string>((done) => {
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => done(Buffer.concat(chunks).toString('utf8')));
        });
        resolve({ ms, status: res.statusCode ?? 0, type: String(res.headers['content-type'] ?? ''), body });
      })
      .on('error', reject);
  });
}

/** Median time to first byte of `REQUESTS` requests one after another, after one to warm up. */
async function medianFirstByte(url: string): Promise<number> {
  await (
    await firstByteMs(url)
  ).body;
  const times: number[] = [];
  for (let i = 0; i < REQUESTS; i++) {
    const r = await firstByteMs(url);
    await r.body;
    times.push(r.ms);
  }
  return Number(times.sort((a, b) => a - b)[Math.floor(REQUESTS / 2)].toFixed(2));
}

/**
 * Time to first byte of the server-rendered product page against `GET /api/products`. Skipped, with the reason
 * printed, when the server does not render the product page's HTML itself (the page then comes from the browser).
 */
export async function productPageBench(app: PadsideApp): Promise<BenchResult | null> {
  const site = await listen(app);
  try {
    const { items } = (await (await fetch(`${site.url}/api/products`)).json()) as {
      items: { slug: string; name: string }[];
    };
    const product = items[0];
    if (!product) return skip('the catalogue is empty');
    const page = await firstByteMs(`${site.url}/shop/p/${product.slug}`);
    const html = await page.body;
    if (page.status !== 200 || !page.type.startsWith('text/html'))
      return skip(
        `/shop/p/${product.slug} answered ${page.status} ${page.type || 'without a type'} (no built app to serve?)`,
      );
    if (!html.includes(escapeHtml(product.name)))
      return skip(
        `/shop/p/${product.slug} is the browser app's empty page: it does not hold the product's name, so the server renders nothing`,
      );
    const ours = await medianFirstByte(`${site.url}/shop/p/${product.slug}`);
    const api = await medianFirstByte(`${site.url}/api/products`);
    return withBaseline(
      {
        name: 'product page, server-rendered: time to first byte',
        value: ours,
        unit: 'ms',
        notes: `/shop/p/${product.slug}, median of ${REQUESTS} one after another`,
      },
      'GET /api/products',
      api,
    );
  } finally {
    site.close();
  }
}

function skip(reason: string): null {
  console.log(`bench: product page time to first byte skipped: ${reason}.`);
  return null;
}

const escapeHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
