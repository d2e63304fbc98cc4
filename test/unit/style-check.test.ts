// The suite's first step (scripts/check-style.mjs): a lint error, a lint warning or an unformatted file each fail it.
import { spawnSync } from 'node:child_process';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');
// Not in .gitignore: Prettier skips git-ignored files, so an ignored probe would never fail the format check.
const probeDir = path.join('test', `style-probe-${process.pid}`);

function checkStyle(name: string, text: string): { status: number | null; output: string } {
  const file = path.join(probeDir, name);
  writeFileSync(path.join(root, file), text);
  const r = spawnSync(process.execPath, ['scripts/check-style.mjs', file], { cwd: root, encoding: 'utf8' });
  return { status: r.status, output: `${r.stdout}${r.stderr}` };
}

beforeAll(() => mkdirSync(path.join(root, probeDir), { recursive: true }));
afterAll(() => rmSync(path.join(root, probeDir), { recursive: true, force: true }));

it('passes a tidy file, so the failures below come from what each probe breaks', () => {
  const r = checkStyle('tidy.ts', "export const greeting = 'hello';\n");
  expect(r.output).toBe('');
  expect(r.status).toBe(0);
});

it('fails on a lint error and names the rule', () => {
  const r = checkStyle('lint-error.ts', "const unused = 1;\nexport const greeting = 'hello';\n");
  expect(r.status).toBe(1);
  expect(r.output).toContain('@typescript-eslint/no-unused-vars');
  expect(r.output).toContain('padside style: lint found problems');
});

it('fails on a lint warning too (an unused disable comment)', () => {
  const r = checkStyle('lint-warning.ts', "// eslint-disable-next-line no-console\nexport const greeting = 'hello';\n");
  expect(r.status).toBe(1);
  expect(r.output).toMatch(/1 warning/);
  expect(r.output).toContain('padside style: lint found problems');
});

it('fails on a file Prettier would change, and names it', () => {
  const r = checkStyle('unformatted.ts', 'export const greeting   =   "hello"\n');
  expect(r.status).toBe(1);
  expect(r.output).toContain('unformatted.ts');
  expect(r.output).toContain('padside style: format found problems');
  expect(r.output).not.toContain('padside style: lint found problems');
});
