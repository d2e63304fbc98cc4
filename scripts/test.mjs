// `npm test`: the whole suite against a throwaway stack on free loopback ports; never touches `npm start` data.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, chmodSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
process.chdir(root);
if (!existsSync(path.join(root, 'node_modules'))) {
  if (spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { stdio: 'inherit' }).status !== 0) process.exit(1);
}
const { startCluster, ensureDatabase } = await import('./stack/postgres.mjs');
const { ensureChromium, freePort } = await import('./stack/system.mjs');
const { stopChildren } = await import('./stack/children.mjs');
const { startMailDev, startPaymentFake } = await import('./stack/services.mjs');

const jestArgs = process.argv.slice(2);
const chromium = ensureChromium();
const tmp = mkdtempSync(path.join(os.tmpdir(), 'padside-test-'));
chmodSync(tmp, 0o755);
const ports = { pg: await freePort(), smtp: await freePort(), inbox: await freePort(), payments: await freePort() };
let cluster;
let code = 1;
try {
  console.log('padside test: starting a throwaway PostgreSQL, MailDev and payment fake');
  cluster = startCluster({ dataDir: path.join(tmp, 'postgres'), port: ports.pg });
  ensureDatabase({ bin: cluster.bin, port: ports.pg, database: 'padside_test' });
  await startMailDev({ smtpPort: ports.smtp, webPort: ports.inbox, quiet: true });
  await startPaymentFake({ port: ports.payments, quiet: true });

  const steps = [
    ['typecheck', 'npm', ['run', '-s', 'typecheck']],
    ['migrate the test database', process.execPath, ['node_modules/tsx/dist/cli.mjs', 'server/tasks/prepare-db.ts']],
    ['build the app for the browser tests', 'npx', ['ng', 'build', '--output-path', path.join(tmp, 'app')]],
    ['jest', process.execPath, ['node_modules/jest/bin/jest.js', ...jestArgs]],
  ];
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    DATABASE_URL: `postgres://padside@127.0.0.1:${ports.pg}/padside_test`,
    PG_BIN: cluster.bin,
    PG_DATA: path.join(tmp, 'postgres'),
    PGPORT: String(ports.pg),
    SMTP_URL: `smtp://127.0.0.1:${ports.smtp}`,
    SMTP_PORT: String(ports.smtp),
    MAILDEV_URL: `http://127.0.0.1:${ports.inbox}`,
    STRIPE_API_BASE: `http://127.0.0.1:${ports.payments}`,
    SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789',
    DATA_DIR: path.join(tmp, 'data'),
    CHROMIUM_PATH: chromium,
    BROWSER_DIST: process.env.PADSIDE_SKIP_BUILD ? '' : path.join(tmp, 'app', 'browser'),
    TEST_TMP: tmp,
  };
  code = 0;
  for (const [name, cmd, args] of steps) {
    if (process.env.PADSIDE_SKIP_BUILD && name.startsWith('build')) continue;
    if (process.env.PADSIDE_SKIP_TYPECHECK && name === 'typecheck') continue;
    console.log(`padside test: ${name}`);
    const r = spawnSync(cmd, args, { stdio: 'inherit', env });
    if (r.status !== 0) {
      code = r.status ?? 1;
      console.error(`padside test: ${name} failed`);
      break;
    }
  }
} catch (err) {
  console.error(err.message ?? err);
  code = 1;
} finally {
  await stopChildren();
  cluster?.stop();
  rmSync(tmp, { recursive: true, force: true });
}
process.exit(code);
