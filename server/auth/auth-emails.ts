import type { TransactionalEmail } from '../mail/outbox';

/** Texts of the account e-mails, in Padside's own words. */
export function verificationEmail(to: string, name: string, link: string): TransactionalEmail {
  return {
    to,
    template: 'verify-email',
    reason: {},
    subject: 'Confirm your e-mail for Padside',
    text: `Hi ${name},\n\nPlease confirm this address so we can send your order and dues receipts here:\n\n${link}\n\nThe link works for 48 hours. If you did not create a Padside account, ignore this message.\n\n— Padside`,
  };
}

export function passwordResetEmail(to: string, name: string, link: string): TransactionalEmail {
  return {
    to,
    template: 'password-reset',
    reason: {},
    subject: 'Choose a new Padside password',
    text: `Hi ${name},\n\nSomeone (hopefully you) asked to choose a new password for this Padside account. Open this link within 1 hour:\n\n${link}\n\nThe link works once. If you did not ask, your password is unchanged and you can ignore this message.\n\n— Padside`,
  };
}

export function passwordChangedEmail(to: string, name: string): TransactionalEmail {
  return {
    to,
    template: 'password-changed',
    reason: {},
    subject: 'Your Padside password was changed',
    text: `Hi ${name},\n\nThe password for this Padside account was just changed. If that was not you, reset it now from the sign-in page and tell the club's admin.\n\n— Padside`,
  };
}

/** To the owner of an address someone tried to register again; it says what to do without confirming anything to the other person. */
export function registrationAttemptEmail(
  to: string,
  name: string,
  signInLink: string,
  resetLink: string,
): TransactionalEmail {
  return {
    to,
    template: 'registration-attempt',
    reason: {},
    subject: 'Someone tried to create a Padside account with your address',
    text: `Hi ${name},\n\nSomeone just tried to create a new Padside account with this e-mail address. You already have one, so nothing was created and nothing changed.\n\nIf it was you, sign in here:\n\n${signInLink}\n\nForgot the password? Choose a new one here:\n\n${resetLink}\n\nIf it was not you, you can ignore this message.\n\n— Padside`,
  };
}
