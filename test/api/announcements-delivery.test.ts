import pino from 'pino';
import request from 'supertest';
import { MailWorker } from '../../server/mail/mail-worker';
import { FakeSmtp } from '../helpers/fake-smtp';
import { PrivateCluster } from '../helpers/private-cluster';
import { startServerProcess, type ServerProcess } from '../helpers/server-process';
import { freePort } from '../helpers/tcp-proxy';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { address, announcementMail, bulkConfirmed, oneClickUrl } from './announcement-fixtures';

// A database and an SMTP server of this file's own: the workers here drain the whole outbox, and the SMTP server goes
// down on purpose, which must not touch the mail other test files wait for.
const cluster = new PrivateCluster('announce');
let t: TestApp;
let smtp: FakeSmtp;
let editor: Client;
let other: ServerProcess | undefined;
const log = pino({ level: 'silent' });

beforeAll(async () => {
  await cluster.create();
  smtp = new FakeSmtp(await freePort(), (rcpt) =>
    rcpt.startsWith('bounce-')
      ? '550 5.1.1 No such mailbox here'
      : rcpt.startsWith('complain-')
        ? '550 5.7.1 Refused: the recipient reported your mail'
        : null,
  );
  await smtp.up();
  t = buildTestApp({ env: { DATABASE_URL: cluster.url, SMTP_URL: `smtp://127.0.0.1:${smtp.port}` } });
  await t.deps.db.migrate.latest();
  editor = (await signedIn(t.app, t.deps.db, ['editor'])).client;
}, 120_000);
afterAll(async () => {
  await other?.kill('SIGKILL');
  await t?.close();
  await smtp?.stopAccepting();
  cluster.stopQuietly();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function announce(topic: string, subject: string): Promise<number> {
  const created = await editor.post('/api/admin/announcements', {
    topic,
    subject,
    markdown: 'Motor cases are back in the shop.',
  });
  expect(created.status).toBe(201);
  expect((await editor.post(`/api/admin/announcements/${created.body.announcement.id}/send`)).status).toBe(202);
  return created.body.announcement.id;
}

const rowsOf = (id: number) => t.deps.db('outbound_emails').where('announcement_id', id);

async function until(what: string, check: () => Promise<boolean>, ms = 30_000): Promise<void> {
  const end = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await sleep(100);
  }
}

describe('the suppression list across two server processes', () => {
  it('is written by one process (bounce, complaint, one-click) and honoured by the other, at queueing and at sending', async () => {
    const [bounce, complain, leaver, stays] = [
      address('bounce'),
      address('complain'),
      address('leaver'),
      address('stays'),
    ];
    await bulkConfirmed(t.deps.db, [bounce, complain, leaver, stays], 'launches');
    other = await startServerProcess({
      DATABASE_URL: cluster.url,
      SMTP_URL: `smtp://127.0.0.1:${smtp.port}`,
      MAIL_POLL_MS: '200',
    });

    // The other process's worker sends the first announcement; the server refuses two addresses for good.
    const first = await announce('launches', 'Two-process check 1');
    await until('the other process to deliver', async () => (await rowsOf(first)).every((r) => r.status !== 'queued'));
    const suppressions = await t.deps.db('email_suppressions').whereIn('email', [bounce, complain]).orderBy('email');
    expect(suppressions.map((s) => [s.email, s.reason, s.list])).toEqual([
      [bounce, 'hard_bounce', null],
      [complain, 'complaint', null],
    ]);
    expect(smtp.to(stays).map((m) => m.subject)).toEqual(['Two-process check 1']);

    // One click on the other process stops the leaver's list.
    const url = new URL(oneClickUrl((await announcementMail(t.deps.db, leaver, first))[0]));
    const clicked = await fetch(`${other.url}${url.pathname}${url.search}`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: 'List-Unsubscribe=One-Click',
    });
    expect(clicked.status).toBe(200);

    // This process queues the next one and leaves out all three: two suppressed, one whose consent is withdrawn.
    const second = await announce('launches', 'Two-process check 2');
    expect((await rowsOf(second)).map((r) => r.to_address)).toEqual([stays]);
    expect((await editor.get(`/api/admin/announcements/${second}`)).body.announcement.counts).toEqual(
      expect.objectContaining({ recipients: 1, suppressed: 2 }),
    );
    await until('the other process to deliver the second', async () =>
      (await rowsOf(second)).every((r) => r.status !== 'queued'),
    );
    expect(smtp.to(stays).map((m) => m.subject)).toEqual(['Two-process check 1', 'Two-process check 2']);

    // Mail queued before a suppression is stopped by the other process's worker at sending time. The other process
    // is paused while the mail is queued and the address leaves, or its worker could send the mail in between; it
    // holds no row then, since everything before is handled.
    other.child.kill('SIGSTOP');
    const third = await announce('launches', 'Two-process check 3');
    const [row] = await announcementMail(t.deps.db, stays, third);
    const own = new URL(oneClickUrl(row));
    expect(
      (
        await request(t.app)
          .post(own.pathname + own.search)
          .type('form')
          .send('List-Unsubscribe=One-Click')
      ).status,
    ).toBe(200);
    expect((await announcementMail(t.deps.db, stays, third))[0].status).toBe('queued');
    other.child.kill('SIGCONT');
    await until(
      'the other process to handle the row',
      async () => (await announcementMail(t.deps.db, stays, third))[0].status !== 'queued',
    );
    expect((await announcementMail(t.deps.db, stays, third))[0].status).toBe('suppressed');
    expect(smtp.to(stays).map((m) => m.subject)).toEqual(['Two-process check 1', 'Two-process check 2']);
    await other.kill();
    other = undefined;
  }, 120_000);
});

describe('an announcement to 2,000 addresses with the SMTP server down halfway', () => {
  it('delivers to each address exactly once, the headers on every message', async () => {
    const emails = Array.from({ length: 2000 }, (_v, i) => `bulk-${i}-${Date.now().toString(36)}@example.test`);
    await bulkConfirmed(t.deps.db, emails, 'build-logs');
    const id = await announce('build-logs', 'Two thousand');
    expect(await rowsOf(id)).toHaveLength(2000);

    const url = `smtp://127.0.0.1:${smtp.port}`;
    const workers = [
      new MailWorker(t.deps.db, url, 'Padside <hello@padside.test>', log),
      new MailWorker(t.deps.db, url, 'Padside <hello@padside.test>', log),
    ];
    const sent = async () =>
      Number((await t.deps.db('outbound_emails').where({ announcement_id: id, status: 'sent' }).count('* as n'))[0].n);
    try {
      // Two workers (two processes) share the queue; the server stops taking connections once half is out.
      const passes = Promise.all(workers.map((w) => w.deliverDue()));
      await until('half the mail to go out', async () => (await sent()) >= 1000, 120_000);
      await smtp.stopAccepting();
      await passes;
      const midway = await sent();
      expect(midway).toBeGreaterThanOrEqual(1000);
      expect(midway).toBeLessThan(2000);
      const waiting = await t.deps.db('outbound_emails').where({ announcement_id: id, status: 'queued' });
      expect(waiting.length).toBe(2000 - midway);
      expect(waiting.some((r) => r.attempts >= 1 && r.last_error)).toBe(true);
      expect((await editor.get(`/api/admin/announcements/${id}`)).body.announcement).toEqual(
        expect.objectContaining({
          status: 'sending',
          counts: expect.objectContaining({ recipients: 2000, sent: midway, queued: 2000 - midway }),
        }),
      );

      // The server is back; before each pass, time passes beyond the retry delay (a send that timed out on a loaded
      // machine has put its row off again).
      await smtp.up();
      for (let pass = 0; pass < 20 && (await sent()) < 2000; pass++) {
        await t.deps
          .db('outbound_emails')
          .where({ announcement_id: id, status: 'queued' })
          .update({ next_attempt_at: t.deps.db.fn.now() });
        await Promise.all(workers.map((w) => w.deliverDue()));
      }
    } finally {
      await Promise.all(workers.map((w) => w.stop()));
    }
    const taken = smtp.taken.filter((m) => m.subject === 'Two thousand');
    const perAddress = new Map<string, number>();
    for (const m of taken) for (const to of m.to) perAddress.set(to, (perAddress.get(to) ?? 0) + 1);
    expect(perAddress.size).toBe(2000);
    expect([...perAddress.values()].every((n) => n === 1)).toBe(true);
    expect(
      taken.every(
        (m) =>
          /^<http.+\/api\/subscriptions\/unsubscribe\?token=.+>$/.test(m.headers['list-unsubscribe']) &&
          m.headers['list-unsubscribe-post'] === 'List-Unsubscribe=One-Click',
      ),
    ).toBe(true);
    expect((await editor.get(`/api/admin/announcements/${id}`)).body.announcement).toEqual(
      expect.objectContaining({
        status: 'sent',
        counts: expect.objectContaining({ recipients: 2000, sent: 2000, queued: 0, failed: 0 }),
      }),
    );
  }, 300_000);
});
