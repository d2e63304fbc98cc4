import { createHmac, timingSafeEqual } from 'node:crypto';
import { isMailList, type MailList } from './topics';

/** A distinct label, so this key never equals the session key or any other key derived from the same secret. */
const DERIVATION_LABEL = 'padside/announcements/unsubscribe/v1';

/**
 * The unsubscribe link in every commercial mail: the address and list, signed with an HMAC. It works without
 * signing in and never expires (the law wants the link to keep working for a while after the send, from memory at
 * least 60 days); changing the secret revokes every link at once.
 */
export class UnsubscribeTokens {
  private readonly key: Buffer;

  constructor(
    sessionSecret: string,
    private readonly publicUrl: string,
  ) {
    this.key = createHmac('sha256', sessionSecret).update(DERIVATION_LABEL).digest();
  }

  /** The signed token for an address and list, with the address normalised so case and spaces do not make a second token. */
  tokenFor(email: string, topic: MailList): string {
    const body = Buffer.from(`${email.trim().toLowerCase()}\n${topic}`).toString('base64url');
    return `${body}.${this.sign(body)}`;
  }

  /** The one-click address for the `List-Unsubscribe` header (RFC 8058: POST without a session). */
  oneClickUrl(email: string, topic: MailList): string {
    return `${this.publicUrl}/api/subscriptions/unsubscribe?token=${this.tokenFor(email, topic)}`;
  }

  /** The page the footer links to: it shows the list and stops it with one button. */
  pageUrl(email: string, topic: MailList): string {
    return `${this.publicUrl}/subscriptions/unsubscribe?token=${this.tokenFor(email, topic)}`;
  }

  /** The address and list a token was made for, or null when it was not made here. */
  read(token: string): { email: string; topic: MailList } | null {
    const [body, sig] = token.split('.');
    if (!body || !sig) return null;
    const expected = Buffer.from(this.sign(body));
    const given = Buffer.from(sig);
    if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
    const [email, topic] = Buffer.from(body, 'base64url').toString('utf8').split('\n');
    return email && topic && isMailList(topic) ? { email, topic } : null;
  }

  private sign(body: string): string {
    return createHmac('sha256', this.key).update(body).digest('base64url');
  }
}
