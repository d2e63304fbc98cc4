import request, { type Response } from 'supertest';
import { PrivateCluster } from '../helpers/private-cluster';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';

// Restarting PostgreSQL under steady reads, on a cluster of this test's own (the other test files keep theirs).
const cluster = new PrivateCluster('restart');
let t: TestApp;
let member: Client;

beforeAll(async () => {
  await cluster.create();
  t = buildTestApp({ env: { DATABASE_URL: cluster.url } });
  await t.deps.db.migrate.latest();
  member = new Client(t.app);
  await member.signIn(await createUser(t.deps.db, ['fan', 'member']));
}, 120_000);
afterAll(async () => {
  await t?.close();
  cluster.stopQuietly();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('V7.4.1 a lost or refused database connection answers 503 with Retry-After, never 500 (OWASP ASVS 4.0.3 7.4.1: a generic message, no internals)', () => {
  it('answers every read during a restart with 200 or 503 in the error shape, and 200 again after it', async () => {
    const answers: Response[] = [];
    let running = true;
    // Four steady readers: the catalogue (knex pool) and a signed-in page (session store pool, then knex).
    const reader = async (read: () => Promise<Response>) => {
      while (running) answers.push(await read());
    };
    const readers = [
      reader(() => request(t.app).get('/api/products')),
      reader(() => request(t.app).get('/api/products')),
      reader(() => member.get('/api/account/orders')),
      reader(() => member.get('/api/account/orders')),
    ];
    await sleep(500);
    const beforeStop = answers.length;
    cluster.stop();
    await sleep(1_500);
    cluster.start();
    // Let the pools find the cluster again, then read a little longer.
    await sleep(2_500);
    running = false;
    await Promise.all(readers);

    const statuses = answers.map((r) => r.status);
    expect(beforeStop).toBeGreaterThan(0);
    expect(statuses.filter((s) => s !== 200 && s !== 503)).toEqual([]);
    const unavailable = answers.filter((r) => r.status === 503);
    expect(unavailable.length).toBeGreaterThan(0);
    for (const r of unavailable) {
      expect(Number(r.headers['retry-after'])).toBeGreaterThan(0);
      expect(r.body).toEqual({ error: { code: 'database_unavailable', message: expect.any(String) } });
      expect(JSON.stringify(r.body)).not.toMatch(/ECONNREFUSED|57P01|terminated|127\.0\.0\.1/);
    }
    expect(statuses.slice(-8)).toEqual(Array(8).fill(200));
    // The session survived the restart: the member is still signed in.
    expect((await member.get('/api/auth/me')).body.user).not.toBeNull();
  }, 60_000);
});
