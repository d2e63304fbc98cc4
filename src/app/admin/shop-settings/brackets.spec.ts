import { formatBrackets, parseBrackets } from './brackets';

describe('weight brackets as text', () => {
  it('reads what it writes', () => {
    const b = [
      { maxGrams: 500, priceCents: 900 },
      { maxGrams: null, priceCents: 2250 },
    ];
    expect(formatBrackets(b)).toBe('500 g: 9.00, any: 22.50');
    expect(parseBrackets('500 g: 9.00, any: 22.50')).toEqual(b);
  });
  it('refuses text it cannot read', () => {
    expect(parseBrackets('five hundred: 9')).toBeNull();
    expect(parseBrackets('')).toBeNull();
  });
});
