// fxa-common-password-list ships the 10,000 most common passwords (ASVS 4.0.3 2.1.7).
// eslint-disable-next-line @typescript-eslint/no-require-imports
const commonPasswords: { test(password: string): boolean } = require('fxa-common-password-list');

import { PASSWORD_MAX, PASSWORD_MIN } from '../../contracts/account/account-schemas';

export { PASSWORD_MAX, PASSWORD_MIN };

/**
 * Length and blocklist only, no composition rules (OWASP ASVS 4.0.3 2.1.1, 2.1.2, 2.1.7, 2.1.9;
 * NIST SP 800-63B-4). Returns the message to show beside the field, or null.
 */
export function passwordProblem(password: string, email?: string): string | null {
  const length = [...password].length;
  if (length < PASSWORD_MIN)
    return `Use at least ${PASSWORD_MIN} characters; a passphrase of four or more words is easiest.`;
  if (length > PASSWORD_MAX) return `Use at most ${PASSWORD_MAX} characters.`;
  const lowered = password.toLowerCase();
  if (commonPasswords.test(lowered) || commonPasswords.test(password))
    return 'This password is on a list of commonly used passwords. Choose another.';
  if (/^(.)\1+$/.test(password)) return 'A single repeated character is too easy to guess.';
  if (email && lowered.includes(email.toLowerCase().split('@')[0]) && email.split('@')[0].length >= 4)
    return 'Do not build the password from your e-mail address.';
  return null;
}
