import { centsToDollars, dollarsToCents } from './dollars';

describe('dollarsToCents', () => {
  // IEEE 754 doubles: 0.29 * 100 is 28.999999999999996 and 1.005 * 100 is 100.49999999999999 (from memory; node prints both).
  it('gives whole cents for amounts that have no exact binary form', () => {
    expect(0.29 * 100).not.toBe(29);
    expect(dollarsToCents('0.29')).toBe(29);
    expect(dollarsToCents('19.99')).toBe(1999);
  });

  it('reads whole dollars, one decimal and numbers', () => {
    expect(dollarsToCents('45')).toBe(4500);
    expect(dollarsToCents('12.5')).toBe(1250);
    expect(dollarsToCents(7.25)).toBe(725);
  });
});

describe('centsToDollars', () => {
  it('always shows two decimals', () => {
    expect(centsToDollars(1250)).toBe('12.50');
    expect(centsToDollars(5)).toBe('0.05');
    expect(centsToDollars(0)).toBe('0.00');
  });
});
