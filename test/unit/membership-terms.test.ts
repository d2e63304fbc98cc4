import { dateInZone } from '../../server/platform/clock';
import {
  addDays,
  ageOn,
  duesFor,
  isJuniorOn,
  isLeapYear,
  newTerm,
  renewalOpensOn,
  statusOn,
  termForPayment,
  type TermPolicy,
} from '../../server/membership/terms';

// The demo club: calendar year, late-season from Sep 1, 30-day grace, no proration.
const calendar: TermPolicy = { rule: 'calendar', lateSeasonFrom: '09-01', graceDays: 30, prorate: false };
const anniversary: TermPolicy = { ...calendar, rule: 'anniversary' };

describe('term arithmetic', () => {
  describe('joins under the calendar rule', () => {
    it('covers the calendar year for a Jan 1 join', () => {
      expect(termForPayment('2027-01-01', null, calendar)).toEqual({
        start: '2027-01-01',
        end: '2027-12-31',
        renewal: false,
      });
    });

    // Late-season rule: common practice, no source. Aug 31 is the last day before it applies.
    it('ends this Dec 31 for an Aug 31 join', () => {
      expect(newTerm('2026-08-31', calendar)).toEqual({ start: '2026-08-31', end: '2026-12-31' });
    });

    it('covers the rest of the year and all of next for a Sep 1 join (late-season rule: common practice, no source)', () => {
      expect(newTerm('2026-09-01', calendar)).toEqual({ start: '2026-09-01', end: '2027-12-31' });
    });
  });

  describe('the anniversary rule', () => {
    it('ends the day before the anniversary', () => {
      expect(newTerm('2026-03-15', anniversary)).toEqual({ start: '2026-03-15', end: '2027-03-14' });
    });

    // Gregorian rule: a year divisible by 4 is leap, except centuries not divisible by 400 (so 2028 leap, 2029 not, 1900 not, 2000 leap).
    it('ends a Feb 29 start on Feb 28 of the next year', () => {
      expect([isLeapYear(2028), isLeapYear(2029), isLeapYear(1900), isLeapYear(2000)]).toEqual([
        true,
        false,
        false,
        true,
      ]);
      expect(newTerm('2028-02-29', anniversary)).toEqual({ start: '2028-02-29', end: '2029-02-28' });
    });

    it('renews a term ending Feb 28 into one ending Feb 28 again', () => {
      expect(termForPayment('2029-02-20', '2029-02-28', anniversary)).toEqual({
        start: '2029-03-01',
        end: '2030-02-28',
        renewal: true,
      });
    });
  });

  describe('renewals', () => {
    it('extends an early renewal from the current term end, not from today', () => {
      expect(termForPayment('2026-11-10', '2026-12-31', calendar)).toEqual({
        start: '2027-01-01',
        end: '2027-12-31',
        renewal: true,
      });
      expect(termForPayment('2026-11-10', '2027-03-14', anniversary)).toEqual({
        start: '2027-03-15',
        end: '2028-03-14',
        renewal: true,
      });
    });

    it('extends a renewal in grace from the old end', () => {
      expect(termForPayment('2027-01-20', '2026-12-31', calendar)).toEqual({
        start: '2027-01-01',
        end: '2027-12-31',
        renewal: true,
      });
      expect(termForPayment('2027-01-30', '2026-12-31', calendar).renewal).toBe(true);
    });

    it('starts a new term after grace has run out', () => {
      expect(termForPayment('2027-01-31', '2026-12-31', calendar)).toEqual({
        start: '2027-01-31',
        end: '2027-12-31',
        renewal: false,
      });
      expect(termForPayment('2027-10-02', '2026-12-31', calendar)).toEqual({
        start: '2027-10-02',
        end: '2028-12-31',
        renewal: false,
      });
    });
  });

  describe('when renewal opens', () => {
    it('opens one year before the paid term ends, so nobody pays two terms ahead', () => {
      expect(renewalOpensOn('2026-12-31')).toBe('2026-01-01');
      expect(renewalOpensOn('2027-12-31')).toBe('2027-01-01');
      expect(renewalOpensOn('2028-03-14')).toBe('2027-03-15');
    });

    it('keeps a leap-day end on a real date', () => {
      // 2027-02-29 does not exist; the year before a Feb 29 end is Mar 1, 2027, and renewal opens the day after.
      expect(renewalOpensOn('2028-02-29')).toBe('2027-03-02');
    });
  });

  describe('status', () => {
    it('is active to the end, lapsing through grace, lapsed after, pending with no term', () => {
      expect(statusOn('2026-12-31', '2026-12-31', calendar)).toBe('active');
      expect(statusOn('2027-01-01', '2026-12-31', calendar)).toBe('lapsing');
      expect(statusOn('2027-01-30', '2026-12-31', calendar)).toBe('lapsing');
      expect(statusOn('2027-01-31', '2026-12-31', calendar)).toBe('lapsed');
      expect(statusOn('2027-01-05', '2026-12-31', calendar, true)).toBe('lapsed');
      expect(statusOn('2027-01-05', null, calendar)).toBe('pending');
    });
  });

  describe('junior age on the first day of the term', () => {
    it('is not junior for someone born on that day 18 years earlier', () => {
      expect(ageOn('2009-01-01', '2027-01-01')).toBe(18);
      expect(isJuniorOn('2009-01-01', '2027-01-01')).toBe(false);
    });

    it('is junior the day before the 18th birthday', () => {
      expect(isJuniorOn('2009-01-02', '2027-01-01')).toBe(true);
    });

    it('counts a Feb 29 birthday as reached on Mar 1 in a common year (common practice, no source)', () => {
      expect(ageOn('2008-02-29', '2026-02-28')).toBe(17);
      expect(ageOn('2008-02-29', '2026-03-01')).toBe(18);
    });
  });

  describe('the club time zone at midnight', () => {
    // 2027-01-01T03:30Z is 21:30 on Dec 31 in Winnipeg (CST, UTC-6; IANA tz database "America/Winnipeg").
    const instant = new Date('2027-01-01T03:30:00Z');

    it('takes the date in Winnipeg, not in UTC', () => {
      expect(dateInZone(instant, 'America/Winnipeg')).toBe('2026-12-31');
      expect(dateInZone(instant, 'UTC')).toBe('2027-01-01');
    });

    it('keeps a term ending Dec 31 active at that instant, where UTC would call it lapsing', () => {
      expect(statusOn(dateInZone(instant, 'America/Winnipeg'), '2026-12-31', calendar)).toBe('active');
      expect(statusOn(dateInZone(instant, 'UTC'), '2026-12-31', calendar)).toBe('lapsing');
    });

    it('starts an anniversary term on the Winnipeg date', () => {
      expect(newTerm(dateInZone(instant, 'America/Winnipeg'), anniversary)).toEqual({
        start: '2026-12-31',
        end: '2027-12-30',
      });
    });
  });

  describe('proration (off for the demo club)', () => {
    it('charges full dues when off, and the months left when on, before the late-season date', () => {
      const term = termForPayment('2027-04-10', null, calendar);
      expect(duesFor(4500, term, calendar)).toBe(4500);
      // April to December is 9 of 12 months: 4500 * 9 / 12 = 3375 (arithmetic).
      expect(duesFor(4500, term, { ...calendar, prorate: true })).toBe(3375);
      expect(duesFor(4500, termForPayment('2027-09-10', null, calendar), { ...calendar, prorate: true })).toBe(4500);
    });
  });

  it('adds days across a leap day (Gregorian calendar)', () => {
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2027-02-28', 1)).toBe('2027-03-01');
  });
});
