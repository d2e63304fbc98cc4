// The suite's first step: ESLint (an error or a warning fails) and Prettier's check, over the paths given or the
// whole project. `npm run lint -- --fix` and `npm run format` repair what this reports.
import { spawnSync } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
const targets = process.argv.length > 2 ? process.argv.slice(2) : ['.'];
const checks = [
  ['lint', 'node_modules/eslint/bin/eslint.js', ['--max-warnings', '0', ...targets]],
  ['format', 'node_modules/prettier/bin/prettier.cjs', ['--check', '--log-level', 'warn', ...targets]],
];
let failed = false;
for (const [name, bin, args] of checks) {
  const r = spawnSync(process.execPath, [path.join(root, bin), ...args], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) {
    console.error(
      `padside style: ${name} found problems (run \`npm run ${name === 'lint' ? 'lint -- --fix' : 'format'}\`)`,
    );
    failed = true;
  }
}
process.exit(failed ? 1 : 0);
