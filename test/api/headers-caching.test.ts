import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn } from '../helpers/users';

let t: TestApp;
let admin: Client;
beforeAll(async () => {
  t = buildTestApp();
  admin = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
});
afterAll(() => t.close());

/** A sponsor with an agreement and a signed-in contact, for the ledger CSV and the portal's PDF. */
async function sponsorAndContact() {
  const created = await admin.post('/api/admin/sponsors', {
    name: `Header Test Supply ${Date.now()}`,
    website: 'https://example.test',
    blurb: 'Invented for a test.',
  });
  const id = created.body.id as number;
  await admin.post(`/api/admin/sponsors/${id}/agreements`, {
    season: '2026',
    cashCents: 10_000,
    deliverables: [{ kind: 'build_log_credit', quantity: 1, dueOn: '2026-12-31' }],
  });
  const contact = await createUser(t.deps.db, ['fan', 'sponsor'], 'Header Contact');
  await admin.post(`/api/admin/sponsors/${id}/contacts`, { userId: contact.id });
  const portal = new Client(t.app);
  await portal.signIn(contact);
  return { id, portal };
}

describe('V8.2.1 session-dependent API answers are never cached (OWASP ASVS 4.0.3 8.2.1)', () => {
  it('sends Cache-Control: no-store on JSON, CSV, PDF and error answers', async () => {
    const s = await sponsorAndContact();
    const fan = (await signedIn(t.app, t.deps.db, ['fan'])).client;
    const answers = [
      await new Client(t.app).get('/api/auth/me'),
      await fan.get('/api/auth/me'),
      await fan.get('/api/account/orders'),
      await fan.get('/api/admin/users'),
      await admin.get('/api/admin/users'),
      await admin.get(`/api/admin/sponsors/${s.id}/ledger.csv`),
      await s.portal.get('/api/sponsor-portal/report.pdf'),
      await s.portal.get('/api/sponsor-portal/report.csv'),
      await new Client(t.app).get('/api/no-such-route'),
    ];
    expect(answers.map((r) => r.status)).toEqual([200, 200, 200, 403, 200, 200, 200, 200, 404]);
    expect(answers[5].headers['content-type']).toMatch(/text\/csv/);
    expect(answers[6].headers['content-type']).toMatch(/application\/pdf/);
    for (const res of answers) expect(res.headers['cache-control']).toBe('no-store');
  });
});

describe('V14.4 a Permissions-Policy denies what Padside never uses (OWASP ASVS 4.0.3 V14.4 HTTP security headers)', () => {
  it('denies the camera everywhere except the check-in pages, and denies microphone, location and payment everywhere', async () => {
    for (const path of [
      '/',
      '/console',
      '/console/orders',
      '/console/range/12/x',
      '/console/ranges',
      '/api/health',
      '/uploads/nothing',
    ]) {
      const policy = (await request(t.app).get(path)).headers['permissions-policy'];
      expect(policy).toMatch(/(^|, )camera=\(\)(,|$)/);
      for (const feature of ['microphone', 'geolocation', 'payment', 'usb'])
        expect(policy).toMatch(new RegExp(`(^|, )${feature}=\\(\\)(,|$)`));
    }
    const checkIn = (await request(t.app).get('/console/check-in')).headers['permissions-policy'];
    expect(checkIn).toMatch(/(^|, )camera=\(self\)(,|$)/);
    expect(checkIn).toMatch(/(^|, )microphone=\(\)(,|$)/);
    // The range table checks members in on a launch day, today's or a given one.
    for (const path of ['/console/range', '/console/range/12', '/console/range/12/']) {
      expect((await request(t.app).get(path)).headers['permissions-policy']).toMatch(/(^|, )camera=\(self\)(,|$)/);
    }
  });
});

describe('V14.4.5 HSTS only on answers to HTTPS requests (OWASP ASVS 4.0.3 14.4.5)', () => {
  it('sends Strict-Transport-Security when the trusted proxy says HTTPS, and not over plain HTTP', async () => {
    const plain = await request(t.app).get('/api/health');
    expect(plain.headers['strict-transport-security']).toBeUndefined();
    const secure = await request(t.app).get('/api/health').set('X-Forwarded-Proto', 'https');
    expect(secure.headers['strict-transport-security']).toMatch(/^max-age=31536000; includeSubDomains$/);
  });
});

describe('V13.1 the payment webhook refuses signatures dated more than five minutes ahead (OWASP ASVS 4.0.3 V13.1 web services; no numbered requirement covers message freshness)', () => {
  const send = (secondsAhead: number) => {
    const payload = JSON.stringify({
      id: `evt_future_${Date.now()}_${secondsAhead}`,
      object: 'event',
      type: 'padside.test',
      data: { object: {} },
      created: Math.floor(Date.now() / 1000),
      livemode: false,
      api_version: '2024-06-20',
    });
    const header = t.processor.webhooks.generateTestHeaderString({
      payload,
      secret: t.config.stripe.webhookSecret,
      timestamp: Math.floor(Date.now() / 1000) + secondsAhead,
    });
    return request(t.app)
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', header)
      .send(payload);
  };

  it('answers 400 for a timestamp ten minutes ahead or behind, and takes one a minute ahead', async () => {
    for (const ahead of [600, 3600, -600]) {
      const res = await send(ahead);
      expect(res.status).toBe(400);
      expect(res.body.error).toMatchObject({ code: 'invalid_request' });
    }
    expect((await send(60)).status).toBe(200);
  });
});
