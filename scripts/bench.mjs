// `npm run bench`: benchmarks against a throwaway stack; prints a table and writes bench/results.json.
// `npm run bench -- --front-end`: the bundle size and Lighthouse only, printed, results.json untouched.
// `npm run bench -- --back-end`: the server's benchmarks only (no app build, no Lighthouse), printed likewise.
// `--cpu-prof` (with either): a V8 CPU profile of the benchmark process, in $TMPDIR/padside-cpu-prof/.
// Never part of `npm test`.
import { spawnSync } from 'node:child_process';
import os from 'node:os';
import path from 'node:path';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
process.chdir(root);
const { ensureChromium } = await import('./stack/system.mjs');
const { startThrowawayStack } = await import('./stack/throwaway.mjs');

const stack = await startThrowawayStack('bench');
let code = 1;
try {
  const appDist = path.join(stack.tmp, 'app');
  const env = {
    ...stack.env,
    CHROMIUM_PATH: ensureChromium(),
    BENCH_APP_DIST: appDist,
    BENCH_EMPTY_DIST: path.join(stack.tmp, 'empty-app'),
    // The app under Lighthouse serves this run's build, not whatever dist/ holds.
    BROWSER_DIST: path.join(appDist, 'browser'),
    ...(process.argv.includes('--front-end') ? { BENCH_ONLY: 'front-end' } : {}),
    ...(process.argv.includes('--back-end') ? { BENCH_ONLY: 'back-end' } : {}),
    ...(process.argv.includes('--cpu-prof') ? { BENCH_CPU_PROF: '1' } : {}),
  };
  // The server runs inside the benchmark process, so its profile is the server's (and the load generator's).
  const profile = process.argv.includes('--cpu-prof')
    ? ['--cpu-prof', '--cpu-prof-dir', path.join(os.tmpdir(), 'padside-cpu-prof')]
    : [];
  const run = (cmd, args) => spawnSync(cmd, args, { stdio: 'inherit', env }).status === 0;
  const builds =
    env.BENCH_ONLY === 'back-end' ||
    (run('npx', ['ng', 'build', '--output-path', env.BENCH_APP_DIST]) &&
      run('npx', [
        'ng',
        'build',
        '--configuration',
        'production',
        '--project',
        'empty-app',
        '--output-path',
        env.BENCH_EMPTY_DIST,
      ]));
  const ok =
    builds &&
    // The demo catalogue, so the catalogue benchmark serves real products.
    run(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'server/tasks/prepare-db.ts', '--demo-seed']) &&
    run(process.execPath, [...profile, '--import', 'tsx', 'bench/run-all.ts']);
  code = ok ? 0 : 1;
} finally {
  await stack.stop();
}
process.exit(code);
