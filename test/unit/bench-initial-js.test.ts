// The bench's "initial JS" figure: what the browser fetches before any lazy route. Angular's build lists at most ten
// module preloads in the page, so the figure must follow the chunks' own static imports to count the rest.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { initialJsGzipBytes } from '../../bench/front-end';

let dir: string;
const files: Record<string, string> = {
  'index.csr.html':
    '<html><head></head><body><link rel="modulepreload" href="chunk-A.js"><script src="main-X.js" type="module"></script></body></html>',
  'main-X.js': 'import{a}from"./chunk-A.js";import"./chunk-B.js";const r=()=>import("./chunk-LAZY.js");a(r);',
  'chunk-A.js': 'import{c}from"./chunk-C.js";export const a=c;',
  'chunk-B.js': 'console.log("b");',
  'chunk-C.js': 'export const c=(f)=>f;',
  'chunk-LAZY.js': 'import{c}from"./chunk-D.js";export const lazy=c;',
  'chunk-D.js': 'export const c=1;',
};
const gz = (name: string) => gzipSync(Buffer.from(files[name]), { level: 9 }).length;

beforeAll(() => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'padside-initial-js-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(path.join(dir, name), text);
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

it('counts the entry, its preloads and every chunk they import statically, each once, and no lazy chunk', () => {
  expect(initialJsGzipBytes(dir)).toBe(gz('main-X.js') + gz('chunk-A.js') + gz('chunk-B.js') + gz('chunk-C.js'));
});
