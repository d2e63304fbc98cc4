import { createHmac, timingSafeEqual } from 'node:crypto';

/** A distinct label, so this key never equals the session key or any other key derived from the same secret. */
const DERIVATION_LABEL = 'padside/shop/order-link/v1';

/**
 * The e-mailed "See your order" link: the order id plus an HMAC over the id and the order's e-mail address.
 *
 * Long-lived rather than single-use on purpose: the same link sits in the confirmation and the shipped notice and is
 * reopened to check tracking weeks later, and mail scanners that fetch every link would spend a single-use link
 * before the buyer clicks it. It only shows that one order (and lets a pending one be paid); changing the secret
 * revokes every link at once.
 */
export class OrderLinks {
  private readonly key: Buffer;

  constructor(
    sessionSecret: string,
    private readonly publicUrl: string,
  ) {
    this.key = createHmac('sha256', sessionSecret).update(DERIVATION_LABEL).digest();
  }

  /** The key for one order, bound to its e-mail address. */
  keyFor(orderId: number, email: string): string {
    return createHmac('sha256', this.key).update(`${orderId}\n${email.trim().toLowerCase()}`).digest('base64url');
  }

  /** The absolute link to the order page that opens it without an account. */
  urlFor(orderId: number, email: string): string {
    return `${this.publicUrl}/shop/orders/${orderId}?key=${this.keyFor(orderId, email)}`;
  }

  /** Whether a key sent with a request is the one for this order. */
  verify(orderId: number, email: string, sent: string): boolean {
    const expected = Buffer.from(this.keyFor(orderId, email));
    const given = Buffer.from(sent);
    return given.length === expected.length && timingSafeEqual(given, expected);
  }
}
