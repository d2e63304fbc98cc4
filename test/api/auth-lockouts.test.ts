import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn, type TestUser } from '../helpers/users';

// Addresses from the documentation ranges (RFC 5737), passed as the loopback proxy's X-Forwarded-For, so these
// failures never count against 127.0.0.1, which every other test file signs in from.
const clock = fixedClock('2026-12-01T15:00:00Z');
let t: TestApp;
let admin: Client;
beforeAll(async () => {
  t = buildTestApp({ clock });
  admin = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
});
afterAll(() => t.close());

let octet = 0;
const ip = (net: string) => `${net}.${(octet++ % 250) + 1}`;
const later = (seconds: number) => clock.set(new Date(clock.now().getTime() + seconds * 1000).toISOString());

async function login(email: string, password: string, from: string) {
  const c = new Client(t.app);
  const token = await c.token();
  return c.agent
    .post('/api/auth/login')
    .set('X-CSRF-Token', token)
    .set('X-Forwarded-For', from)
    .send({ email, password });
}
const wrong = (u: TestUser, from: string) => login(u.email, 'not the password at all, sorry', from);

describe('V2.2.1 sign-in lockouts an attacker cannot aim (OWASP ASVS 4.0.3 2.2.1; NIST SP 800-63B 5.2.2)', () => {
  it('blocks one account from one address briefly after 5 failures, while the owner’s usual address still signs in', async () => {
    const owner = await createUser(t.deps.db);
    const home = ip('198.51.100');
    expect((await login(owner.email, owner.password, home)).status).toBe(200);
    const attacker = ip('203.0.113');
    for (let i = 0; i < 5; i++) expect((await wrong(owner, attacker)).status).toBe(401);
    const blocked = await login(owner.email, owner.password, attacker);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    const retry = Number(blocked.headers['retry-after']);
    expect(retry).toBeGreaterThan(0);
    expect(retry).toBeLessThanOrEqual(15 * 60);
    expect((await login(owner.email.toUpperCase(), owner.password, home)).status).toBe(200);
  });

  it('lets failures from elsewhere slow down and finally lock only “elsewhere”, after exactly 100, never the owner’s usual address', async () => {
    const owner = await createUser(t.deps.db, ['fan', 'treasurer']);
    const home = ip('198.51.100');
    expect((await login(owner.email, owner.password, home)).status).toBe(200);
    let failures = 0;
    let waits = 0;
    for (let attempt = 0; attempt < 125; attempt++) {
      const res = await wrong(owner, ip('203.0.113'));
      if (res.status === 401) failures++;
      else {
        expect(res.status).toBe(429);
        if (res.body.error.code === 'rate_limited') waits++;
      }
      // Past the longest growing delay (15 minutes), so only the hard lock can stop an attempt.
      later(15 * 60 + 1);
    }
    // NIST SP 800-63B 5.2.2: no more than 100 consecutive failed attempts on one account.
    expect(failures).toBe(100);
    expect(waits).toBe(0);
    const locked = await login(owner.email, owner.password, ip('203.0.113'));
    expect(locked.status).toBe(429);
    expect(locked.body.error.code).toBe('account_locked');
    later(7 * 86400);
    expect((await login(owner.email, owner.password, ip('203.0.113'))).body.error.code).toBe('account_locked');
    // The owner, from where they usually sign in, is not locked out; their success starts the counts again.
    expect((await login(owner.email, owner.password, home)).status).toBe(200);
    expect((await login(owner.email, owner.password, ip('203.0.113'))).status).toBe(200);
  }, 120_000);

  it('makes each further attempt from elsewhere wait longer: 1 s after the 5th failure, then doubling', async () => {
    const owner = await createUser(t.deps.db);
    for (let i = 0; i < 5; i++) expect((await wrong(owner, ip('203.0.113'))).status).toBe(401);
    const waiting = await login(owner.email, owner.password, ip('203.0.113'));
    expect(waiting.status).toBe(429);
    expect(waiting.headers['retry-after']).toBe('1');
    later(1);
    expect((await wrong(owner, ip('203.0.113'))).status).toBe(401);
    expect((await login(owner.email, owner.password, ip('203.0.113'))).headers['retry-after']).toBe('2');
    later(2);
    expect((await login(owner.email, owner.password, ip('203.0.113'))).status).toBe(200);
  });

  it('blocks one address across every account for longer than the per-account block after 100 failures', async () => {
    const from = ip('192.0.2');
    for (let i = 0; i < 100; i++)
      expect((await login(`nobody-${i}-${Date.now()}@example.test`, 'not the password at all', from)).status).toBe(401);
    const someone = await createUser(t.deps.db);
    const blocked = await login(someone.email, someone.password, from);
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(15 * 60);
  }, 120_000);
});

describe('V2.2.1 an admin clears a sign-in lock from the accounts page (OWASP ASVS 4.0.3 2.2.1)', () => {
  it('shows the failures and the lock, and DELETE /api/admin/users/:id/sign-in-lock lifts both the lock and the address block', async () => {
    const owner = await createUser(t.deps.db);
    const from = ip('203.0.113');
    for (let i = 0; i < 5; i++) expect((await wrong(owner, from)).status).toBe(401);
    expect((await login(owner.email, owner.password, from)).status).toBe(429);
    await t.deps.db('sign_in_lockouts').where('account_key', owner.email).update({ failures_elsewhere: 100 });
    expect((await login(owner.email, owner.password, ip('203.0.113'))).body.error.code).toBe('account_locked');

    const listed = await admin.get(`/api/admin/users?q=${encodeURIComponent(owner.email)}`);
    expect(listed.body.items[0].signIn).toEqual({ failures: 100, locked: true });
    expect((await admin.delete(`/api/admin/users/${owner.id}/sign-in-lock`)).status).toBe(204);
    expect((await admin.get(`/api/admin/users?q=${encodeURIComponent(owner.email)}`)).body.items[0].signIn).toEqual({
      failures: 0,
      locked: false,
    });
    expect((await login(owner.email, owner.password, from)).status).toBe(200);
    expect((await admin.delete('/api/admin/users/999999/sign-in-lock')).status).toBe(404);
  });
});
