import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import express from 'express';
import type { PadsideApp } from '../server/app';
import { withBaseline, type BenchResult } from './bench-result';

async function requestsPerSecond(url: string): Promise<number> {
  const result = await autocannon({ url, connections: 20, duration: 8, pipelining: 1 });
  return Math.round(result.requests.average);
}

async function listen(app: express.Express): Promise<{ url: string; close(): void }> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  return { url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, close: () => server.close() };
}

/** GET /api/products against a bare Express JSON handler returning a body of the same size, same run. */
export async function catalogueBench(app: PadsideApp): Promise<BenchResult> {
  const padside = await listen(app);
  const sample = await (await fetch(`${padside.url}/api/products`)).text();
  const bare = express();
  bare.get('/api/products', (_req, res) => res.type('json').send(sample));
  const baseline = await listen(bare);
  try {
    const base = await requestsPerSecond(`${baseline.url}/api/products`);
    const ours = await requestsPerSecond(`${padside.url}/api/products`);
    return withBaseline({ name: 'catalogue GET /api/products', value: ours, unit: 'req/s', notes: `${sample.length} bytes per response, 20 connections, 8 s` }, 'bare Express JSON handler', base);
  } finally {
    padside.close();
    baseline.close();
  }
}
