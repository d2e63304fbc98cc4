import { FormControl } from '@angular/forms';
import { classListValidator, formatClassList, parseClassList } from './impulse-class-list';

describe('parseClassList', () => {
  it('should read letters and ranges in any case, each class once, in order', () => {
    expect(parseClassList('A-G')).toEqual(['A', 'B', 'C', 'D', 'E', 'F', 'G']);
    expect(parseClassList('i, h  j – l')).toEqual(['H', 'I', 'J', 'K', 'L']);
    expect(parseClassList('A-C, B')).toEqual(['A', 'B', 'C']);
    expect(parseClassList('  ')).toEqual([]);
  });

  it('should refuse what is not a class letter or a forward range', () => {
    for (const text of ['A-G, 7', 'G-A', 'AB', 'A-B-C', 'A-', 'Ä']) expect(parseClassList(text)).toBeNull();
  });
});

describe('formatClassList', () => {
  it('should write runs as ranges and pairs as two letters', () => {
    expect(formatClassList(['A', 'B', 'C', 'D', 'E', 'F', 'G'])).toBe('A-G');
    expect(formatClassList(['I', 'H'])).toBe('H, I');
    expect(formatClassList(['A', 'C', 'D', 'E', 'M'])).toBe('A, C-E, M');
    expect(formatClassList([])).toBe('');
  });

  it('should give back the same classes when its text is read again', () => {
    const classes = ['A', 'B', 'D', 'F', 'G', 'H', 'Z'];
    expect(parseClassList(formatClassList(classes))).toEqual(classes);
  });
});

describe('classListValidator', () => {
  it('should put its message on the field', () => {
    expect(classListValidator(new FormControl('A-G', { nonNullable: true }))).toBeNull();
    expect(classListValidator(new FormControl('A-G, 7', { nonNullable: true }))).toEqual({
      classes: expect.stringContaining('"A-G"'),
    });
  });
});
