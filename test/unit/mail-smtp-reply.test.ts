import { smtpVerdict } from '../../server/mail/smtp-reply';

// Reply codes: RFC 5321 4.2.1 (4yz transient, 5yz permanent); enhanced status codes: RFC 3463 (5.1.1 bad mailbox,
// 5.1.2 bad system, 5.2.2 mailbox full, 5.7.1 delivery not authorized / policy).
describe('what an SMTP refusal means for the address', () => {
  it('retries when no reply came (server down)', () => {
    expect(smtpVerdict(undefined, 'connect ECONNREFUSED 127.0.0.1:2525')).toBe('retry');
  });
  it('retries a 4xx reply (greylisting, mailbox busy)', () => {
    expect(smtpVerdict(451, '451 4.7.1 Greylisted, try again later')).toBe('retry');
    expect(smtpVerdict(421, '421 4.3.2 Service shutting down')).toBe('retry');
  });
  it('calls 550 5.1.1 (no such mailbox) a hard bounce', () => {
    expect(smtpVerdict(550, '550 5.1.1 <nobody@example.test>: Recipient address rejected: User unknown')).toBe(
      'hard_bounce',
    );
  });
  it('calls 553 5.1.2 (bad domain) a hard bounce', () => {
    expect(smtpVerdict(553, '553 5.1.2 The address does not exist')).toBe('hard_bounce');
  });
  it('calls a 5.7.x policy refusal a complaint', () => {
    expect(smtpVerdict(550, '550 5.7.1 Message rejected by the recipient')).toBe('complaint');
  });
  it('calls a refusal that speaks of spam a complaint', () => {
    expect(smtpVerdict(554, '554 Rejected: reported as spam by the user')).toBe('complaint');
  });
});
