import { TestBed } from '@angular/core/testing';
import { DateAdapter } from '@angular/material/core';
import { fromIsoDate, provideClubDates, toIsoDate } from './club-date-adapter';

describe('club dates', () => {
  it('should read and show dates as YYYY-MM-DD, the en-CA short form (CLDR en-CA date formats, from memory)', () => {
    TestBed.configureTestingModule({ providers: [provideClubDates()] });
    const adapter = TestBed.inject(DateAdapter<Date>);
    const typed = adapter.parse('1991-05-05', ['yyyy-MM-dd']);
    expect(adapter.isValid(typed!)).toBe(true);
    expect(adapter.format(typed!, 'yyyy-MM-dd')).toBe('1991-05-05');
    expect(adapter.isValid(adapter.parse('05/05/1991', ['yyyy-MM-dd'])!)).toBe(false);
    // Weeks in the picker start on Sunday in en-CA.
    expect(adapter.getFirstDayOfWeek()).toBe(0);
  });

  it('should keep the calendar day between the picker and the API, whatever the time of day', () => {
    expect(toIsoDate(new Date(2026, 11, 31, 23, 59))).toBe('2026-12-31');
    expect(toIsoDate(new Date(2027, 0, 1, 0, 0))).toBe('2027-01-01');
    expect(toIsoDate(null)).toBe('');
    expect(toIsoDate(new Date(NaN))).toBe('');
    const back = fromIsoDate('2027-03-31')!;
    expect([back.getFullYear(), back.getMonth(), back.getDate()]).toEqual([2027, 2, 31]);
    expect(fromIsoDate(null)).toBeNull();
    expect(fromIsoDate('2027-02-30')).toBeNull();
  });
});
