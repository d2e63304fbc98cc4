import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { withBaseline, type BenchResult } from './bench-result';

/**
 * Gzip bytes of the JavaScript the index page loads before any lazy route: the entry script, its module preloads and
 * every chunk they import statically, transitively (the build lists at most ten preloads; the browser fetches the
 * rest as soon as it reads the imports). Dynamic `import()` chunks are lazy and not counted.
 */
export function initialJsGzipBytes(browserDir: string): number {
  // A build with server rendering names its client-rendered page index.csr.html (the server writes the others).
  const index = ['index.csr.html', 'index.html'].map((f) => path.join(browserDir, f)).find((f) => existsSync(f))!;
  const html = readFileSync(index, 'utf8');
  const pending: string[] = [];
  for (const m of html.matchAll(/<script[^>]+src="([^"]+\.js)"/g)) pending.push(m[1]);
  for (const m of html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+\.js)"/g)) pending.push(m[1]);
  const files = new Set<string>();
  let total = 0;
  for (let f = pending.pop(); f !== undefined; f = pending.pop()) {
    if (files.has(f)) continue;
    files.add(f);
    const code = readFileSync(path.join(browserDir, f));
    total += gzipSync(code, { level: 9 }).length;
    // `import{a}from"./chunk-X.js"` and `import"./chunk-X.js"`; `import("./chunk-X.js")` has a parenthesis.
    for (const m of code.toString('utf8').matchAll(/(?:\bfrom|\bimport)\s*["']\.\/([^"']+\.js)["']/g))
      pending.push(m[1]);
  }
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
