/** What a failed SMTP send means for the address: try again later, or never mail it again. */
export type SmtpVerdict = 'retry' | 'hard_bounce' | 'complaint';

const COMPLAINT_WORDS = /\b(spam|complain(t|ed)?|abuse|blocked? (by|for) (the )?(recipient|user))\b/i;

/**
 * Reads the server's reply to a failed send. A 5xx reply is permanent (RFC 5321 4.2.1); among those, an enhanced
 * status of class 5.7 (security or policy, RFC 3463 3.8) or a reply that speaks of spam or complaints counts as a
 * complaint, the rest (5.1.1 no such mailbox, 5.1.2 bad domain, ...) as a hard bounce. A 4xx reply or no reply at all
 * (connection refused, timeout) is temporary.
 */
export function smtpVerdict(responseCode: number | undefined, response: string | undefined): SmtpVerdict {
  if (!responseCode || responseCode < 500 || responseCode > 599) return 'retry';
  const text = response ?? '';
  if (/\b5\.7\.\d{1,3}\b/.test(text) || COMPLAINT_WORDS.test(text)) return 'complaint';
  return 'hard_bounce';
}
