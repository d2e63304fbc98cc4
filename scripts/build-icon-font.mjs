// `node scripts/build-icon-font.mjs`: writes src/icons/padside-icons.woff2, the Material Icons font (Apache-2.0,
// from the material-icons package) cut down to the icons named in src/icons/icon-names.json. The whole font is
// 129 kB, the largest file a phone fetched for a public page; the cut keeps each icon's ligature (so templates still
// write `<mat-icon>menu</mat-icon>`) and weighs a few kB. Run it after adding a name to the list;
// test/unit/icon-font.test.ts fails while a used icon is missing from the font.
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import * as fontkit from 'fontkit';
import subsetFont from 'subset-font';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const source = path.join(root, 'node_modules/material-icons/iconfont/material-icons.woff2');
const names = JSON.parse(readFileSync(path.join(root, 'src/icons/icon-names.json'), 'utf8'));
const font = fontkit.create(readFileSync(source));

// The letters a ligature is typed with, and each icon's own private-use code point. Without layout closure the
// subsetter keeps only these glyphs, so only the listed ligatures survive (with it, every icon would).
const privateUse = new Map(
  font.characterSet.filter((cp) => cp >= 0xe000).map((cp) => [font.glyphForCodePoint(cp).id, cp]),
);
let text = 'abcdefghijklmnopqrstuvwxyz0123456789_';
for (const name of names) {
  const glyphs = font.layout(name).glyphs;
  const cp = glyphs.length === 1 ? privateUse.get(glyphs[0].id) : undefined;
  if (cp === undefined) throw new Error(`"${name}" is not an icon of the Material Icons font`);
  text += String.fromCodePoint(cp);
}
const out = await subsetFont(readFileSync(source), text, { targetFormat: 'woff2', noLayoutClosure: true });
writeFileSync(path.join(root, 'src/icons/padside-icons.woff2'), out);
console.log(`src/icons/padside-icons.woff2: ${names.length} icons, ${out.length} bytes`);
