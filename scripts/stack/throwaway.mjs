// A throwaway stack on free loopback ports in a temporary folder: PostgreSQL, MailDev, the payment fake and an
// S3-compatible object store.
// Used by `npm test` and `npm run bench`; never touches the `npm start` data.
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { stopChildren } from './children.mjs';
import { ensureDatabase, startCluster } from './postgres.mjs';
import { startMailDev, startObjectStoreFake, startPaymentFake } from './services.mjs';
import { freePort } from './system.mjs';

export async function startThrowawayStack(name) {
  const tmp = mkdtempSync(path.join(os.tmpdir(), `padside-${name}-`));
  chmodSync(tmp, 0o755);
  const ports = {
    pg: await freePort(),
    smtp: await freePort(),
    inbox: await freePort(),
    payments: await freePort(),
    objects: await freePort(),
  };
  const cluster = startCluster({ dataDir: path.join(tmp, 'postgres'), port: ports.pg });
  const database = `padside_${name}`;
  ensureDatabase({ bin: cluster.bin, port: ports.pg, database });
  await startMailDev({ smtpPort: ports.smtp, webPort: ports.inbox, quiet: true });
  await startPaymentFake({ port: ports.payments, quiet: true });
  const bucket = 'padside-test';
  await startObjectStoreFake({ port: ports.objects, dir: path.join(tmp, 'objects'), bucket, quiet: true });
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    DATABASE_URL: `postgres://padside@127.0.0.1:${ports.pg}/${database}`,
    PG_BIN: cluster.bin,
    PG_DATA: path.join(tmp, 'postgres'),
    PGPORT: String(ports.pg),
    SMTP_URL: `smtp://127.0.0.1:${ports.smtp}`,
    SMTP_PORT: String(ports.smtp),
    MAILDEV_URL: `http://127.0.0.1:${ports.inbox}`,
    STRIPE_API_BASE: `http://127.0.0.1:${ports.payments}`,
    SESSION_SECRET: `${name}-session-secret-that-is-long-enough-0123456789`,
    DATA_DIR: path.join(tmp, 'data'),
    TEST_TMP: tmp,
    // The object store's settings; uploads stay on the disk unless a test sets STORAGE_URL to TEST_STORAGE_URL.
    TEST_STORAGE_URL: `s3://${bucket}/uploads`,
    S3_ENDPOINT: `http://127.0.0.1:${ports.objects}`,
    S3_REGION: 'us-east-1',
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    S3_FORCE_PATH_STYLE: 'true',
  };
  // A developer's own STORAGE_URL must never send test uploads to a real bucket.
  delete env.STORAGE_URL;
  return {
    tmp,
    env,
    async stop() {
      await stopChildren();
      cluster.stop();
      rmSync(tmp, { recursive: true, force: true });
    },
  };
}
