import { spawnSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import type { PadsideApp } from '../server/app';
import { withBaseline, type BenchResult } from './bench-result';
import { BenchClient } from './bench-client';

const BUYERS = 500;
const CAP = 200;

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

/** 500 buyers at once on a 200-unit run, against pgbench's single-row update rate on the same PostgreSQL. */
export async function dropBench(app: PadsideApp, adminEmail: string, adminPassword: string): Promise<BenchResult[]> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  try {
    const admin = new BenchClient(base);
    await admin.post('/api/auth/login', { email: adminEmail, password: adminPassword });
    const now = Date.now();
    const created = await admin.post('/api/admin/products', {
      name: `Drop bench shirt ${now}`,
      description: 'Benchmark run.',
      priceCents: 3000,
      weightGrams: 200,
      variants: [{ label: 'M' }, { label: 'L' }],
      run: { cap: CAP, opensAt: new Date(now - 60_000).toISOString(), closesAt: new Date(now + 3600_000).toISOString() },
    });
    if (created.status !== 201) throw new Error(`could not create the bench product: ${created.status} ${JSON.stringify(created.body)}`);
    const product = (created.body as { product?: { slug: string } }).product ?? (created.body as { slug: string });
    const detail = (await admin.get(`/api/products/${product.slug}`)).body as { variants: { id: number }[]; run: { id: number } };
    const methods = (await admin.get('/api/shipping-methods')).body as { items: { id: number; code: string }[] };
    const pickup = methods.items.find((m) => m.code === 'pickup')!;

    const buyers = await Promise.all(Array.from({ length: BUYERS }, async () => {
      const c = new BenchClient(base);
      await c.token();
      return c;
    }));
    const started = Date.now();
    const outcomes = await Promise.all(
      buyers.map(async (c, i) => {
        const t0 = performance.now();
        const res = await c.post('/api/orders', {
          items: [{ variantId: detail.variants[i % detail.variants.length].id, quantity: 1 }],
          shipTo: { name: `Buyer ${i}`, line1: '1 Pad Road', city: 'Gopher Flats', province: 'MB', postalCode: 'R0A 0A0', country: 'CA' },
          shippingMethodId: pickup.id,
          email: `drop-${now}-${i}@example.test`,
          paymentToken: 'tok_visa',
        });
        return { status: res.status, ms: performance.now() - t0 };
      }),
    );
    const seconds = (Date.now() - started) / 1000;
    const paid = outcomes.filter((o) => o.status === 201);
    const soldOut = outcomes.filter((o) => o.status === 409).length;
    const other = outcomes.length - paid.length - soldOut;
    const latencies = outcomes.map((o) => o.ms).sort((a, b) => a - b);
    const after = (await admin.get(`/api/products/${product.slug}`)).body as { run: { cap: number; remaining: number } };
    const sold = after.run.cap - after.run.remaining;

    const tps = pgbenchUpdateTps();
    const rate = Number((paid.length / seconds).toFixed(1));
    return [
      withBaseline({ name: `drop: ${BUYERS} buyers on a ${CAP}-unit run`, value: rate, unit: 'checkouts/s', notes: `units sold ${sold} of ${CAP}; paid ${paid.length}, sold out ${soldOut}, other ${other}; p50 ${percentile(latencies, 50).toFixed(0)} ms, p95 ${percentile(latencies, 95).toFixed(0)} ms, p99 ${percentile(latencies, 99).toFixed(0)} ms` }, 'pgbench single-row UPDATE', tps),
      { name: 'drop: units sold (must equal the cap)', value: sold, unit: 'units', notes: sold === CAP ? 'equals the cap' : `DOES NOT equal the cap ${CAP}` },
    ];
  } finally {
    server.close();
  }
}

/** pgbench with a one-row UPDATE script, 20 clients for 10 s, on the bench database. */
function pgbenchUpdateTps(): number {
  const url = new URL(process.env.DATABASE_URL ?? '');
  const dir = process.env.TEST_TMP ?? '/tmp';
  const script = path.join(dir, 'pgbench-update.sql');
  writeFileSync(script, 'UPDATE bench_counter SET n = n + 1 WHERE id = 1;\n');
  const psql = spawnSync(path.join(process.env.PG_BIN ?? '', 'psql'), ['-h', url.hostname, '-p', url.port, '-U', url.username, '-d', url.pathname.slice(1), '-c', 'CREATE TABLE IF NOT EXISTS bench_counter (id int primary key, n bigint); INSERT INTO bench_counter VALUES (1, 0) ON CONFLICT DO NOTHING;'], { encoding: 'utf8' });
  if (psql.status !== 0) throw new Error(psql.stderr);
  const r = spawnSync(path.join(process.env.PG_BIN ?? '', 'pgbench'), ['-n', '-h', url.hostname, '-p', url.port, '-U', url.username, '-c', '20', '-j', '2', '-T', '10', '-f', script, url.pathname.slice(1)], { encoding: 'utf8' });
  const m = /tps = ([\d.]+)/.exec(r.stdout);
  if (!m) throw new Error(`pgbench failed: ${r.stderr}`);
  return Number(Number(m[1]).toFixed(1));
}
