import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { SPONSORS } from '../../seeds/04_build_logs_sponsors';

/**
 * Demo businesses are invented words, not a real place or weather word plus a trade, which real firms use.
 * The list holds the regional words the demo once leaned on and their neighbours (from memory, no source).
 */
const REGIONAL_WORDS =
  /\b(prairie|red river|assiniboine|chinook|loonie|manitoba|winnipeg|brandon|interlake|pembina|whiteshell|souris|qu'appelle|canadian)\b/i;
const root = path.join(__dirname, '..', '..');

describe('the demo businesses', () => {
  it('have invented names, not regional words', () => {
    expect(SPONSORS.map((s) => s.name).filter((n) => REGIONAL_WORDS.test(n))).toEqual([]);
    expect(SPONSORS.map((s) => s.website).filter((w) => REGIONAL_WORDS.test(w.replace(/-/g, ' ')))).toEqual([]);
  });

  it('are credited in the demo build logs under those names only', () => {
    const slugs = new Set(
      SPONSORS.map((s) =>
        s.name
          .toLowerCase()
          .replace(/[^a-z0-9]+/g, '-')
          .replace(/^-|-$/g, ''),
      ),
    );
    for (const file of readdirSync(path.join(root, 'content')).filter((f) => f.endsWith('.md'))) {
      const text = readFileSync(path.join(root, 'content', file), 'utf8');
      for (const [, slug] of text.matchAll(/^%thanks ([a-z0-9-]+)/gm))
        expect({ file, slug, known: slugs.has(slug) }).toEqual({ file, slug, known: true });
      expect({ file, regional: text.match(/\b(?:Red River|Chinook|Loonie|Prairie Volt)\b/g) }).toEqual({
        file,
        regional: null,
      });
    }
  });
});
