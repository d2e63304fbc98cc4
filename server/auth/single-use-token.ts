import { createHash, randomBytes } from 'node:crypto';

/** A random token for a link, and the hash we store (the token itself never touches the database). */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
