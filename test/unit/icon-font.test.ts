// The icon font is Material Icons cut to the names in src/icons/icon-names.json (scripts/build-icon-font.mjs).
// An icon a template shows but the cut font lacks would appear as its ligature's letters ("menu"), so these tests
// read every template for the icon names it uses and lay each out in the committed font.
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import * as fontkit from 'fontkit';

const root = path.resolve(__dirname, '../..');
const listed: string[] = JSON.parse(readFileSync(path.join(root, 'src/icons/icon-names.json'), 'utf8'));
const font = fontkit.create(readFileSync(path.join(root, 'src/icons/padside-icons.woff2')));
const full = fontkit.create(readFileSync(path.join(root, 'node_modules/material-icons/iconfont/material-icons.woff2')));
// Material's step header writes these ligatures itself (MatStepHeader: edit, done and error states).
const STEPPER_ICONS = ['create', 'done', 'warning'];

function sources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return sources(p);
    return /\.(ts|html)$/.test(e.name) && !e.name.endsWith('.spec.ts') ? [p] : [];
  });
}

/** Icon names the app's templates and navigation data name, found the ways the code writes them. */
function usedIcons(text: string): string[] {
  const found: string[] = [];
  for (const m of text.matchAll(/<mat-icon[^>]*>\s*([a-z0-9_]+)\s*<\/mat-icon>/g)) found.push(m[1]);
  for (const m of text.matchAll(/<mat-icon[^>]*>\s*\{\{([\s\S]*?)\}\}\s*<\/mat-icon>/g))
    for (const q of m[1].matchAll(/'([a-z0-9_]+)'/g)) found.push(q[1]);
  for (const m of text.matchAll(/\bicon="([a-z0-9_]+)"/g)) found.push(m[1]);
  for (const m of text.matchAll(/\bicon: '([a-z0-9_]+)'/g)) found.push(m[1]);
  for (const m of text.matchAll(/\bicon = input\('([a-z0-9_]+)'\)/g)) found.push(m[1]);
  return found;
}

/** The one glyph a ligature becomes, or undefined when the font spells it out letter by letter. */
function iconGlyph(f: fontkit.Font, name: string): number | undefined {
  const glyphs = f.layout(name).glyphs;
  return glyphs.length === 1 ? glyphs[0].id : undefined;
}

it('finds the icons the way the templates write them', () => {
  const sample = `<mat-icon aria-hidden="true">rocket</mat-icon> <mat-icon>{{ open() ? 'close' : 'menu' }}</mat-icon>
    <ps-empty-state icon="flag" /> { icon: 'tune' } readonly icon = input('inventory_2');`;
  expect(usedIcons(sample)).toEqual(['rocket', 'close', 'menu', 'flag', 'tune', 'inventory_2']);
});

it('lists every icon the app shows', () => {
  const used = new Set(sources(path.join(root, 'src/app')).flatMap((f) => usedIcons(readFileSync(f, 'utf8'))));
  expect(used.size).toBeGreaterThan(30);
  const appUsesStepper = sources(path.join(root, 'src/app')).some((f) =>
    readFileSync(f, 'utf8').includes('MatStepperModule'),
  );
  const needed = [...used, ...(appUsesStepper ? STEPPER_ICONS : [])];
  expect(needed.filter((n) => !listed.includes(n))).toEqual([]);
});

it('draws every listed icon as one glyph, as the full font does', () => {
  const missing = listed.filter((n) => iconGlyph(font, n) === undefined || iconGlyph(full, n) === undefined);
  expect(missing).toEqual([]);
});

it('leaves out the icons nobody uses, which is what makes it small', () => {
  expect(iconGlyph(full, 'star')).toBeDefined();
  expect(iconGlyph(font, 'star')).toBeUndefined();
  // The whole font is 129,560 bytes as woff2 (material-icons 1.13.14).
  expect(readFileSync(path.join(root, 'src/icons/padside-icons.woff2')).length).toBeLessThan(12_000);
});
