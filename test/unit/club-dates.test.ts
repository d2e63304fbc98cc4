import {
  clubTimeInWords,
  formatClock,
  formatDate,
  formatDateTime,
  formatDay,
  formatMonth,
  formatTime,
  isoDateInZone,
  isoInZone,
  zonedHeader,
} from '../../contracts/dates/club-dates';

const WPG = 'America/Winnipeg';

// The switches: IANA tz database, file `northamerica`, "Rule Canada 2007 max": clocks go forward at 2:00 local on the
// second Sunday of March (2026-03-08, 08:00 UTC) and back at 2:00 local on the first Sunday of November
// (2026-11-01, 07:00 UTC); America/Winnipeg follows Rule Canada with standard offset -6:00.
describe('club dates across the spring switch, 2026-03-08 in America/Winnipeg', () => {
  it('reads the last minute of standard time at -06:00', () => {
    const before = new Date('2026-03-08T07:59:30Z');
    expect(isoInZone(before, WPG)).toBe('2026-03-08T01:59-06:00');
    expect(formatDateTime(before, WPG)).toBe('Mar 8, 2026, 1:59 a.m.');
  });

  it('jumps from 1:59 to 3:00 and reads daylight time at -05:00', () => {
    const after = new Date('2026-03-08T08:00:00Z');
    expect(isoInZone(after, WPG)).toBe('2026-03-08T03:00-05:00');
    expect(formatTime(after, WPG)).toBe('3:00 a.m.');
  });
});

describe('club dates across the autumn switch, 2026-11-01 in America/Winnipeg', () => {
  it('tells the two 1:30 a.m. apart by their offsets in CSV cells', () => {
    expect(isoInZone(new Date('2026-11-01T06:30:00Z'), WPG)).toBe('2026-11-01T01:30-05:00');
    expect(isoInZone(new Date('2026-11-01T07:30:00Z'), WPG)).toBe('2026-11-01T01:30-06:00');
  });

  it('shows both to people as the same wall-clock time, without seconds', () => {
    expect(formatTime(new Date('2026-11-01T06:30:45Z'), WPG)).toBe('1:30 a.m.');
    expect(formatTime(new Date('2026-11-01T07:30:45Z'), WPG)).toBe('1:30 a.m.');
  });
});

describe('the club-time calendar date of an instant', () => {
  it('is still the day before when UTC has passed midnight', () => {
    // 05:59 UTC on 8 March is 23:59 on 7 March at -06:00.
    expect(isoDateInZone(new Date('2026-03-08T05:59:00Z'), WPG)).toBe('2026-03-07');
    expect(formatDate(new Date('2026-03-08T05:59:00Z'), WPG)).toBe('Mar 7, 2026');
    expect(isoDateInZone(new Date('2026-03-08T06:00:00Z'), WPG)).toBe('2026-03-08');
  });

  it('accepts the ISO text an API answer carries', () => {
    expect(formatDateTime('2026-11-01T17:05:09.123Z', WPG)).toBe('Nov 1, 2026, 11:05 a.m.');
  });
});

describe('dates and times stored without a zone', () => {
  it('reads a calendar date the same in any process time zone', () => {
    expect(formatDay('2026-03-08')).toBe('Mar 8, 2026');
    expect(formatDay('2026-12-31')).toBe('Dec 31, 2026');
  });

  it('reads a month of the books as a short month name and the year, and leaves anything else as it came', () => {
    // en-CA short month names as CLDR gives them (the data Intl ships).
    expect(formatMonth('2026-12')).toBe('Dec 2026');
    expect(formatMonth('2027-01')).toBe('Jan 2027');
    expect(formatMonth('December')).toBe('December');
  });

  it('reads a launch window time in the same words', () => {
    expect(formatClock('09:00')).toBe('9:00 a.m.');
    expect(formatClock('17:30')).toBe('5:30 p.m.');
  });

  it('leaves text that is not a date as it is', () => {
    expect(formatDay('soon')).toBe('soon');
  });
});

describe('the zone in words', () => {
  it('names the city for pages and the tz database name for CSV headers', () => {
    expect(clubTimeInWords(WPG)).toBe('club time (Winnipeg)');
    expect(clubTimeInWords('America/Rankin_Inlet')).toBe('club time (Rankin Inlet)');
    expect(zonedHeader('Paid at', WPG)).toBe('Paid at (America/Winnipeg)');
  });
});
