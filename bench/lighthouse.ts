import { execFile } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import * as chromeLauncher from 'chrome-launcher';
import express from 'express';
import type { Result } from 'lighthouse';
import type { PadsideApp } from '../server/app';
import { withBaseline, type BenchResult } from './bench-result';
import { BenchClient } from './bench-client';

const CATEGORIES = ['performance', 'accessibility', 'best-practices'] as const;
/** Lighthouse's advice for noisy scores is the median of several runs (five, from memory); three keeps this part near two minutes. */
const RUNS = 3;
/** Runs Lighthouse itself could not record, tried again before the page counts as failed. */
const MAX_RERUNS = 3;
const CHROME_FLAGS = ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-background-networking'];

type Scores = Record<(typeof CATEGORIES)[number], number>;
interface PageRun {
  lhr: Result;
  scores: Scores;
  /** Weighted audits that did not pass, for the reader of the bench log. */
  findings: string[];
  /** Audits Lighthouse could not run in this Chromium. */
  errored: string[];
}

async function listen(app: express.Express): Promise<{ url: string; close(): void }> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  return { url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, close: () => server.close() };
}

function summarise(lhr: Result): PageRun {
  if (lhr.runtimeError)
    throw new Error(`lighthouse could not audit ${lhr.finalDisplayedUrl}: ${lhr.runtimeError.message}`);
  const scores = Object.fromEntries(
    CATEGORIES.map((c) => [c, Math.round((lhr.categories[c]?.score ?? 0) * 100)]),
  ) as Scores;
  const findings = CATEGORIES.flatMap((c) =>
    lhr.categories[c].auditRefs
      .filter((ref) => ref.weight > 0 && lhr.audits[ref.id].score !== null && lhr.audits[ref.id].score! < 1)
      .map(
        (ref) =>
          `${c}: ${lhr.audits[ref.id].title}${lhr.audits[ref.id].displayValue ? ` (${lhr.audits[ref.id].displayValue})` : ''}`,
      ),
  );
  const errored = Object.values(lhr.audits)
    .filter((a) => a.scoreDisplayMode === 'error')
    .map((a) => a.id);
  return { lhr, scores, findings, errored };
}

/** The run with the median performance score, so its other scores and findings belong to one real run. */
async function medianRun(url: string, port: number): Promise<PageRun> {
  const runs: PageRun[] = [];
  for (let failures = 0; runs.length < RUNS;) {
    // Asynchronously, so this process keeps serving the pages being audited.
    const { stdout } = await promisify(execFile)(
      process.execPath,
      [path.join(__dirname, 'lighthouse-audit.mjs'), url, String(port), CATEGORIES.join(',')],
      { maxBuffer: 256 * 2 ** 20 },
    );
    const lhr = JSON.parse(stdout) as Result;
    // A lost trace (NO_NAVSTART and the like) is Lighthouse's own hiccup; its message says to run it again.
    if (lhr.runtimeError && ++failures <= MAX_RERUNS) {
      console.log(`lighthouse ${url}: ${lhr.runtimeError.code}, running it again`);
      continue;
    }
    runs.push(summarise(lhr));
  }
  return runs.sort((a, b) => a.scores.performance - b.scores.performance)[Math.floor(RUNS / 2)];
}

/**
 * Lighthouse scores for the home page, a product page and a build log page of the built app, served by the app
 * itself on loopback, against the empty Angular app's index page in the same Chromium.
 */
export async function lighthouseBench(app: PadsideApp, emptyDist: string, chromePath: string): Promise<BenchResult[]> {
  const padside = await listen(app);
  const emptyApp = express();
  emptyApp.use(express.static(path.join(emptyDist, 'browser')));
  const empty = await listen(emptyApp);
  const chrome = await chromeLauncher.launch({ chromePath, chromeFlags: CHROME_FLAGS });
  try {
    const client = new BenchClient(padside.url);
    const product = ((await client.get('/api/products')).body as { items: { slug: string }[] }).items[0];
    // A post everyone can read, so the page measured is the post and not the members-only notice.
    const post = (
      (await client.get('/api/posts')).body as { items: { slug: string; membersOnly: boolean }[] }
    ).items.find((p) => !p.membersOnly);
    if (!product || !post)
      throw new Error('lighthouse bench: the demo catalogue or build logs are missing (run prepare-db --demo-seed)');
    const pages = [
      { name: 'home page', path: '/' },
      { name: 'product page', path: `/shop/p/${product.slug}` },
      { name: 'build log page', path: `/build-logs/${post.slug}` },
    ];
    const baseline = await medianRun(`${empty.url}/`, chrome.port);
    // The whole reports, for whoever follows up a finding (open one in the Lighthouse viewer).
    const reports = path.join(os.tmpdir(), 'padside-lighthouse');
    mkdirSync(reports, { recursive: true });
    const results: BenchResult[] = [];
    for (const page of pages) {
      const run = await medianRun(`${padside.url}${page.path}`, chrome.port);
      const report = path.join(reports, `${page.name.replace(/ /g, '-')}.json`);
      writeFileSync(report, JSON.stringify(run.lhr));
      console.log(
        `lighthouse ${page.path}: ${JSON.stringify(run.scores)} (report: ${report})\n${run.findings.map((f) => `  - ${f}`).join('\n') || '  (every weighted audit passed)'}`,
      );
      if (run.errored.length) console.log(`  could not run: ${run.errored.join(', ')}`);
      results.push({
        ...withBaseline(
          {
            name: `Lighthouse, mobile: ${page.name} (performance)`,
            value: run.scores.performance,
            unit: '/ 100',
            notes: `accessibility ${run.scores.accessibility}, best practices ${run.scores['best-practices']}; ${page.path}, median of ${RUNS}`,
          },
          'empty Angular 21 app',
          baseline.scores.performance,
        ),
        scores: run.scores,
      });
    }
    return results;
  } finally {
    chrome.kill();
    padside.close();
    empty.close();
  }
}
