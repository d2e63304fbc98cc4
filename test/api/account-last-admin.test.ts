import { freshDatabase, type FreshDatabase } from '../helpers/fresh-database';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';

// Whether someone is the last admin depends on every account, and other test files make admins all the time: this
// file gets a database of its own on the test cluster, migrated like the shared one.
let fresh: FreshDatabase;
let t: TestApp;

beforeAll(async () => {
  fresh = await freshDatabase();
  t = buildTestApp({ env: { DATABASE_URL: fresh.url } });
}, 120_000);
afterAll(async () => {
  await t?.close();
  await fresh?.drop();
});

async function adminClient() {
  const user = await createUser(t.deps.db, ['fan', 'admin']);
  const client = new Client(t.app);
  await client.signIn(user);
  return { client, user };
}

describe('POST /api/account/delete', () => {
  describe('when the caller is the only admin', () => {
    it('answers 409 and the account stays', async () => {
      const only = await adminClient();
      const res = await only.client.post('/api/account/delete', { password: only.user.password });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('last_admin');
      expect((await only.client.get('/api/admin/users')).status).toBe(200);

      // With a second admin, one of the two may go; when both ask at once, the other is then the last.
      const second = await adminClient();
      const answers = await Promise.all([
        only.client.post('/api/account/delete', { password: only.user.password }),
        second.client.post('/api/account/delete', { password: second.user.password }),
      ]);
      expect(answers.map((r) => r.status).sort()).toEqual([200, 409]);
      const admins = await t.deps
        .db('users')
        .whereRaw("'admin' = ANY(roles)")
        .whereNull('deleted_at')
        .count({ n: '*' });
      expect(admins).toEqual([{ n: 1 }]);
    });
  });
});
