import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, chownSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { freePort } from '../helpers/tcp-proxy';
import { buildTestApp, type TestApp } from '../helpers/test-app';

// A cluster of this test's own, so stopping it does not disturb the other test files running at the same time.
const bin = process.env.PG_BIN ?? '/usr/lib/postgresql/15/bin';
const asRoot = process.getuid?.() === 0;
const dir = path.join(process.env.TEST_TMP ?? '/tmp', `pg-fault-${process.pid}`);
const data = path.join(dir, 'data');
let port: number;

function pg(tool: string, args: string[]): void {
  const [cmd, argv] = asRoot ? ['runuser', ['-u', 'postgres', '--', path.join(bin, tool), ...args]] : [path.join(bin, tool), args];
  const r = spawnSync(cmd, argv, { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${tool} failed: ${r.stderr}`);
}
const start = () => pg('pg_ctl', ['-D', data, '-l', path.join(dir, 'log'), '-o', `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1`, '-w', 'start']);
const stop = () => pg('pg_ctl', ['-D', data, '-m', 'fast', '-w', 'stop']);

let t: TestApp;
beforeAll(async () => {
  port = await freePort();
  mkdirSync(dir, { recursive: true });
  if (asRoot) {
    const uid = Number(execFileSync('id', ['-u', 'postgres']).toString());
    const gid = Number(execFileSync('id', ['-g', 'postgres']).toString());
    chownSync(dir, uid, gid);
    writeFileSync(path.join(dir, 'log'), '');
    chownSync(path.join(dir, 'log'), uid, gid);
  }
  pg('initdb', ['-D', data, '-U', 'padside', '--auth=trust']);
  start();
  t = buildTestApp({ env: { DATABASE_URL: `postgres://padside@127.0.0.1:${port}/postgres` } });
}, 60_000);
afterAll(async () => {
  await t?.close();
  try {
    stop();
  } catch {
    // already stopped by a failed test
  }
});

async function healthWithin(expected: number, timeoutMs = 15_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await request(t.app).get('/api/health');
    if (res.status === expected || Date.now() > until) return res;
    await new Promise((r) => setTimeout(r, 250));
  }
}

describe('when PostgreSQL stops and starts again during a run', () => {
  it('reports db "down" with 503, then "ok" again without restarting the server', async () => {
    expect((await healthWithin(200)).body.db).toBe('ok');
    stop();
    const down = await healthWithin(503);
    expect(down.status).toBe(503);
    expect(down.body.db).toBe('down');
    start();
    const up = await healthWithin(200);
    expect(up.status).toBe(200);
    expect(up.body).toMatchObject({ status: 'ok', db: 'ok' });
  });
});
