import { writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { buildTestApp, type TestApp } from '../test/helpers/test-app';
import { createUser } from '../test/helpers/users';
import type { AddressInfo } from 'node:net';
import { BenchClient } from './bench-client';
import type { BenchResult } from './bench-result';
import { catalogueBench } from './catalogue';
import { dropBench } from './drop';
import { frontEndBench } from './front-end';
import { lighthouseBench } from './lighthouse';
import { productPageBench } from './product-page';
import { reportsBench } from './reports';

/**
 * Runs every benchmark once, prints the table and writes bench/results.json. With BENCH_ONLY=front-end or
 * back-end it runs that part alone and only prints, so results.json always holds one whole run.
 */
async function main(): Promise<void> {
  const only = process.env.BENCH_ONLY;
  const t = buildTestApp();
  const results: BenchResult[] = [];
  try {
    if (only !== 'back-end') {
      results.push(frontEndBench(process.env.BENCH_APP_DIST!, process.env.BENCH_EMPTY_DIST!));
      // Before the drop bench adds its products, so the product page is a demo one.
      results.push(...(await lighthouseBench(t.app, process.env.BENCH_EMPTY_DIST!, process.env.CHROMIUM_PATH!)));
    }
    if (only !== 'front-end') await backEndBenches(t, results);
  } finally {
    await t.close();
  }
  const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.version}, ${os.platform()} ${os.release()}`;
  const rows = results.map(
    (r) =>
      `| ${r.name} | ${r.value} ${r.unit} | ${r.baseline ? `${r.baseline.name}: ${r.baseline.value}` : ''} | ${r.baseline?.ratio ?? ''} | ${r.notes ?? ''} |`,
  );
  const table = ['| benchmark | result | baseline (same run) | ratio | notes |', '|---|---|---|---|---|', ...rows].join(
    '\n',
  );
  console.log(`\n${table}\n\nMachine: ${machine}\n`);
  if (only) console.log(`${only} only: bench/results.json left as it was.`);
  else
    writeFileSync(
      path.join(__dirname, 'results.json'),
      JSON.stringify({ ranAt: new Date().toISOString(), machine, results }, null, 2) + '\n',
    );
}

/** With --cpu-prof, prints when each part starts on the profile's clock (µs), to cut the profile into parts. */
function phase(name: string): void {
  if (process.env.BENCH_CPU_PROF) console.log(`bench phase ${name} at ${process.hrtime.bigint() / 1000n}`);
}

/** The product page, the catalogue, the drop and the reports. */
async function backEndBenches(t: TestApp, results: BenchResult[]): Promise<void> {
  const admin = await createUser(t.deps.db, ['fan', 'admin', 'treasurer'], 'Bench Admin');
  phase('product-page');
  const page = await productPageBench(t.app);
  if (page) results.push(page);
  phase('catalogue');
  results.push(await catalogueBench(t.app));
  phase('drop');
  results.push(...(await dropBench(t.app, t.deps.payments, admin.email, admin.password)));
  phase('reports');
  const server = t.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const treasurer = new BenchClient(`http://127.0.0.1:${(server.address() as AddressInfo).port}`);
  await treasurer.post('/api/auth/login', { email: admin.email, password: admin.password });
  results.push(...(await reportsBench(t.deps.db, treasurer)));
  server.close();
  phase('end');
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
