import type { TransactionalEmail } from '../mail/outbox';

/** The last e-mail to a deleted account's address: what went, what stays and why. No name: it was erased. */
export function accountDeletedEmail(to: string, teamName: string): TransactionalEmail {
  return {
    to,
    template: 'account-deleted',
    reason: { team: teamName },
    subject: 'Your Padside account was deleted',
    text: [
      'Hello,',
      '',
      `Your Padside account with ${teamName} was deleted as you asked. You are signed out everywhere and this address can no longer sign in; you may register again with it at any time.`,
      '',
      'Your name, address, phone, emergency contact and sign-in history are erased. Orders and dues payments keep their amounts, without your details, because tax law asks us to keep the books for several years. Flight cards stay in the club’s range record without your name.',
      '',
      'This is the last e-mail we send to this address. If you did not ask for this, tell the team at the next launch or through the shop’s contact.',
      '',
      '— Padside',
    ].join('\n'),
  };
}
