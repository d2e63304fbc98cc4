/** Shown under every new-password field (NIST SP 800-63B-4 suggests 15+ characters when a password is the only factor). */
export const PASSPHRASE_HINT =
  '12 to 128 characters. A passphrase of four unrelated words (15+ characters) is strong and easy to remember.';
