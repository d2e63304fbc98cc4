import { randomUUID } from 'node:crypto';
import knex, { type Knex } from 'knex';
import pino from 'pino';
import { pgConnection } from '../../server/db';
import { MailWorker } from '../../server/mail/mail-worker';
import { enqueueEmail } from '../../server/mail/outbox';
import { emailsTo } from '../helpers/maildev';
import { freePort, SwitchableProxy } from '../helpers/tcp-proxy';
import { buildTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let proxy: SwitchableProxy;
// The outage test keeps its outbox in a schema of its own: suites running alongside send the shared outbox through
// the working SMTP server, and would otherwise deliver this test's mail before its workers try and fail.
const outageSchema = `outage_${randomUUID().slice(0, 8)}`;
let outageDb: Knex;
beforeAll(async () => {
  t = buildTestApp();
  proxy = new SwitchableProxy(await freePort(), Number(process.env.SMTP_PORT ?? 1025));
  await t.deps.db.raw('CREATE SCHEMA ??', [outageSchema]);
  await t.deps.db.raw('CREATE TABLE ??.outbound_emails (LIKE public.outbound_emails INCLUDING ALL)', [outageSchema]);
  outageDb = knex({
    client: 'pg',
    connection: pgConnection(t.config.databaseUrl),
    searchPath: [outageSchema, 'public'],
    pool: { min: 0, max: 4 },
  });
});
afterAll(async () => {
  await proxy.down();
  await outageDb.destroy();
  await t.deps.db.raw('DROP SCHEMA ?? CASCADE', [outageSchema]);
  await t.close();
});

describe('when the SMTP server is down for a while', () => {
  it('keeps every queued e-mail and, once it is back, delivers each exactly once', async () => {
    const to = `outage-${randomUUID().slice(0, 8)}@example.test`;
    const log = pino({ level: 'silent' });
    const workerA = new MailWorker(outageDb, `smtp://127.0.0.1:${proxy.port}`, 'Padside <hello@padside.test>', log);
    const workerB = new MailWorker(outageDb, `smtp://127.0.0.1:${proxy.port}`, 'Padside <hello@padside.test>', log);
    try {
      await outageDb.transaction(async (trx) => {
        for (let i = 1; i <= 5; i++)
          await enqueueEmail(trx, {
            to,
            subject: `Outage test ${i}`,
            text: `message ${i}`,
            template: 'password-changed',
            reason: {},
          });
      });
      // SMTP is down: nothing is sent, nothing is lost, each failure is recorded for a retry. A pass stops at its
      // first failure, so keep passing until each has been tried.
      let queued = await outageDb('outbound_emails').where('to_address', to);
      for (let pass = 0; pass < 200 && queued.some((m) => m.attempts === 0); pass++) {
        expect(await workerA.deliverDue()).toBe(0);
        queued = await outageDb('outbound_emails').where('to_address', to);
      }
      expect(queued).toHaveLength(5);
      expect(queued.every((m) => m.status === 'queued' && m.attempts >= 1 && m.last_error)).toBe(true);

      await proxy.up();
      // Time passes beyond the retry delay.
      await outageDb('outbound_emails').where('to_address', to).update({ next_attempt_at: outageDb.fn.now() });
      // Two workers (as two server processes would) race for the same rows, and between them send each once.
      const [a, b] = await Promise.all([workerA.deliverDue(), workerB.deliverDue()]);
      expect(a + b).toBe(5);
      // Later passes find nothing of ours to send again: MailDev below holds each of the five once.
      await Promise.all([workerA.deliverDue(), workerB.deliverDue()]);
      const caught = await emailsTo(to);
      expect(caught.map((m) => m.subject).sort()).toEqual([1, 2, 3, 4, 5].map((i) => `Outage test ${i}`));
      const rows = await outageDb('outbound_emails').where('to_address', to);
      expect(rows.every((m) => m.status === 'sent' && m.sent_at)).toBe(true);
    } finally {
      await workerA.stop();
      await workerB.stop();
    }
  });

  it('queues a mail with a dedupe key only once', async () => {
    const to = `dedupe-${randomUUID().slice(0, 8)}@example.test`;
    const key = `test:${randomUUID()}`;
    const results = await Promise.all(
      [1, 2, 3].map(() =>
        t.deps.db.transaction((trx) =>
          enqueueEmail(trx, {
            to,
            subject: 'Once',
            text: 'x',
            template: 'password-changed',
            reason: {},
            dedupeKey: key,
          }),
        ),
      ),
    );
    expect(results.filter(Boolean)).toHaveLength(1);
    expect(await t.deps.db('outbound_emails').where('dedupe_key', key)).toHaveLength(1);
  });
});
