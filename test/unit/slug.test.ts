import { slugify, uniqueSlug } from '../../server/platform/slug';

describe('the one slug rule for products, posts and sponsors', () => {
  it('drops accents instead of splitting the word at them', () => {
    // Unicode NFKD decomposes é into e + U+0301 COMBINING ACUTE ACCENT (Unicode Standard, chapter 3.11); the mark goes.
    expect(slugify('Crème Brûlée Tee')).toBe('creme-brulee-tee');
    expect(slugify('Zoë’s Ørsted patch')).toBe('zoe-s-rsted-patch');
  });

  it('spells out the ampersand, keeps single hyphens and never ends on one when cut short', () => {
    expect(slugify('Thrust & Filament')).toBe('thrust-and-filament');
    expect(slugify('  --Season  2026--  ')).toBe('season-2026');
    expect(slugify('abcdefghij klmnop', 11)).toBe('abcdefghij');
    expect(slugify('!!!')).toBe('untitled');
  });

  it('numbers a taken slug from 2 upward', () => {
    expect(uniqueSlug('tee', new Set())).toBe('tee');
    expect(uniqueSlug('tee', new Set(['tee', 'tee-2']))).toBe('tee-3');
  });
});
