import {
  IMPLIED_CONSENT_YEARS,
  impliedConsentHolds,
  impliedConsentLapsesOn,
} from '../../server/announcements/implied-consent';

// The two-year period after a purchase (and after a membership ends): from memory, Canada's anti-spam law on
// existing business and non-business relationships; see the regulator's CASL guidance.
describe('implied consent', () => {
  it('lasts two years (from memory)', () => {
    expect(IMPLIED_CONSENT_YEARS).toBe(2);
  });

  describe('for a purchase on 2025-03-10', () => {
    const purchase = '2025-03-10';
    it('lapses on 2027-03-10', () => {
      expect(impliedConsentLapsesOn(purchase)).toBe('2027-03-10');
    });
    it('still holds the day before, 2027-03-09', () => {
      expect(impliedConsentHolds(purchase, '2027-03-09')).toBe(true);
    });
    it('no longer holds on the day, 2027-03-10', () => {
      expect(impliedConsentHolds(purchase, '2027-03-10')).toBe(false);
    });
    it('no longer holds the day after, 2027-03-11', () => {
      expect(impliedConsentHolds(purchase, '2027-03-11')).toBe(false);
    });
    it('holds on the purchase day itself', () => {
      expect(impliedConsentHolds(purchase, purchase)).toBe(true);
    });
  });

  describe('across a year end', () => {
    it('for a membership that ended 2026-12-31 holds to 2028-12-30 and lapses on 2028-12-31', () => {
      expect(impliedConsentHolds('2026-12-31', '2028-12-30')).toBe(true);
      expect(impliedConsentHolds('2026-12-31', '2028-12-31')).toBe(false);
      expect(impliedConsentHolds('2026-12-31', '2029-01-01')).toBe(false);
    });
  });

  // Gregorian calendar: 2028 is a leap year, 2030 is not. The earlier day is chosen (common practice, no source).
  describe('for a purchase on 29 February 2028', () => {
    it('lapses on 2030-02-28, the last day of February two years on', () => {
      expect(impliedConsentLapsesOn('2028-02-29')).toBe('2030-02-28');
      expect(impliedConsentHolds('2028-02-29', '2030-02-27')).toBe(true);
      expect(impliedConsentHolds('2028-02-29', '2030-02-28')).toBe(false);
      expect(impliedConsentHolds('2028-02-29', '2030-03-01')).toBe(false);
    });
  });
});
