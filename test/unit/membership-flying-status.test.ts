import { flyingVerdict, withVoidedVerifications } from '../../server/membership/flying-status';
import type { MembershipRow } from '../../server/membership/membership-repository';

// Padside's own rule, no outside source: "may fly" needs dues in good standing (active or in grace) and an
// association membership that is on file, not expired on `today`, and verified by staff.
const at = new Date('2028-04-10T17:00:00Z');
const row = (over: Partial<MembershipRow> = {}): MembershipRow =>
  ({
    term_end: '2028-12-31',
    association_number: 'NA-1',
    association_expires: '2028-06-30',
    association_verified_at: at,
    association_verified_by: 7,
    association_verified_against: 'card',
    certification_level: 'L1',
    certification_date: null,
    certification_verified_at: null,
    certification_verified_by: null,
    certification_verified_against: null,
    ...over,
  }) as MembershipRow;

describe('flyingVerdict', () => {
  it('should say may fly with current dues and a verified, current association', () => {
    const v = flyingVerdict(row(), 'active', '2028-04-10');
    expect(v.mayFly).toBe(true);
    expect(v.association).toEqual({
      answer: 'verified',
      number: 'NA-1',
      expires: '2028-06-30',
      verified: { at, byUserId: 7, against: 'card' },
    });
    expect(v.certification.answer).toBe('claimed');
  });

  it('should count dues in grace as current for flying, and not lapsed dues', () => {
    expect(flyingVerdict(row(), 'lapsing', '2028-04-10')).toEqual(
      expect.objectContaining({ mayFly: true, dues: { answer: 'grace', termEnd: '2028-12-31' } }),
    );
    expect(flyingVerdict(row(), 'lapsed', '2028-04-10').mayFly).toBe(false);
  });

  it('should treat an unverified association as a claim, whatever its expiry', () => {
    const v = flyingVerdict(
      row({ association_verified_at: null, association_verified_against: null, association_expires: '2099-12-31' }),
      'active',
      '2028-04-10',
    );
    expect(v.association.answer).toBe('claimed');
    expect(v.mayFly).toBe(false);
  });

  it('should say expired from the day after the expiry, verified or not', () => {
    expect(flyingVerdict(row(), 'active', '2028-06-30').association.answer).toBe('verified');
    expect(flyingVerdict(row(), 'active', '2028-07-01')).toEqual(
      expect.objectContaining({ mayFly: false, association: expect.objectContaining({ answer: 'expired' }) }),
    );
  });

  it('should say not on file without a number or an expiry', () => {
    expect(flyingVerdict(row({ association_number: null }), 'active', '2028-04-10').association.answer).toBe(
      'not_on_file',
    );
    expect(flyingVerdict(row({ association_expires: null }), 'active', '2028-04-10').association.answer).toBe(
      'not_on_file',
    );
  });

  it('should answer none, claimed or verified for the certification', () => {
    expect(flyingVerdict(row({ certification_level: 'none' }), 'active', '2028-04-10').certification.answer).toBe(
      'none',
    );
    expect(
      flyingVerdict(
        row({ certification_verified_at: at, certification_verified_against: 'certificate' }),
        'active',
        '2028-04-10',
      ).certification.answer,
    ).toBe('verified');
  });
});

describe('withVoidedVerifications', () => {
  const verified = row({
    association_expires: '2028-06-30',
    certification_verified_at: at,
    certification_verified_by: 7,
    certification_verified_against: 'certificate',
  });

  it('should void the association verification when the number or the expiry changes', () => {
    expect(withVoidedVerifications(verified, { association_expires: '2099-12-31' })).toEqual({
      association_expires: '2099-12-31',
      association_verified_at: null,
      association_verified_by: null,
      association_verified_against: null,
    });
    expect(withVoidedVerifications(verified, { association_number: 'NA-2' })).toHaveProperty(
      'association_verified_at',
      null,
    );
  });

  it('should void the certification verification when the level or date changes, and only that one', () => {
    const out = withVoidedVerifications(verified, { certification_level: 'L3' });
    expect(out).toHaveProperty('certification_verified_at', null);
    expect(out).not.toHaveProperty('association_verified_at');
  });

  it('should void nothing when the same values come again (a date read back as a Date object)', () => {
    expect(
      withVoidedVerifications(verified, {
        association_number: 'NA-1',
        association_expires: '2028-06-30',
        certification_level: 'L1',
        certification_date: null,
        phone: '1',
      }),
    ).toEqual({
      association_number: 'NA-1',
      association_expires: '2028-06-30',
      certification_level: 'L1',
      certification_date: null,
      phone: '1',
    });
  });
});
