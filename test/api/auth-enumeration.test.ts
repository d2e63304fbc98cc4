import { randomUUID } from 'node:crypto';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn } from '../helpers/users';

let t: TestApp;
beforeAll(() => (t = buildTestApp()));
afterAll(() => t.close());

const uniqueEmail = () => `enum-${randomUUID().slice(0, 8)}@example.test`;
const password = 'gravel road past the launch field';
let octet = 0;
// Documentation addresses (RFC 5737) through the loopback proxy, so these counts never touch 127.0.0.1's.
const ip = () => `198.51.100.${(octet++ % 250) + 1}`;

async function post(url: string, body: object, from = ip(), client = new Client(t.app)) {
  const token = await client.token();
  return client.agent.post(url).set('X-CSRF-Token', token).set('X-Forwarded-For', from).send(body);
}
const outbox = (to: string, template: string) => t.deps.db('outbound_emails').where({ to_address: to, template });

/** Holds every call of `method` on `target` until the returned release() is called. */
function hold<T extends object>(target: T, method: keyof T) {
  const original = target[method] as unknown as (...a: unknown[]) => Promise<unknown>;
  let release!: () => void;
  const gate = new Promise<void>((r) => (release = r));
  let calls = 0;
  (target as Record<keyof T, unknown>)[method] = async (...args: unknown[]) => {
    calls++;
    await gate;
    return original.apply(target, args);
  };
  return { release, restore: () => ((target as Record<keyof T, unknown>)[method] = original), calls: () => calls };
}

describe('V2.2 registration and password reset do not tell which addresses have accounts (OWASP ASVS 4.0.3 V2.2; ASVS 5.0 6.3.8)', () => {
  it('answers a registration with an existing address exactly like a new one, and tells the owner instead', async () => {
    const owner = await createUser(t.deps.db, ['fan'], 'Existing Owner');
    const fresh = uniqueEmail();
    const taken = await post('/api/auth/register', { email: owner.email.toUpperCase(), password, displayName: 'Twin' });
    const created = await post('/api/auth/register', { email: fresh, password, displayName: 'Newcomer' });
    expect(taken.status).toBe(created.status);
    expect(taken.body).toEqual(created.body);
    expect(taken.status).toBe(202);
    await t.app.platform.auth.afterAnswer.settled();
    expect(await outbox(owner.email, 'registration-attempt')).toHaveLength(1);
    expect(await outbox(owner.email, 'verify-email')).toHaveLength(0);
    expect(await outbox(fresh, 'verify-email')).toHaveLength(1);
    expect(await outbox(fresh, 'registration-attempt')).toHaveLength(0);
    expect(await t.deps.db('users').where('email', owner.email)).toHaveLength(1);
    expect((await t.deps.db('users').where('email', owner.email).first()).display_name).toBe('Existing Owner');
  });

  it('answers a registration before it looks the address up or creates anything', async () => {
    const held = hold(t.app.platform.auth.users, 'insert');
    try {
      const res = await post('/api/auth/register', { email: uniqueEmail(), password, displayName: 'Early Answer' });
      expect(res.status).toBe(202);
    } finally {
      held.release();
    }
    await t.app.platform.auth.afterAnswer.settled();
    held.restore();
    expect(held.calls()).toBe(1);
  });

  it('answers a password reset before it looks the address up, for known and unknown addresses alike', async () => {
    const user = await createUser(t.deps.db);
    for (const email of [user.email, uniqueEmail()]) {
      const held = hold(t.app.platform.auth.users, 'byEmail');
      try {
        const res = await post('/api/auth/password-reset', { email });
        expect(res.status).toBe(202);
        expect(res.body).toEqual({ queued: true });
      } finally {
        held.release();
      }
      await t.app.platform.auth.afterAnswer.settled();
      held.restore();
      expect(held.calls()).toBe(1);
    }
    expect(await outbox(user.email, 'password-reset')).toHaveLength(1);
  });
});

describe('V11.1.4 verification mail and registrations are rate-limited per address and per network address (OWASP ASVS 4.0.3 11.1.4)', () => {
  async function unverified() {
    const s = await signedIn(t.app, t.deps.db);
    await t.deps.db('users').where('id', s.user.id).update({ email_verified_at: null });
    return s;
  }

  it('sends at most 3 verification mails an hour to one address, then answers 429 with Retry-After', async () => {
    const { client, user } = await unverified();
    for (let i = 0; i < 3; i++) expect((await post('/api/auth/verify/resend', {}, ip(), client)).status).toBe(202);
    const refused = await post('/api/auth/verify/resend', {}, ip(), client);
    expect(refused.status).toBe(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(refused.body.error.code).toBe('rate_limited');
    expect(await outbox(user.email, 'verify-email')).toHaveLength(3);
  });

  it('sends at most 10 verification mails an hour from one network address', async () => {
    const from = ip();
    for (let i = 0; i < 10; i++)
      expect((await post('/api/auth/verify/resend', {}, from, (await unverified()).client)).status).toBe(202);
    expect((await post('/api/auth/verify/resend', {}, from, (await unverified()).client)).status).toBe(429);
  });

  it('takes at most 3 registrations an hour for one address', async () => {
    const email = uniqueEmail();
    for (let i = 0; i < 3; i++)
      expect((await post('/api/auth/register', { email, password, displayName: 'Again' })).status).toBe(202);
    const refused = await post('/api/auth/register', { email, password, displayName: 'Again' });
    expect(refused.status).toBe(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    await t.app.platform.auth.afterAnswer.settled();
    // One account and one verification mail; the two repeats told the (new) owner that someone tried again.
    expect(await outbox(email, 'verify-email')).toHaveLength(1);
    expect(await outbox(email, 'registration-attempt')).toHaveLength(2);
  });

  it('takes at most 20 registrations an hour from one network address', async () => {
    const from = ip();
    for (let i = 0; i < 20; i++)
      expect(
        (await post('/api/auth/register', { email: uniqueEmail(), password, displayName: 'Bulk' }, from)).status,
      ).toBe(202);
    const refused = await post('/api/auth/register', { email: uniqueEmail(), password, displayName: 'Bulk' }, from);
    expect(refused.status).toBe(429);
    await t.app.platform.auth.afterAnswer.settled();
  }, 60_000);
});
