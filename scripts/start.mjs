// `npm start`: installs what is missing, starts PostgreSQL, MailDev and the payment fake on loopback,
// migrates and seeds the demo data once, builds the app and serves it. Ctrl-C stops everything.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
process.chdir(root);
if (!existsSync(path.join(root, 'node_modules'))) {
  console.log('padside: installing dependencies (npm ci)');
  if (spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { stdio: 'inherit' }).status !== 0) process.exit(1);
}

const { startCluster, ensureDatabase } = await import('./stack/postgres.mjs');
const { assertPortFree, waitForPort } = await import('./stack/system.mjs');
const { startChild, stopChildren } = await import('./stack/children.mjs');
const { startMailDev, startPaymentFake } = await import('./stack/services.mjs');

const env = process.env;
const workersArg = process.argv.indexOf('--workers');
const ports = {
  app: Number(env.PORT ?? 3000),
  pg: Number(env.PGPORT ?? 54329),
  smtp: Number(env.SMTP_PORT ?? 1025),
  inbox: Number(env.MAILDEV_WEB_PORT ?? 1080),
  payments: Number(env.PAYMENTS_PORT ?? 12111),
};
const dataDir = path.join(root, '.data');
let cluster;
let stopping = false;

async function stopAll(code) {
  if (stopping) return;
  stopping = true;
  console.log('\npadside: stopping');
  await stopChildren();
  cluster?.stop();
  process.exit(code);
}
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

try {
  await assertPortFree(ports.app, '127.0.0.1', 'PORT, the app');
  await assertPortFree(ports.smtp, '127.0.0.1', 'SMTP_PORT, MailDev SMTP');
  await assertPortFree(ports.inbox, '127.0.0.1', 'MAILDEV_WEB_PORT, MailDev inbox');
  await assertPortFree(ports.payments, '127.0.0.1', 'PAYMENTS_PORT, the payment fake');
  const usingOwnCluster = !env.DATABASE_URL;
  if (usingOwnCluster) {
    await assertPortFree(ports.pg, '127.0.0.1', 'PGPORT, PostgreSQL');
    cluster = startCluster({ dataDir: path.join(dataDir, 'postgres'), port: ports.pg });
    ensureDatabase({ bin: cluster.bin, port: ports.pg, database: env.PGDATABASE ?? 'padside' });
    console.log(`padside: PostgreSQL on 127.0.0.1:${ports.pg} (data in .data/postgres)`);
  }
  await startMailDev({ smtpPort: ports.smtp, webPort: ports.inbox });
  console.log(`padside: MailDev SMTP 127.0.0.1:${ports.smtp}, inbox http://127.0.0.1:${ports.inbox}`);
  await startPaymentFake({ port: ports.payments });

  const appEnv = {
    PORT: String(ports.app),
    PGPORT: String(ports.pg),
    SMTP_URL: env.SMTP_URL ?? `smtp://127.0.0.1:${ports.smtp}`,
    STRIPE_API_BASE: env.STRIPE_API_BASE ?? `http://127.0.0.1:${ports.payments}`,
    PUBLIC_URL: env.PUBLIC_URL ?? `http://127.0.0.1:${ports.app}`,
    ...(workersArg > 0 ? { WORKERS: process.argv[workersArg + 1] } : {}),
  };
  console.log('padside: building the server and the app');
  for (const script of ['build:server', 'build:client']) {
    if (spawnSync('npm', ['run', '-s', script], { stdio: 'inherit' }).status !== 0)
      throw new Error(`padside: npm run ${script} failed`);
  }
  const prepared = spawnSync(process.execPath, ['dist/server/tasks/prepare-db.js', '--demo-seed'], {
    stdio: 'inherit',
    env: { ...env, ...appEnv },
  });
  if (prepared.status !== 0) throw new Error('padside: database preparation failed');
  const server = startChild('app', process.execPath, ['dist/server/main.js'], { env: appEnv });
  server.on('exit', (code) => void stopAll(code ?? 1));
  await waitForPort(ports.app, '127.0.0.1', 60000);
  console.log(`\nPadside is up: http://127.0.0.1:${ports.app}  (inbox: http://127.0.0.1:${ports.inbox}; Ctrl-C stops)`);
} catch (err) {
  console.error(err.message ?? err);
  await stopAll(1);
}
