// MailDev, the payment fake and the object store fake as children of the calling script.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startChild } from './children.mjs';
import { waitForPort } from './system.mjs';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export async function startMailDev({ smtpPort, webPort, quiet }) {
  startChild(
    'maildev',
    process.execPath,
    [
      path.join(root, 'node_modules/maildev/bin/maildev'),
      '--smtp',
      String(smtpPort),
      '--web',
      String(webPort),
      '--ip',
      '127.0.0.1',
      '--web-ip',
      '127.0.0.1',
      '--silent',
    ],
    { quiet },
  );
  await Promise.all([waitForPort(smtpPort), waitForPort(webPort)]);
}

export async function startPaymentFake({ port, quiet }) {
  startChild('payments', process.execPath, [path.join(root, 'scripts/payment-fake.mjs')], {
    env: { PORT: String(port) },
    quiet,
  });
  await waitForPort(port);
}

/** s3rver with `bucket`, keeping its objects in `dir`; its fixed test key pair is S3RVER / S3RVER. */
export async function startObjectStoreFake({ port, dir, bucket, quiet }) {
  startChild('objects', process.execPath, [path.join(root, 'scripts/s3-fake.mjs')], {
    env: { PORT: String(port), S3_DIR: dir, S3_BUCKET: bucket },
    quiet,
  });
  await waitForPort(port);
}
