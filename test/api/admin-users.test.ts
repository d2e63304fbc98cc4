import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { createUser, signedIn } from '../helpers/users';

let t: TestApp;
beforeAll(() => (t = buildTestApp()));
afterAll(() => t.close());

describe('GET /api/admin/users', () => {
  it('pages and searches accounts for an admin', async () => {
    const { client } = await signedIn(t.app, t.deps.db, ['admin']);
    const target = await createUser(t.deps.db, ['fan'], 'Searchable Sparrow');
    const res = await client.get('/api/admin/users?q=sparrow&pageSize=5');
    expect(res.status).toBe(200);
    expect(res.body.items.map((u: { id: number }) => u.id)).toContain(target.id);
    expect(res.body.total).toBeGreaterThanOrEqual(1);
    const bad = await client.get('/api/admin/users?pageSize=100000');
    expect(bad.status).toBe(400);
  });
});

describe('PATCH /api/admin/users/:id', () => {
  it('sets roles, and the change applies to the user at once', async () => {
    const { client } = await signedIn(t.app, t.deps.db, ['admin']);
    const { client: targetClient, user: target } = await signedIn(t.app, t.deps.db, ['fan']);
    const res = await client.patch(`/api/admin/users/${target.id}`, { roles: ['fan', 'editor'] });
    expect(res.status).toBe(200);
    expect(res.body.user.roles).toEqual(['fan', 'editor']);
    expect((await targetClient.get('/api/auth/me')).body.user.roles).toEqual(['fan', 'editor']);
  });

  it('answers 400 for an unknown role and 404 for an unknown user', async () => {
    const { client } = await signedIn(t.app, t.deps.db, ['admin']);
    const target = await createUser(t.deps.db);
    const unknown = await client.patch(`/api/admin/users/${target.id}`, { roles: ['wizard'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields).toHaveProperty(['roles.0']);
    expect((await client.patch('/api/admin/users/99999999', { roles: ['fan'] })).status).toBe(404);
    expect((await client.patch('/api/admin/users/abc', { roles: ['fan'] })).status).toBe(400);
  });

  it('will not let an admin remove their own admin role', async () => {
    const { client, user } = await signedIn(t.app, t.deps.db, ['admin']);
    const res = await client.patch(`/api/admin/users/${user.id}`, { roles: ['fan'] });
    expect(res.status).toBe(400);
  });
});

describe('when an admin changes a signed-in user’s roles', () => {
  it('gives that user a new session id on their next request, and the old id stops working (ASVS 4.0.3 3.2.1)', async () => {
    const { client: admin } = await signedIn(t.app, t.deps.db, ['admin']);
    const { client, user } = await signedIn(t.app, t.deps.db, ['fan']);
    const first = await client.get('/api/auth/me');
    expect(first.status).toBe(200);
    const cookieOf = (res: { headers: Record<string, unknown> }) =>
      ((res.headers['set-cookie'] as string[] | undefined) ?? [])[0]?.split(';')[0];
    const before = client.agent.jar.getCookie('padside.sid', {
      domain: '127.0.0.1',
      path: '/',
      secure: false,
      script: false,
    })?.value;
    expect(before).toBeDefined();
    await admin.patch(`/api/admin/users/${user.id}`, { roles: ['fan', 'editor'] });
    const next = await client.get('/api/auth/me');
    expect(next.body.user.roles).toEqual(['fan', 'editor']);
    const after = cookieOf(next);
    expect(after).toBeDefined();
    expect(after).not.toContain(before);
    const replay = await request(t.app).get('/api/auth/me').set('Cookie', `padside.sid=${before}`);
    expect(replay.body).toEqual({ user: null });
    // The open form's CSRF token still works after the rotation.
    expect((await client.patch('/api/account/profile', { displayName: 'Still Here' })).status).toBe(200);
  });
});
