import { formatDay } from '../../contracts/dates/club-dates';
import { labelOf } from '../../contracts/labels/label-of';
import { PAYMENT_METHOD_LABELS } from '../../contracts/labels/payment-methods';
import type { TransactionalEmail } from '../mail/outbox';
import { formatCad } from '../platform/money';

/** The safety line every dues e-mail ends with, in Padside's words. */
const FLYING_NOTE =
  'Flying at a club launch needs current dues and current membership of your national rocketry association. ' +
  'The association safety code and the local aviation and fire rules apply, and the range safety officer has the final word.';

/** Who a membership e-mail goes to and what it is about. */
export interface MemberMailContext {
  to: string;
  name: string;
  memberNumber: string;
  planName: string;
  publicUrl: string;
}

/** Receipt for a dues payment (card or recorded by staff). Essential mail. */
export function receiptMail(
  c: MemberMailContext,
  p: {
    paymentId: number;
    amountCents: number;
    method: string;
    receiptNumber: string | null;
    termStart: string;
    termEnd: string;
  },
): TransactionalEmail {
  return {
    to: c.to,
    template: 'membership-receipt',
    reason: { member: c.memberNumber },
    dedupeKey: `membership-receipt:${p.paymentId}`,
    subject: `Dues receipt: member ${c.memberNumber}, paid to ${formatDay(p.termEnd)}`,
    text: [
      `Hello ${c.name},`,
      '',
      `Thank you. We received ${formatCad(p.amountCents)} (${labelOf(PAYMENT_METHOD_LABELS, p.method)}${p.receiptNumber ? `, receipt ${p.receiptNumber}` : ''}) for the ${c.planName} plan.`,
      `Member number: ${c.memberNumber}`,
      `Term: ${formatDay(p.termStart)} to ${formatDay(p.termEnd)}`,
      'Club dues carry no sales tax.',
      '',
      `Your member card: ${c.publicUrl}/membership/card`,
      '',
      FLYING_NOTE,
    ].join('\n'),
  };
}

/** Receipt for a refund. Essential mail. */
export function refundMail(
  c: MemberMailContext,
  p: { refundId: number; amountCents: number; method: string; termEnd: string | null },
): TransactionalEmail {
  return {
    to: c.to,
    template: 'membership-refund',
    reason: { member: c.memberNumber },
    dedupeKey: `membership-refund:${p.refundId}`,
    subject: `Dues refund: member ${c.memberNumber}`,
    text: [
      `Hello ${c.name},`,
      '',
      `We refunded ${formatCad(p.amountCents)} of your dues (${labelOf(PAYMENT_METHOD_LABELS, p.method)}).`,
      p.termEnd ? `Your membership now runs to ${formatDay(p.termEnd)}.` : 'Your membership has no paid term now.',
      '',
      FLYING_NOTE,
    ].join('\n'),
  };
}

export type ReminderKind = 'due-30' | 'due-7' | 'due-today' | 'overdue-14' | 'association-30';

/** Dues and association reminders; each is once per term end (or association expiry) through its dedupe key. */
export function reminderMail(
  c: MemberMailContext & { membershipId: number },
  kind: ReminderKind,
  on: string,
  autoRenew: boolean,
): TransactionalEmail {
  const date = formatDay(on);
  const renewLink = `${c.publicUrl}/membership`;
  const auto = autoRenew
    ? 'Auto-renew is on: we will charge your saved card on the last day of your term.'
    : `Renew here: ${renewLink}`;
  const lines: Record<ReminderKind, { subject: string; body: string }> = {
    'due-30': {
      subject: `Your club dues end on ${date}`,
      body: `Your membership (${c.planName}) ends on ${date}, 30 days from now. ${auto}`,
    },
    'due-7': {
      subject: `One week left: club dues end on ${date}`,
      body: `Your membership ends in 7 days, on ${date}. ${auto}`,
    },
    'due-today': {
      subject: 'Your club dues end today',
      body: `Your membership ends today (${date}). You keep flying status through the grace period, but please renew: ${renewLink}`,
    },
    'overdue-14': {
      subject: 'Your club dues are overdue',
      body: `Your membership ended on ${date} and has not been renewed. Renew before the grace period runs out to keep flying at club launches: ${renewLink}`,
    },
    'association-30': {
      subject: `Your association membership expires on ${date}`,
      body: `The membership with your national rocketry association that you gave us expires on ${date}. Renew it with the association and update the expiry here: ${renewLink}`,
    },
  };
  const line = lines[kind];
  return {
    to: c.to,
    template: `membership-${kind}`,
    reason: { member: c.memberNumber },
    dedupeKey: `membership-reminder:${c.membershipId}:${kind}:${on}`,
    subject: line.subject,
    text: [`Hello ${c.name},`, '', line.body, `Member number: ${c.memberNumber}`, '', FLYING_NOTE].join('\n'),
  };
}

/** An automatic renewal charge was declined; says when the next try is or that the membership lapsed. */
export function renewalDeclinedMail(
  c: MemberMailContext & { membershipId: number },
  termEnd: string,
  attempt: number,
  nextTry: string | null,
  message: string,
): TransactionalEmail {
  const body = nextTry
    ? `We could not charge your saved card for your dues (${message}). We will try again on ${formatDay(nextTry)}. You can put a different card on file at ${c.publicUrl}/membership.`
    : `We tried your saved card three times and could not charge it (${message}). Your membership has lapsed and you no longer have flying status at club launches. Renew at ${c.publicUrl}/membership.`;
  return {
    to: c.to,
    template: nextTry ? 'membership-renewal-declined' : 'membership-lapsed',
    reason: { member: c.memberNumber },
    dedupeKey: `membership-renewal-declined:${c.membershipId}:${termEnd}:${attempt}`,
    subject: nextTry ? 'We could not renew your club dues' : 'Your club membership has lapsed',
    text: [`Hello ${c.name},`, '', body, `Member number: ${c.memberNumber}`, '', FLYING_NOTE].join('\n'),
  };
}

/** Grace ran out without a renewal. */
export function lapsedMail(c: MemberMailContext & { membershipId: number }, termEnd: string): TransactionalEmail {
  return {
    to: c.to,
    template: 'membership-lapsed',
    reason: { member: c.memberNumber },
    dedupeKey: `membership-lapsed:${c.membershipId}:${termEnd}`,
    subject: 'Your club membership has lapsed',
    text: [
      `Hello ${c.name},`,
      '',
      `Your membership ended on ${formatDay(termEnd)} and the grace period is over, so you no longer have flying status at club launches. Renew at ${c.publicUrl}/membership.`,
      '',
      FLYING_NOTE,
    ].join('\n'),
  };
}
