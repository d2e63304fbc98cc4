import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';

let t: TestApp;
beforeAll(() => (t = buildTestApp()));
afterAll(() => t.close());

const uniqueEmail = () => `new-${randomUUID().slice(0, 8)}@example.test`;
const goodPassword = 'prairie wind over the launch rail';

describe('GET /api/auth/csrf', () => {
  it('answers a token and sets the session cookie', async () => {
    const res = await request(t.app).get('/api/auth/csrf');
    expect(res.status).toBe(200);
    expect(res.body.csrfToken).toMatch(/^[A-Za-z0-9_-]{40,}$/);
    expect(res.headers['set-cookie']?.[0]).toMatch(/padside\.sid=.*HttpOnly.*SameSite=Lax/i);
  });
});

describe('POST /api/auth/register', () => {
  it('answers 202, creates a fan account after the answer and signs nobody in until the address is confirmed', async () => {
    const client = new Client(t.app);
    const email = uniqueEmail();
    const res = await client.post('/api/auth/register', { email, password: goodPassword, displayName: 'Rowan' });
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ queued: true, message: expect.stringMatching(/inbox/) });
    await t.app.platform.auth.afterAnswer.settled();
    expect(await t.deps.db('users').where({ email }).first()).toMatchObject({
      display_name: 'Rowan',
      roles: ['fan'],
      email_verified_at: null,
    });
    expect((await client.get('/api/auth/me')).body.user).toBeNull();
    const signIn = await client.post('/api/auth/login', { email, password: goodPassword });
    expect(signIn.body.user).toMatchObject({ email, displayName: 'Rowan', roles: ['fan'], emailVerified: false });
  });

  describe('when fields are wrong', () => {
    it.each([
      ['missing everything', {}, ['email', 'password', 'displayName']],
      ['a malformed e-mail', { email: 'not-an-email', password: goodPassword, displayName: 'A' }, ['email']],
      [
        'a short password (ASVS 4.0.3 2.1.1: at least 12)',
        { email: 'x@example.test', password: 'eleven-char', displayName: 'A' },
        ['password'],
      ],
      [
        'an over-long password (ASVS 4.0.3 2.1.2: over 128 may be refused)',
        { email: 'x@example.test', password: 'p'.repeat(129) + 'q', displayName: 'A' },
        ['password'],
      ],
      [
        'a common password (ASVS 4.0.3 2.1.7)',
        { email: 'x@example.test', password: 'password1234', displayName: 'A' },
        ['password'],
      ],
      [
        'a name that is too long',
        { email: 'x@example.test', password: goodPassword, displayName: 'n'.repeat(81) },
        ['displayName'],
      ],
    ])('answers 400 with field messages for %s', async (_name, body, fields) => {
      const res = await new Client(t.app).post('/api/auth/register', body);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields).sort()).toEqual([...fields].sort());
      expect(res.body.error.message).toEqual(expect.any(String));
    });

    it('accepts a long passphrase with spaces and no composition rules (ASVS 4.0.3 2.1.9)', async () => {
      const res = await new Client(t.app).post('/api/auth/register', {
        email: uniqueEmail(),
        password: 'all lower case words only here',
        displayName: 'Plain',
      });
      expect(res.status).toBe(202);
    });
  });

  it('answers 403 without the CSRF header', async () => {
    const res = await request(t.app)
      .post('/api/auth/register')
      .send({ email: uniqueEmail(), password: goodPassword, displayName: 'A' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_failed');
  });

  it('answers 400 for a body that is not JSON', async () => {
    const client = new Client(t.app);
    const token = await client.token();
    const res = await client.agent
      .post('/api/auth/register')
      .set('X-CSRF-Token', token)
      .set('Content-Type', 'application/json')
      .send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('entity_parse_failed');
  });
});

describe('POST /api/auth/login', () => {
  it('signs in with the right password and gives a new session id (ASVS 4.0.3 3.2.1)', async () => {
    const user = await createUser(t.deps.db, ['fan', 'member']);
    const client = new Client(t.app);
    const before = (await client.agent.get('/api/auth/csrf')).headers['set-cookie']?.[0]?.split(';')[0];
    const res = await client.post('/api/auth/login', { email: user.email, password: user.password });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, email: user.email, roles: ['fan', 'member'] });
    const after = res.headers['set-cookie']?.[0]?.split(';')[0];
    expect(after).toBeDefined();
    expect(after).not.toEqual(before);
  });

  it('answers 401 with the same message for a wrong password and an unknown e-mail', async () => {
    const user = await createUser(t.deps.db);
    const wrong = await new Client(t.app).post('/api/auth/login', {
      email: user.email,
      password: 'not the right one at all',
    });
    const unknown = await new Client(t.app).post('/api/auth/login', {
      email: uniqueEmail(),
      password: 'not the right one at all',
    });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error).toEqual(unknown.body.error);
  });

  it('answers 400 for a missing password', async () => {
    const res = await new Client(t.app).post('/api/auth/login', { email: 'x@example.test' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toBeDefined();
  });

  it('blocks the account from this address after 5 failures with 429 and Retry-After (ASVS 4.0.3 2.2.1: at most 100)', async () => {
    const user = await createUser(t.deps.db);
    const client = new Client(t.app);
    for (let i = 0; i < 5; i++) {
      const res = await client.post('/api/auth/login', { email: user.email, password: `wrong password number ${i}` });
      expect(res.status).toBe(401);
    }
    const locked = await client.post('/api/auth/login', { email: user.email, password: user.password });
    expect(locked.status).toBe(429);
    expect(Number(locked.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('does not count successful sign-ins as failures', async () => {
    const user = await createUser(t.deps.db);
    for (let i = 0; i < 25; i++) {
      const res = await new Client(t.app).post('/api/auth/login', { email: user.email, password: user.password });
      expect(res.status).toBe(200);
    }
  });
});

describe('POST /api/auth/logout', () => {
  it('destroys the session on the server (ASVS 4.0.3 3.3.1)', async () => {
    const user = await createUser(t.deps.db);
    const client = new Client(t.app);
    const login = await client.signIn(user);
    const cookie = login.headers['set-cookie']![0].split(';')[0];
    const out = await client.post('/api/auth/logout');
    expect(out.status).toBe(204);
    // Replaying the old cookie must not find a session.
    const replay = await request(t.app).get('/api/auth/me').set('Cookie', cookie);
    expect(replay.status).toBe(200);
    expect(replay.body.user).toBeNull();
  });
});

describe('GET /api/auth/me', () => {
  it('answers user null when nobody is signed in', async () => {
    const res = await request(t.app).get('/api/auth/me');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: null });
  });
});

describe('unknown API paths', () => {
  it('answer a JSON 404', async () => {
    const res = await request(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
