import { UserRepository } from '../../server/auth/user-repository';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn } from '../helpers/users';

let t: TestApp;
beforeAll(() => (t = buildTestApp()));
afterAll(() => t.close());

describe('POST /api/admin/users/:id/disable', () => {
  describe('when the account is signed in elsewhere', () => {
    it('ends its sessions at once, refuses its sign-in, and shows admins it is disabled', async () => {
      const { client: admin } = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
      const { client: target, user } = await signedIn(t.app, t.deps.db, ['fan', 'editor']);
      expect((await target.get('/api/auth/me')).body.user.id).toBe(user.id);

      const res = await admin.post(`/api/admin/users/${user.id}/disable`);
      expect(res.status).toBe(200);
      expect(res.body.user.disabledAt).toEqual(expect.any(String));
      expect((await target.get('/api/auth/me')).body).toEqual({ user: null });
      expect((await target.get('/api/admin/posts')).status).toBe(401);
      expect(
        await t.deps
          .db('session')
          .whereRaw("(sess -> 'passport' ->> 'user') = ?", [String(user.id)])
          .count<{ count: string }[]>({ count: '*' }),
      ).toEqual([{ count: 0 }]);

      const again = await new Client(t.app).post('/api/auth/login', { email: user.email, password: user.password });
      expect(again.status).toBe(403);
      expect(again.body.error.code).toBe('account_disabled');
      const wrong = await new Client(t.app).post('/api/auth/login', {
        email: user.email,
        password: 'not the password at all',
      });
      expect(wrong.status).toBe(401);

      const listed = await admin.get(`/api/admin/users?q=${encodeURIComponent(user.email)}&state=disabled`);
      expect(listed.body.items).toEqual([expect.objectContaining({ id: user.id, disabledAt: expect.any(String) })]);
      expect((await admin.get(`/api/admin/users?q=${encodeURIComponent(user.email)}&state=active`)).body.items).toEqual(
        [],
      );
    });
  });

  it('lets the account sign in again once enabled', async () => {
    const { client: admin } = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
    const user = await createUser(t.deps.db, ['fan']);
    await admin.post(`/api/admin/users/${user.id}/disable`);
    const enabled = await admin.post(`/api/admin/users/${user.id}/enable`);
    expect(enabled.status).toBe(200);
    expect(enabled.body.user.disabledAt).toBeNull();
    expect(
      (await new Client(t.app).post('/api/auth/login', { email: user.email, password: user.password })).status,
    ).toBe(200);
  });

  it('answers 400 when admins try to disable themselves, and 404 for an unknown account', async () => {
    const { client: admin, user } = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
    const self = await admin.post(`/api/admin/users/${user.id}/disable`);
    expect(self.status).toBe(400);
    expect(self.body.error.fields).toEqual({ account: 'Ask another admin.' });
    expect((await admin.get('/api/auth/me')).body.user.id).toBe(user.id);
    expect((await admin.post('/api/admin/users/99999999/disable')).status).toBe(404);
  });

  it('records one change when two admins disable the same account at once', async () => {
    const { client: a } = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
    const { client: b } = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
    const user = await createUser(t.deps.db, ['fan']);
    // Each client fetches its CSRF token first, so the concurrent requests race only on the account.
    await Promise.all([a.token(), b.token()]);
    const answers = await Promise.all([a, b, a, b].map((c) => c.post(`/api/admin/users/${user.id}/disable`)));
    expect(answers.map((r) => r.status)).toEqual([200, 200, 200, 200]);
    const history = await a.get(`/api/admin/users/${user.id}/history`);
    expect(history.body.items.map((c: { kind: string }) => c.kind)).toEqual(['disabled']);
  });
});

describe('GET /api/admin/users/:id/history', () => {
  it('lists who granted and removed which roles and when, newest first', async () => {
    const { client: admin, user: me } = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
    const user = await createUser(t.deps.db, ['fan']);
    expect((await admin.patch(`/api/admin/users/${user.id}`, { roles: ['fan', 'treasurer'] })).status).toBe(200);
    // Saving the same roles again is no change and adds no line.
    expect((await admin.patch(`/api/admin/users/${user.id}`, { roles: ['treasurer', 'fan'] })).status).toBe(200);
    expect((await admin.patch(`/api/admin/users/${user.id}`, { roles: ['fan', 'editor'] })).status).toBe(200);
    const res = await admin.get(`/api/admin/users/${user.id}/history`);
    expect(res.status).toBe(200);
    const by = { id: me.id, name: 'Test User' };
    expect(res.body.items).toEqual([
      { id: expect.any(Number), kind: 'roles', added: ['editor'], removed: ['treasurer'], at: expect.any(String), by },
      { id: expect.any(Number), kind: 'roles', added: ['treasurer'], removed: [], at: expect.any(String), by },
    ]);
    expect((await admin.get('/api/admin/users/99999999/history')).status).toBe(404);
  });

  it('lists the member role that dues gave and took, as made by no person, and nothing when the role stays', async () => {
    const { client: admin } = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
    const user = await createUser(t.deps.db, ['fan']);
    const users = new UserRepository(t.deps.db);
    await t.deps.db.transaction((trx) => users.setRole(trx, user.id, 'member', true)); // dues paid
    await t.deps.db.transaction((trx) => users.setRole(trx, user.id, 'member', true)); // a second payment: no change
    await t.deps.db.transaction((trx) => users.setRole(trx, user.id, 'member', false)); // lapsed
    const res = await admin.get(`/api/admin/users/${user.id}/history`);
    expect(res.body.items).toEqual([
      { id: expect.any(Number), kind: 'roles', added: [], removed: ['member'], at: expect.any(String), by: null },
      { id: expect.any(Number), kind: 'roles', added: ['member'], removed: [], at: expect.any(String), by: null },
    ]);
  });

  it('is for admins only', async () => {
    const { client: treasurer } = await signedIn(t.app, t.deps.db, ['fan', 'treasurer']);
    const user = await createUser(t.deps.db, ['fan']);
    expect((await treasurer.get(`/api/admin/users/${user.id}/history`)).status).toBe(403);
  });
});

describe('GET /api/admin/users?role=', () => {
  it('lists only accounts holding the role', async () => {
    const { client: admin } = await signedIn(t.app, t.deps.db, ['fan', 'admin']);
    const editor = await createUser(t.deps.db, ['fan', 'editor'], 'Role Filter Editor');
    const fan = await createUser(t.deps.db, ['fan'], 'Role Filter Fan');
    const res = await admin.get('/api/admin/users?q=Role%20Filter&role=editor');
    expect(res.body.items.map((u: { id: number }) => u.id)).toEqual([editor.id]);
    expect(res.body.items.map((u: { id: number }) => u.id)).not.toContain(fan.id);
    expect((await admin.get('/api/admin/users?state=gone')).status).toBe(400);
  });
});
