import { currentQuarter } from './period';

describe('currentQuarter', () => {
  it('should cover the calendar quarter of the day, ending on its last day', () => {
    expect(currentQuarter(new Date(2026, 11, 2))).toEqual({ from: '2026-10-01', to: '2026-12-31' });
    // 2028 is a leap year (Gregorian rule: divisible by 4, not by 100 unless by 400), but Q1 ends on March 31 anyway.
    expect(currentQuarter(new Date(2028, 1, 29))).toEqual({ from: '2028-01-01', to: '2028-03-31' });
    expect(currentQuarter(new Date(2026, 4, 15))).toEqual({ from: '2026-04-01', to: '2026-06-30' });
  });
});
