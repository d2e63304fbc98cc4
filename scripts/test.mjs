// `npm test`: the whole suite against a throwaway stack on free loopback ports; never touches `npm start` data.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
process.chdir(root);
if (!existsSync(path.join(root, 'node_modules'))) {
  if (spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { stdio: 'inherit' }).status !== 0) process.exit(1);
}
const { ensureChromium } = await import('./stack/system.mjs');
const { startThrowawayStack } = await import('./stack/throwaway.mjs');

const jestArgs = process.argv.slice(2);
if (!process.env.PADSIDE_SKIP_LINT) {
  console.log('padside test: lint and format');
  if (spawnSync(process.execPath, ['scripts/check-style.mjs'], { stdio: 'inherit' }).status !== 0) process.exit(1);
}
const chromium = ensureChromium();
let stack;
let code = 1;
try {
  console.log('padside test: starting a throwaway PostgreSQL, MailDev, payment fake and object store');
  stack = await startThrowawayStack('test');
  const skipBuild = Boolean(process.env.PADSIDE_SKIP_BUILD);
  const env = {
    ...stack.env,
    CHROMIUM_PATH: chromium,
    BROWSER_DIST: skipBuild ? '' : path.join(stack.tmp, 'app', 'browser'),
  };
  const steps = [
    ['typecheck', 'npm', ['run', '-s', 'typecheck'], !process.env.PADSIDE_SKIP_TYPECHECK],
    [
      'build the app for the browser tests',
      'npx',
      ['ng', 'build', '--output-path', path.join(stack.tmp, 'app')],
      !skipBuild,
    ],
    [
      'migrate the test database',
      process.execPath,
      ['node_modules/tsx/dist/cli.mjs', 'server/tasks/prepare-db.ts'],
      true,
    ],
    ['jest', process.execPath, ['node_modules/jest/bin/jest.js', ...jestArgs], true],
  ];
  code = 0;
  for (const [name, cmd, args, wanted] of steps) {
    if (!wanted) continue;
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
  await stack?.stop();
}
process.exit(code);
