import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { withBaseline, type BenchResult } from './bench-result';

/** Gzip bytes of the JavaScript the index page loads before any lazy route (entry script and its module preloads). */
export function initialJsGzipBytes(browserDir: string): number {
  // A build with server rendering names its client-rendered page index.csr.html (the server writes the others).
  const index = ['index.csr.html', 'index.html'].map((f) => path.join(browserDir, f)).find((f) => existsSync(f))!;
  const html = readFileSync(index, 'utf8');
  const files = new Set<string>();
  for (const m of html.matchAll(/<script[^>]+src="([^"]+\.js)"/g)) files.add(m[1]);
  for (const m of html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+\.js)"/g)) files.add(m[1]);
  let total = 0;
  for (const f of files) total += gzipSync(readFileSync(path.join(browserDir, f)), { level: 9 }).length;
  return total;
}

export function frontEndBench(appDist: string, emptyDist: string): BenchResult {
  const ours = initialJsGzipBytes(path.join(appDist, 'browser'));
  const empty = initialJsGzipBytes(path.join(emptyDist, 'browser'));
  return withBaseline(
    { name: 'front end: initial JS transfer (gzip)', value: ours, unit: 'bytes' },
    'empty Angular 21 app',
    empty,
  );
}
