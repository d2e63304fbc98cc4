import request from 'supertest';
import { PrivateCluster } from '../helpers/private-cluster';
import { buildTestApp, type TestApp } from '../helpers/test-app';

// A cluster of this test's own, so stopping it does not disturb the other test files running at the same time.
const cluster = new PrivateCluster('fault');

let t: TestApp;
beforeAll(async () => {
  await cluster.create();
  t = buildTestApp({ env: { DATABASE_URL: cluster.url } });
}, 60_000);
afterAll(async () => {
  await t?.close();
  cluster.stopQuietly();
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
    cluster.stop();
    const down = await healthWithin(503);
    expect(down.status).toBe(503);
    expect(down.body.db).toBe('down');
    cluster.start();
    const up = await healthWithin(200);
    expect(up.status).toBe(200);
    expect(up.body).toMatchObject({ status: 'ok', db: 'ok' });
  });
});
