import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import express from 'express';
import type { PadsideApp } from '../server/app';
import { withBaseline, type BenchResult } from './bench-result';

/** Runs per side; the table shows the median, because the machine is shared and single runs wander. */
const RUNS = 3;

async function requestsPerSecond(url: string): Promise<number> {
  const result = await autocannon({ url, connections: 20, duration: 6, pipelining: 1 });
  if (result.non2xx || result.errors)
    throw new Error(`${url}: ${result.non2xx} non-2xx answers, ${result.errors} errors`);
  return Math.round(result.requests.average);
}

export async function listen(app: express.Express): Promise<{ url: string; close(): void }> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  return { url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, close: () => server.close() };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/**
 * GET /api/products against a bare Express JSON handler returning the same body, same run. The two take turns,
 * so a neighbour's load on the shared machine falls on both.
 */
export async function catalogueBench(app: PadsideApp): Promise<BenchResult> {
  const padside = await listen(app);
  const sample = await (await fetch(`${padside.url}/api/products`)).text();
  const bare = express();
  bare.get('/api/products', (_req, res) => res.type('json').send(sample));
  const baseline = await listen(bare);
  try {
    const base: number[] = [];
    const ours: number[] = [];
    for (let i = 0; i < RUNS; i++) {
      base.push(await requestsPerSecond(`${baseline.url}/api/products`));
      ours.push(await requestsPerSecond(`${padside.url}/api/products`));
    }
    return withBaseline(
      {
        name: 'catalogue GET /api/products',
        value: median(ours),
        unit: 'req/s',
        notes: `${sample.length} bytes per response, 20 connections, median of ${RUNS} runs of 6 s (Padside ${ours.join(', ')}; bare ${base.join(', ')})`,
      },
      'bare Express JSON handler, same body',
      median(base),
    );
  } finally {
    padside.close();
    baseline.close();
  }
}
