/**
 * A fresh key for one money request (sent as the Idempotency-Key header), so a double click or a retry of the same
 * request is answered once. getRandomValues works on plain http too, unlike randomUUID.
 */
export function newRequestKey(prefix = 'console'): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return `${prefix}-${Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('')}`;
}
