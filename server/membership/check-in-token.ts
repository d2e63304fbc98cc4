import { createHmac, timingSafeEqual } from 'node:crypto';

/** A distinct label, so this key never equals the session key or any other key derived from the same secret. */
const DERIVATION_LABEL = 'padside/membership/check-in-token/v1';

/** Signs and verifies the token on a member card: `v1.<member number>.<issued, unix seconds>.<HMAC-SHA256>`. */
export class CheckInTokens {
  private readonly key: Buffer;

  constructor(sessionSecret: string) {
    this.key = createHmac('sha256', sessionSecret).update(DERIVATION_LABEL).digest();
  }

  /** The token for a member number, issued at `issuedAt`. */
  sign(memberNumber: string, issuedAt: Date): string {
    const body = `v1.${memberNumber}.${Math.floor(issuedAt.getTime() / 1000)}`;
    return `${body}.${this.mac(body)}`;
  }

  /** The member number in a token whose signature matches, or null for anything else. */
  verify(token: string): { memberNumber: string; issuedAt: Date } | null {
    const m = /^v1\.([0-9A-Za-z-]{1,16})\.(\d{1,12})\.([A-Za-z0-9_-]{43})$/.exec(token.trim());
    if (!m) return null;
    const expected = Buffer.from(this.mac(`v1.${m[1]}.${m[2]}`));
    const sent = Buffer.from(m[3]);
    if (sent.length !== expected.length || !timingSafeEqual(sent, expected)) return null;
    return { memberNumber: m[1], issuedAt: new Date(Number(m[2]) * 1000) };
  }

  private mac(body: string): string {
    return createHmac('sha256', this.key).update(body).digest('base64url');
  }
}
