import { CheckInTokens } from '../../server/membership/check-in-token';
import { dueReminder } from '../../server/membership/membership-jobs';

describe('check-in tokens', () => {
  const tokens = new CheckInTokens('a-session-secret-that-is-long-enough-for-tests-000');
  const token = tokens.sign('01042', new Date('2026-06-01T12:00:00Z'));

  it('verifies a token it signed', () => {
    expect(tokens.verify(token)).toEqual({ memberNumber: '01042', issuedAt: new Date('2026-06-01T12:00:00Z') });
  });

  it('refuses a token with a changed member number, time or signature', () => {
    const [v, , issued, mac] = token.split('.');
    expect(tokens.verify(`${v}.01043.${issued}.${mac}`)).toBeNull();
    expect(tokens.verify(`${v}.01042.${Number(issued) + 1}.${mac}`)).toBeNull();
    expect(tokens.verify(token.slice(0, -1) + (token.endsWith('A') ? 'B' : 'A'))).toBeNull();
    expect(tokens.verify('nonsense')).toBeNull();
  });

  it('refuses a token signed with another secret', () => {
    expect(new CheckInTokens('another-secret-that-is-also-long-enough-000000').verify(token)).toBeNull();
  });
});

describe('which reminder is due', () => {
  it('picks the window by days to the term end (common practice, no source)', () => {
    expect(dueReminder('2026-11-30', '2026-12-31')).toBeNull();
    expect(dueReminder('2026-12-01', '2026-12-31')).toBe('due-30');
    expect(dueReminder('2026-12-24', '2026-12-31')).toBe('due-7');
    expect(dueReminder('2026-12-31', '2026-12-31')).toBe('due-today');
    expect(dueReminder('2027-01-14', '2026-12-31')).toBe('overdue-14');
    expect(dueReminder('2027-01-22', '2026-12-31')).toBeNull();
  });
});
