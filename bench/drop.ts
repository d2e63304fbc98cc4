import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { PadsideApp } from '../server/app';
import type { PaymentGateway } from '../server/payments/payment-gateway';
import { withBaseline, type BenchResult } from './bench-result';
import { BenchClient } from './bench-client';
import type { DropBuyersInput, DropBuyersOutput } from './drop-buyers';

const BUYERS = 500;
const CAP = 200;

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

/**
 * 500 buyers at once on a 200-unit run, against the payment fake alone taking the run's 200 charges at once: every
 * paid checkout needs one charge, so the fake's rate is the ceiling a checkout can reach on this machine. The buyers
 * run in a worker thread and the baseline's charges come from this process, as the server's do.
 */
export async function dropBench(
  app: PadsideApp,
  payments: PaymentGateway,
  adminEmail: string,
  adminPassword: string,
): Promise<BenchResult[]> {
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
      run: {
        cap: CAP,
        opensAt: new Date(now - 60_000).toISOString(),
        closesAt: new Date(now + 3600_000).toISOString(),
      },
    });
    if (created.status !== 201)
      throw new Error(`could not create the bench product: ${created.status} ${JSON.stringify(created.body)}`);
    const product = (created.body as { product?: { slug: string } }).product ?? (created.body as { slug: string });
    const detail = (await admin.get(`/api/products/${product.slug}`)).body as {
      variants: { id: number }[];
      run: { id: number };
    };
    const methods = (await admin.get('/api/shipping-methods')).body as { items: { id: number; code: string }[] };
    const pickup = methods.items.find((m) => m.code === 'pickup')!;

    const { outcomes, seconds } = await runBuyers({
      base,
      buyers: BUYERS,
      variantIds: detail.variants.map((v) => v.id),
      shippingMethodId: pickup.id,
      runId: now,
    });
    const paid = outcomes.filter((o) => o.status === 201);
    const soldOut = outcomes.filter((o) => o.status === 409).length;
    const others = new Map<number, number>();
    for (const o of outcomes)
      if (o.status !== 201 && o.status !== 409) others.set(o.status, (others.get(o.status) ?? 0) + 1);
    const other = [...others].map(([status, n]) => `${n} × ${status}`).join(', ') || '0';
    const latencies = outcomes.map((o) => o.ms).sort((a, b) => a - b);
    const after = (await admin.get(`/api/products/${product.slug}`)).body as {
      run: { cap: number; remaining: number };
    };
    const sold = after.run.cap - after.run.remaining;

    const fake = await chargesPerSecond(payments, CAP);
    const rate = Number((paid.length / seconds).toFixed(1));
    return [
      withBaseline(
        {
          name: `drop: ${BUYERS} buyers on a ${CAP}-unit run`,
          value: rate,
          unit: 'checkouts/s',
          notes: `units sold ${sold} of ${CAP}; paid ${paid.length}, sold out ${soldOut}, other ${other}; p50 ${percentile(latencies, 50).toFixed(0)} ms, p95 ${percentile(latencies, 95).toFixed(0)} ms, p99 ${percentile(latencies, 99).toFixed(0)} ms`,
        },
        `payment fake alone, ${CAP} charges at once`,
        fake,
      ),
      {
        name: 'drop: units sold (must equal the cap)',
        value: sold,
        unit: 'units',
        notes: sold === CAP ? 'equals the cap' : `DOES NOT equal the cap ${CAP}`,
      },
    ];
  } finally {
    server.close();
  }
}

/** The buyers in a worker thread (entered through drop-buyers-worker.mjs, which loads tsx there), so the server has this process to itself. */
function runBuyers(input: DropBuyersInput): Promise<DropBuyersOutput> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(path.join(__dirname, 'drop-buyers-worker.mjs'), { workerData: input });
    worker.once('message', (out: DropBuyersOutput) => resolve(out));
    worker.once('error', reject);
    worker.once('exit', (code) => reject(new Error(`the drop's buyers stopped (exit ${code})`)));
  });
}

/** Charges per second the payment fake takes when `n` arrive at once, through the same SDK client as checkouts. */
async function chargesPerSecond(payments: PaymentGateway, n: number): Promise<number> {
  const run = `bench-${Date.now()}`;
  const started = performance.now();
  const results = await Promise.all(
    Array.from({ length: n }, (_, i) =>
      payments.charge({
        amountCents: 3150,
        token: 'tok_visa',
        description: `Bench charge ${i}`,
        idempotencyKey: `${run}-${i}`,
        metadata: { bench: run },
      }),
    ),
  );
  const seconds = (performance.now() - started) / 1000;
  const unpaid = results.filter((r) => r.outcome !== 'paid').length;
  if (unpaid) throw new Error(`the payment fake refused ${unpaid} of ${n} bench charges`);
  return Number((n / seconds).toFixed(1));
}
