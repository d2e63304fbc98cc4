import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

let t: TestApp;
beforeAll(() => (t = buildTestApp()));
afterAll(() => t.close());

describe('PATCH /api/account/profile', () => {
  it('changes the display name and mail preference', async () => {
    const { client } = await signedIn(t.app, t.deps.db);
    const res = await client.patch('/api/account/profile', { displayName: 'Kestrel', marketingOptOut: true });
    expect(res.status).toBe(200);
    expect(res.body.user.displayName).toBe('Kestrel');
    expect((await client.get('/api/account/profile')).body.marketingOptOut).toBe(true);
  });

  it('answers 400 for an empty name and 401 when signed out', async () => {
    const { client } = await signedIn(t.app, t.deps.db);
    const res = await client.patch('/api/account/profile', { displayName: '   ' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.displayName).toBeDefined();
    expect((await new Client(t.app).patch('/api/account/profile', { displayName: 'X' })).status).toBe(401);
  });
});

describe('POST /api/account/password', () => {
  it('needs the current password, then keeps this session and ends the others', async () => {
    const { client, user } = await signedIn(t.app, t.deps.db);
    const other = new Client(t.app);
    await other.signIn(user);
    const wrong = await client.post('/api/account/password', {
      currentPassword: 'not it at all',
      newPassword: 'a much better passphrase',
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toBeDefined();
    const ok = await client.post('/api/account/password', {
      currentPassword: user.password,
      newPassword: 'a much better passphrase',
    });
    expect(ok.status).toBe(204);
    expect((await client.get('/api/auth/me')).status).toBe(200);
    expect((await other.get('/api/auth/me')).body).toEqual({ user: null });
  });
});
