import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { firstLink, waitForEmails } from '../helpers/maildev';
import { Client, createUser } from '../helpers/users';

let t: TestApp;
beforeAll(() => (t = buildTestApp()));
afterAll(() => t.close());

describe('e-mail verification', () => {
  it('sends the verification mail through the outbox and its link verifies the account', async () => {
    const email = `verify-${randomUUID().slice(0, 8)}@example.test`;
    const client = new Client(t.app);
    const reg = await client.post('/api/auth/register', {
      email,
      password: 'four words make a phrase',
      displayName: 'Vera',
    });
    expect(reg.status).toBe(202);
    await t.app.platform.auth.afterAnswer.settled();
    await t.deps.mail.deliverDue();
    const [mail] = await waitForEmails(email, /Confirm your e-mail/);
    expect(mail).toBeDefined();
    const link = new URL(firstLink(mail));
    expect(link.pathname).toBe('/account/verify');
    const res = await client.post('/api/auth/verify', { token: link.searchParams.get('token') });
    expect(res.status).toBe(204);
    // Confirming signs nobody in: whoever registered chose the password, not necessarily the mailbox's owner.
    expect((await client.get('/api/auth/me')).body.user).toBeNull();
    expect(
      (await client.post('/api/auth/login', { email, password: 'four words make a phrase' })).body.user.emailVerified,
    ).toBe(true);
    const again = await client.post('/api/auth/verify', { token: link.searchParams.get('token') });
    expect(again.status).toBe(400);
  });

  it('answers 400 for a made-up token', async () => {
    const res = await new Client(t.app).post('/api/auth/verify', { token: 'x'.repeat(43) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.token).toBeDefined();
  });
});

describe('POST /api/auth/password-reset', () => {
  it('answers 202 for an unknown e-mail too, and sends nothing', async () => {
    const email = `nobody-${randomUUID().slice(0, 8)}@example.test`;
    const res = await new Client(t.app).post('/api/auth/password-reset', { email });
    expect(res.status).toBe(202);
    await t.app.platform.auth.afterAnswer.settled();
    expect(await t.deps.db('outbound_emails').where('to_address', email)).toHaveLength(0);
  });

  it('e-mails a single-use link that sets a new password and ends other sessions', async () => {
    const user = await createUser(t.deps.db);
    const other = new Client(t.app);
    await other.signIn(user);
    const res = await new Client(t.app).post('/api/auth/password-reset', { email: user.email });
    expect(res.status).toBe(202);
    await t.app.platform.auth.afterAnswer.settled();
    await t.deps.mail.deliverDue();
    const [mail] = await waitForEmails(user.email, /new Padside password/);
    const token = new URL(firstLink(mail)).searchParams.get('token')!;

    const weak = await new Client(t.app).post('/api/auth/password-reset/confirm', { token, password: 'short' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.password).toBeDefined();

    const ok = await new Client(t.app).post('/api/auth/password-reset/confirm', {
      token,
      password: 'a brand new passphrase here',
    });
    expect(ok.status).toBe(204);
    const reused = await new Client(t.app).post('/api/auth/password-reset/confirm', {
      token,
      password: 'another new passphrase here',
    });
    expect(reused.status).toBe(400);

    expect((await other.get('/api/auth/me')).body).toEqual({ user: null });
    const login = await new Client(t.app).post('/api/auth/login', {
      email: user.email,
      password: 'a brand new passphrase here',
    });
    expect(login.status).toBe(200);
    await t.deps.mail.deliverDue();
    expect(await waitForEmails(user.email, /password was changed/)).toHaveLength(1);
  });

  it('refuses an expired link', async () => {
    const user = await createUser(t.deps.db);
    await new Client(t.app).post('/api/auth/password-reset', { email: user.email });
    await t.app.platform.auth.afterAnswer.settled();
    await t.deps
      .db('auth_tokens')
      .where({ user_id: user.id, purpose: 'password_reset' })
      .update({ expires_at: new Date(Date.now() - 1000) });
    await t.deps.mail.deliverDue();
    const [mail] = await waitForEmails(user.email, /new Padside password/);
    const token = new URL(firstLink(mail)).searchParams.get('token')!;
    const res = await new Client(t.app).post('/api/auth/password-reset/confirm', {
      token,
      password: 'a brand new passphrase here',
    });
    expect(res.status).toBe(400);
  });

  it('answers 400 for a malformed e-mail', async () => {
    const client = new Client(t.app);
    const token = await client.token();
    const res = await client.agent.post('/api/auth/password-reset').set('X-CSRF-Token', token).send({ email: 'nope' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toBeDefined();
    expect((await request(t.app).post('/api/auth/password-reset').send({ email: 'a@b.test' })).status).toBe(403);
  });
});
