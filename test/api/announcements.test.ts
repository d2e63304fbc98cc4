import request from 'supertest';
import { withdrawAllConsents } from '../../server/announcements/consent-withdrawal';
import { freshDatabase, type FreshDatabase } from '../helpers/fresh-database';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import {
  address,
  announcementMail,
  confirmedSubscriber,
  confirmToken,
  oneClickUrl,
  signUp,
} from './announcement-fixtures';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

// Its own database: an announcement goes to every address with consent, and on the shared database that is every
// buyer and member other suites made (implied consent), thousands of mails for each send to drain.
let fresh: FreshDatabase;
let t: TestApp;
let editor: Client;
let editorEmail: string;
let admin: Client;
let visitor: Client;

beforeAll(async () => {
  fresh = await freshDatabase();
  t = buildTestApp({ env: { DATABASE_URL: fresh.url } });
  const e = await signedIn(t.app, t.deps.db, ['editor']);
  editor = e.client;
  editorEmail = e.user.email;
  admin = (await signedIn(t.app, t.deps.db, ['admin'])).client;
  visitor = new Client(t.app);
});
afterAll(async () => {
  await t?.close();
  await fresh?.drop();
});

const settled = () => t.app.platform.auth.afterAnswer.settled();

async function draft(topic: string, subject = `News ${Date.now()}`) {
  const res = await editor.post('/api/admin/announcements', {
    topic,
    subject,
    markdown: 'The **new** altimeter bay is in the shop.\n\n- twelve units\n- no restock',
  });
  expect(res.status).toBe(201);
  return res.body.announcement as { id: number; status: string };
}

async function sendNow(id: number) {
  const res = await editor.post(`/api/admin/announcements/${id}/send`);
  expect(res.status).toBe(202);
  return res.body.announcement;
}

describe('POST /api/subscriptions', () => {
  describe('when a new address signs up (double opt-in)', () => {
    it('answers 202, queues one confirmation mail, and sends the address nothing else until it is confirmed', async () => {
      const email = address('optin');
      const res = await signUp(visitor, { email, topics: ['launches', 'build-logs'], page: 'home' });
      expect(res.status).toBe(202);
      expect(res.body).toEqual({ queued: true });
      await settled();
      const mails = await t.deps.db('outbound_emails').where('to_address', email);
      expect(mails.map((m) => m.template)).toEqual(['subscription-confirm']);
      expect(mails[0].category).toBe('transactional');
      expect(mails[0].text_body).toMatch(/launch days/);
      expect(mails[0].text_body).toMatch(/Why you got this/);

      const before = await sendNow((await draft('launches')).id);
      expect(await announcementMail(t.deps.db, email, before.id)).toHaveLength(0);

      const token = await confirmToken(t.deps.db, email);
      const confirmed = await request(t.app).get(`/api/subscriptions/confirm?token=${token}`);
      expect(confirmed.status).toBe(200);
      expect(confirmed.body.confirmed).toEqual({ email, topics: expect.arrayContaining(['launches', 'build-logs']) });

      const after = await sendNow((await draft('launches')).id);
      expect(await announcementMail(t.deps.db, email, after.id)).toHaveLength(1);
    });

    it('keeps the consent record: wording and version, page, network address, confirmation', async () => {
      const email = address('record');
      await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['drops']);
      const [row] = await t.deps.db('subscriptions').where('email', email);
      expect(row).toEqual(
        expect.objectContaining({
          topic: 'drops',
          wording_version: '2026-12-v1',
          source_page: 'home',
          confirmed_how: 'email-link',
          withdrawn_at: null,
          confirm_token_hash: null,
        }),
      );
      expect(row.wording_text).toMatch(/may e-mail me/);
      expect(row.source_ip).toMatch(/^10\.77\./);
      expect(row.confirmed_at).toBeInstanceOf(Date);
    });

    it('makes the confirmation link single-use', async () => {
      const email = address('once');
      await signUp(visitor, { email, topics: ['drops'] });
      await settled();
      const token = await confirmToken(t.deps.db, email);
      expect((await request(t.app).get(`/api/subscriptions/confirm?token=${token}`)).status).toBe(200);
      const again = await request(t.app).get(`/api/subscriptions/confirm?token=${token}`);
      expect(again.status).toBe(400);
      expect(again.body.error.fields).toEqual({ token: 'Expired or already used.' });
    });
  });

  describe('when the address is already confirmed', () => {
    it('answers the same 202 and queues nothing (no enumeration)', async () => {
      const email = address('known');
      await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['launches']);
      const res = await signUp(visitor, { email, topics: ['launches'] });
      expect(res.status).toBe(202);
      expect(res.body).toEqual({ queued: true });
      await settled();
      expect(
        await t.deps.db('outbound_emails').where({ to_address: email, template: 'subscription-confirm' }),
      ).toHaveLength(1);
    });
  });

  describe('when the body is wrong', () => {
    it('answers 400 naming the fields', async () => {
      const res = await signUp(visitor, { email: 'not-an-address', topics: ['weather'] });
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['email', 'topics.0']));
    });

    it('answers 400 on productId for a product that does not exist', async () => {
      const res = await signUp(visitor, { email: address('noproduct'), topics: ['drops'], productId: 99999999 });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.productId).toBeDefined();
    });

    it('answers 400 on topics for a product request without drops', async () => {
      const res = await signUp(visitor, { email: address('nodrops'), topics: ['launches'], productId: 1 });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.topics).toBeDefined();
    });
  });

  describe('when one network address signs up too often', () => {
    it('answers 429 after 30 sign-ups in an hour', async () => {
      const token = await visitor.token();
      const from = `10.99.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
      const statuses: number[] = [];
      for (let i = 0; i < 31; i++) {
        const res = await visitor.agent
          .post('/api/subscriptions')
          .set('X-CSRF-Token', token)
          .set('X-Forwarded-For', from)
          .send({ email: address(`flood${i}`), topics: ['drops'] });
        statuses.push(res.status);
      }
      expect(statuses.slice(0, 30).every((s) => s === 202)).toBe(true);
      expect(statuses[30]).toBe(429);
      await settled();
    });
  });
});

describe('the unsubscribe link in List-Unsubscribe', () => {
  it('accepts a one-click POST without a session or CSRF token, and the address gets no later announcement on that list', async () => {
    const email = address('oneclick');
    await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['build-logs', 'launches']);
    const first = await sendNow((await draft('build-logs')).id);
    const [row] = await announcementMail(t.deps.db, email, first.id);
    expect(row.headers['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');

    const url = new URL(oneClickUrl(row));
    const res = await request(t.app)
      .post(url.pathname + url.search)
      .type('form')
      .send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(200);
    expect(res.body.unsubscribed).toEqual({ email, topic: 'build-logs', label: 'new build logs' });
    const [consent] = await t.deps.db('subscriptions').where({ email, topic: 'build-logs' });
    expect(consent.withdrawn_how).toBe('one-click');

    const later = await sendNow((await draft('build-logs')).id);
    expect(await announcementMail(t.deps.db, email, later.id)).toHaveLength(0);
    // Only that list stops.
    const otherList = await sendNow((await draft('launches')).id);
    expect(await announcementMail(t.deps.db, email, otherList.id)).toHaveLength(1);
  });

  it('answers 400 for a token that was not signed here', async () => {
    const res = await request(t.app)
      .post('/api/subscriptions/unsubscribe?token=bm9ib2R5.forged')
      .type('form')
      .send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_token');
  });

  it('stops mail already queued on that list before it goes out', async () => {
    const email = address('queued');
    await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['launches']);
    const a = await sendNow((await draft('launches')).id);
    const [row] = await announcementMail(t.deps.db, email, a.id);
    const url = new URL(oneClickUrl(row));
    await request(t.app)
      .post(url.pathname + url.search)
      .type('form')
      .send('List-Unsubscribe=One-Click');
    await t.deps.mail.deliverDue();
    const [after] = await announcementMail(t.deps.db, email, a.id);
    expect(after.status).toBe('suppressed');
  });

  it('lets a new confirmed sign-up override the earlier unsubscribe', async () => {
    const email = address('again');
    await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['launches']);
    const a = await sendNow((await draft('launches')).id);
    const url = new URL(oneClickUrl((await announcementMail(t.deps.db, email, a.id))[0]));
    await request(t.app)
      .post(url.pathname + url.search)
      .type('form')
      .send('List-Unsubscribe=One-Click');
    await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['launches']);
    const b = await sendNow((await draft('launches')).id);
    expect(await announcementMail(t.deps.db, email, b.id)).toHaveLength(1);
    expect(await t.deps.db('subscriptions').where({ email, topic: 'launches' }).orderBy('id')).toEqual([
      expect.objectContaining({ withdrawn_how: 'one-click' }),
      expect.objectContaining({ withdrawn_at: null, confirmed_how: 'email-link' }),
    ]);
  });
});

describe('POST /api/admin/announcements', () => {
  it('answers 201 with a draft in the shape of the issue', async () => {
    const res = await editor.post('/api/admin/announcements', {
      topic: 'drops',
      subject: 'Nose cone run',
      markdown: 'Soon.',
    });
    expect(res.status).toBe(201);
    expect(res.body.announcement).toEqual(
      expect.objectContaining({ id: expect.any(Number), status: 'draft', topic: 'drops', subject: 'Nose cone run' }),
    );
  });

  it('answers 400 naming each field', async () => {
    const res = await editor.post('/api/admin/announcements', { topic: 'weather', subject: '', markdown: '' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['topic', 'subject', 'markdown']));
  });
});

describe('GET /api/admin/announcements/:id/preview and POST .../test', () => {
  it('shows the mail as a recipient gets it, and sends a marked test to the staff member only', async () => {
    const a = await draft('drops', 'Preview check');
    const preview = await editor.get(`/api/admin/announcements/${a.id}/preview`);
    expect(preview.status).toBe(200);
    expect(preview.body.html).toContain('<strong>new</strong>');
    expect(preview.body.text).toMatch(/Sent by .+, Box 42, 7 Launch Rail Road, Gopher Flats, MB R0A 0A0, Canada/);
    expect(preview.body.headers).toEqual({
      'List-Unsubscribe': expect.stringMatching(/^<http.+\/api\/subscriptions\/unsubscribe\?token=.+>$/),
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    });

    expect((await editor.post(`/api/admin/announcements/${a.id}/test`)).status).toBe(202);
    const [test] = await t.deps
      .db('outbound_emails')
      .where({ to_address: editorEmail, template: 'announcement-test' })
      .orderBy('id', 'desc');
    expect(test.subject).toBe('[Test] Preview check');
    expect(test.announcement_id).toBeNull();
    expect((await editor.get(`/api/admin/announcements/${a.id}`)).body.announcement.status).toBe('draft');
  });
});

describe('POST /api/admin/announcements/:id/send', () => {
  it('queues once per address and reports counts that move as the worker delivers', async () => {
    const emails = [address('count1'), address('count2')];
    for (const e of emails) await confirmedSubscriber(t.app, visitor, t.deps.db, e, ['build-logs']);
    const a = await draft('build-logs');
    const sent = await sendNow(a.id);
    expect(sent.counts.recipients).toBeGreaterThanOrEqual(2);
    for (const e of emails) expect(await announcementMail(t.deps.db, e, a.id)).toHaveLength(1);
    await t.deps.mail.deliverDue();
    const shown = (await editor.get(`/api/admin/announcements/${a.id}`)).body.announcement;
    const rows = await t.deps.db('outbound_emails').where('announcement_id', a.id);
    expect(rows).toHaveLength(shown.counts.recipients);
    expect(shown.counts.sent).toBe(rows.filter((r) => r.status === 'sent').length);
    expect(shown.counts.sent).toBeGreaterThanOrEqual(2);
    expect(shown.counts.queued).toBe(0);
    expect(shown.status).toBe('sent');
  });

  it('answers one of two clicks at once with 202 and the other with 409, and queues each address once', async () => {
    const email = address('twice');
    await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['drops']);
    const a = await draft('drops');
    const results = await Promise.all([
      editor.post(`/api/admin/announcements/${a.id}/send`),
      admin.post(`/api/admin/announcements/${a.id}/send`),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([202, 409]);
    expect(await announcementMail(t.deps.db, email, a.id)).toHaveLength(1);
  });

  it('refuses to change a sent announcement (409)', async () => {
    const a = await draft('drops');
    await sendNow(a.id);
    expect((await editor.patch(`/api/admin/announcements/${a.id}`, { subject: 'Changed' })).status).toBe(409);
  });
});

describe('implied consent from a purchase', () => {
  it('counts within two years of the purchase and not after (from memory: CASL)', async () => {
    const fresh = address('implied-fresh');
    const lapsed = address('implied-lapsed');
    const today = new Date().toISOString().slice(0, 10);
    const yearsAgo = (n: number, days: number) => {
      const d = new Date(`${today}T12:00:00Z`);
      d.setUTCFullYear(d.getUTCFullYear() - n);
      d.setUTCDate(d.getUTCDate() + days);
      return d.toISOString().slice(0, 10);
    };
    await t.deps.db('implied_consents').insert([
      { email: fresh, basis: 'purchase', basis_ref: `test-${fresh}`, basis_on: yearsAgo(2, 2) },
      { email: lapsed, basis: 'purchase', basis_ref: `test-${lapsed}`, basis_on: yearsAgo(2, -2) },
    ]);
    const a = await sendNow((await draft('drops')).id);
    expect(await announcementMail(t.deps.db, fresh, a.id)).toHaveLength(1);
    expect(await announcementMail(t.deps.db, lapsed, a.id)).toHaveLength(0);
    // A purchase implies consent for drops only.
    const b = await sendNow((await draft('launches')).id);
    expect(await announcementMail(t.deps.db, fresh, b.id)).toHaveLength(0);
  });
});

describe('headers on the wire', () => {
  it('are on every commercial message and absent from receipts and confirmations', async () => {
    const email = address('wire');
    const shirt = await openShirt(admin);
    // Drops of this product only: other files' runs open all the time and bring their own drop notices.
    await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['drops'], shirt.id);
    const buyer = new Client(t.app);
    const order = await buyer.post('/api/orders', {
      items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
      shipTo: MB_ADDRESS,
      shippingMethodId: await methodId(buyer, 'canada'),
      email,
      paymentToken: 'tok_visa',
    });
    expect(order.status).toBe(201);
    await t.app.jobs.find((j) => j.name === 'drop-notices')!.run();
    const a = await sendNow((await draft('drops')).id);
    expect(a.status).toBe('sending');
    const rows = await t.deps.db('outbound_emails').where('to_address', email).orderBy('id');
    const commercial = rows.filter((r) => r.category === 'commercial');
    expect(commercial.map((r) => r.template).sort()).toEqual(['announcement', 'drop-notice']);
    for (const r of commercial) {
      expect(r.headers).toEqual({
        'List-Unsubscribe': expect.stringMatching(/^<.+>$/),
        'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
      });
      expect(r.text_body).toMatch(/Gopher Flats, MB R0A 0A0/);
      expect(r.text_body).toMatch(/Stop e-mails about new runs and drops with one click/);
    }
    const transactional = rows.filter((r) => r.category === 'transactional');
    expect(transactional.map((r) => r.template).sort()).toEqual(['shop-order-confirmation', 'subscription-confirm']);
    expect(transactional.every((r) => r.headers === null)).toBe(true);

    await t.deps.mail.deliverDue();
    const caught = (await (await fetch(`${process.env.MAILDEV_URL ?? 'http://127.0.0.1:1080'}/email`)).json()) as {
      to: { address: string }[];
      subject: string;
      headers: Record<string, string>;
    }[];
    const mine = caught.filter((m) => m.to.some((x) => x.address === email));
    expect(mine).toHaveLength(4);
    for (const m of mine) {
      const commercialOnWire = /is open|^News/.test(m.subject);
      expect(Boolean(m.headers['list-unsubscribe'])).toBe(commercialOnWire);
      expect(m.headers['list-unsubscribe-post'] ?? null).toBe(commercialOnWire ? 'List-Unsubscribe=One-Click' : null);
    }
  });
});

describe('withdrawAllConsents (account deletion)', () => {
  it('withdraws every list and implied consent of the address, so no later announcement reaches it', async () => {
    const email = address('deleted');
    await confirmedSubscriber(t.app, visitor, t.deps.db, email, ['drops', 'launches']);
    await t.deps.db('implied_consents').insert({
      email,
      basis: 'purchase',
      basis_ref: `test-${email}`,
      basis_on: new Date().toISOString().slice(0, 10),
    });
    await t.deps.db.transaction((trx) => withdrawAllConsents(trx, email, new Date(), 'account-deleted'));
    expect(
      (await t.deps.db('subscriptions').where('email', email)).every((r) => r.withdrawn_how === 'account-deleted'),
    ).toBe(true);
    expect(await t.deps.db('implied_consents').where('email', email)).toHaveLength(0);
    for (const topic of ['drops', 'launches']) {
      const a = await sendNow((await draft(topic)).id);
      expect(await announcementMail(t.deps.db, email, a.id)).toHaveLength(0);
    }
  });
});

describe('the drop-notices job', () => {
  it('sends each opened run’s notice once, to those who asked for that product or for every drop', async () => {
    const forP = address('drop-p');
    const forAll = address('drop-all');
    const p = await openShirt(admin);
    const q = await openShirt(admin);
    await confirmedSubscriber(t.app, visitor, t.deps.db, forP, ['drops'], p.id);
    await confirmedSubscriber(t.app, visitor, t.deps.db, forAll, ['drops']);
    const job = t.app.jobs.find((j) => j.name === 'drop-notices')!;
    await job.run();
    await job.run();
    const notices = await t.deps.db('announcements').whereIn('run_id', [p.run.id, q.run.id]);
    expect(notices).toHaveLength(2);
    const of = (run: number) => Number(notices.find((n) => Number(n.run_id) === run)!.id);
    expect(await announcementMail(t.deps.db, forP, of(p.run.id))).toHaveLength(1);
    expect(await announcementMail(t.deps.db, forP, of(q.run.id))).toHaveLength(0);
    expect(await announcementMail(t.deps.db, forAll, of(p.run.id))).toHaveLength(1);
    expect(await announcementMail(t.deps.db, forAll, of(q.run.id))).toHaveLength(1);
    const [mail] = await announcementMail(t.deps.db, forP, of(p.run.id));
    expect(mail.subject).toMatch(/is open$/);
    expect(mail.text_body).toContain(`/shop/p/${p.slug}`);
  });
});
