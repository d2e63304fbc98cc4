import { escapeHtml } from '../markdown/escape-html';
import type { TransactionalEmail } from './outbox';

/**
 * Why each transactional e-mail was sent, in Padside's words: the one place these sentences live. A template that is
 * not listed here cannot be queued as transactional mail (the outbox's types ask for its key and facts), and the
 * outbox appends the sentence to the text and HTML bodies. Commercial mail has its own footer (commercial-mail.ts).
 */
export const MAIL_REASONS = {
  'shop-order-confirmation': (f: { order: string; team: string }) =>
    `you placed order ${f.order} with ${f.team}, and this e-mail is its receipt.`,
  'shop-order-shipped': (f: { order: string }) =>
    `you placed order ${f.order} and it has shipped; we tell every buyer once, when it does.`,
  'shop-order-refund': (f: { order: string }) =>
    `we refunded money on your order ${f.order}; each refund gets one e-mail.`,
  'shop-order-dispute': (f: { order: string }) =>
    `this is the shop's staff address, and the card holder disputed the charge on order ${f.order}.`,
  'membership-receipt': (f: { member: string }) =>
    `you paid club dues as member ${f.member}, and this e-mail is the receipt.`,
  'membership-refund': (f: { member: string }) =>
    `we refunded dues you paid as member ${f.member}, and this e-mail is the receipt for that refund.`,
  'membership-due-30': (f: { member: string }) =>
    `you are member ${f.member}, and we tell every member 30 days before their dues end.`,
  'membership-due-7': (f: { member: string }) =>
    `you are member ${f.member}, and we tell every member 7 days before their dues end.`,
  'membership-due-today': (f: { member: string }) =>
    `you are member ${f.member}, and we tell every member on the day their dues end.`,
  'membership-overdue-14': (f: { member: string }) =>
    `you are member ${f.member}, your dues ended two weeks ago, and we tell you once before the grace period runs out.`,
  'membership-association-30': (f: { member: string }) =>
    `as member ${f.member} you gave us the expiry of your national association membership, and we tell you 30 days before it.`,
  'membership-renewal-declined': (f: { member: string }) =>
    `auto-renew is on for member ${f.member} and the charge on your saved card did not go through.`,
  'membership-lapsed': (f: { member: string }) =>
    `your membership as member ${f.member} has lapsed; we send this once, when it does.`,
  'membership-roster-business': (f: { club: string }) =>
    `you are a member of ${f.club} and it is club business (your dues, launches you replied to), so it arrives whatever your news setting.`,
  'launch-reminder': (f: { launch: string }) =>
    `you said you would come to ${f.launch}; everyone who did hears from us two days before.`,
  'launch-called-off': (f: { launch: string }) => `you said you would come to ${f.launch}, and it is called off.`,
  'sponsor-credit-published': (f: { sponsor: string; team: string }) =>
    `you are the contact for ${f.sponsor}'s sponsorship of ${f.team}, and we tell you each time a build log credits it.`,
  'verify-email': () =>
    'this address was given when a Padside account was created, and we confirm an address before we send receipts to it.',
  'password-reset': () => 'someone asked to choose a new password for the Padside account with this address.',
  'password-changed': () =>
    'the password of the Padside account with this address changed, and we always tell you when it does.',
  'registration-attempt': () => 'someone tried to create a Padside account with this address, which already has one.',
  'account-deleted': (f: { team: string }) =>
    `you asked to delete your Padside account with ${f.team}, and this e-mail confirms it.`,
  'subscription-confirm': (f: { team: string }) =>
    `this is the one confirmation of a request for e-mails from ${f.team} made with this address. If it was not you, ignore it: without the confirmation we send this address nothing more.`,
} satisfies Record<string, (facts: never) => string>;

export type TransactionalTemplate = keyof typeof MAIL_REASONS;

/** The facts a template's reason needs (none for the account mails). */
export type ReasonFacts<T extends TransactionalTemplate> =
  Parameters<(typeof MAIL_REASONS)[T]> extends [infer F] ? F : Record<string, never>;

/** The reason line of one mail; its type already pairs the template with that template's facts. */
export function reasonText(mail: TransactionalEmail): string {
  return `Why you got this: ${(MAIL_REASONS[mail.template] as (f: typeof mail.reason) => string)(mail.reason)}`;
}

/** The bodies with the reason as their last lines, set apart the way the commercial footer is. */
export function withReason(
  body: { text: string; html?: string },
  reason: string,
): { text: string; html: string | null } {
  return {
    text: `${body.text.trimEnd()}\n\n--\n${reason}`,
    html:
      body.html === undefined
        ? null
        : `${body.html}\n<hr>\n<p style="font-size:12px;color:#555">${escapeHtml(reason)}</p>`,
  };
}
