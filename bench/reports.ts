import type { Knex } from 'knex';
import type { BenchClient } from './bench-client';
import { withBaseline, type BenchResult } from './bench-result';

const ORDERS = 100_000;

async function time(fn: () => Promise<unknown>): Promise<number> {
  await fn(); // warm up
  const runs: number[] = [];
  for (let i = 0; i < 5; i++) {
    const t0 = performance.now();
    await fn();
    runs.push(performance.now() - t0);
  }
  return Number(runs.sort((a, b) => a - b)[2].toFixed(1));
}

/** Seeds 100,000 order payments with GST and RST lines over a year and times each report next to count(*). */
export async function reportsBench(db: Knex, treasurer: BenchClient): Promise<BenchResult[]> {
  await db.raw(`
    WITH m AS (
      INSERT INTO money_movements (occurred_at, kind, source, reference, counterparty, gross_cents, fee_cents, fee_estimated, method)
      SELECT timestamptz '2030-01-01 12:00:00+00' + (g % 365) * interval '1 day' + (g % 1440) * interval '1 minute',
             CASE WHEN g % 20 = 0 THEN 'refund' ELSE 'order_payment' END, 'merch', 'B-' || g, 'Bench buyer ' || g,
             CASE WHEN g % 20 = 0 THEN -3360 ELSE 3360 END, CASE WHEN g % 20 = 0 THEN 0 ELSE 127 END, true, 'card'
      FROM generate_series(1, ${ORDERS}) g
      RETURNING id, gross_cents)
    INSERT INTO money_movement_taxes (movement_id, code, jurisdiction, rate_percent, taxable_cents, tax_cents)
    SELECT id, c.code, c.j, c.rate, sign(gross_cents) * 3000, sign(gross_cents) * c.tax FROM m
    CROSS JOIN (VALUES ('GST', 'CA', 5, 150), ('RST', 'MB', 7, 210)) AS c(code, j, rate, tax)`);
  await db.raw('ANALYZE money_movements; ANALYZE money_movement_taxes');
  const year = 'from=2030-01-01&to=2030-12-31';
  const count = await time(() => db('money_movements').count());
  const get = (url: string) => async () => {
    const res = await treasurer.get(url);
    if (res.status !== 200) throw new Error(`${url} answered ${res.status}`);
  };
  // Timed through HTTP, as the treasurer's browser sees them.
  const lines = [
    ['tax to remit (year)', get(`/api/admin/reports/tax?${year}`)],
    ['revenue by month (year)', get(`/api/admin/reports/revenue?${year}`)],
    ['ledger CSV (year, every row)', get(`/api/admin/reports/ledger.csv?${year}`)],
    ['dashboard', get('/api/admin/dashboard')],
  ] as const;
  const out: BenchResult[] = [];
  for (const [name, fn] of lines) {
    out.push(
      withBaseline(
        {
          name: `reports on ${ORDERS.toLocaleString('en-CA')} orders: ${name}`,
          value: await time(fn),
          unit: 'ms (median of 5)',
        },
        'SELECT count(*) FROM money_movements',
        count,
      ),
    );
  }
  return out;
}
