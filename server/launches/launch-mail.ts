import { clubTimeInWords, formatClock, formatDay } from '../../contracts/dates/club-dates';
import type { TransactionalEmail } from '../mail/outbox';
import type { LaunchRow, Recipient } from './launch-repository';

/** The line every launch e-mail ends with, in Padside's words. */
const FLYING_NOTE =
  "Padside keeps the club calendar; the range safety officer decides on the day. Fly under your national association's " +
  'safety code and the local aviation and fire rules, and bring your member card for check-in.';

const when = (l: LaunchRow, timeZone: string) =>
  `${formatDay(l.launch_date)}, ${formatClock(l.starts_at)} to ${formatClock(l.ends_at)} ${clubTimeInWords(timeZone)}`;

/** The reminder two days before a launch, once per launch and person. */
export function launchReminderMail(
  to: Recipient,
  l: LaunchRow,
  timeZone: string,
  publicUrl: string,
): TransactionalEmail {
  return {
    to: to.email,
    template: 'launch-reminder',
    reason: { launch: l.title },
    dedupeKey: `launch-reminder:${l.id}:${to.user_id}`,
    subject: `Launch day soon: ${l.title} on ${formatDay(l.launch_date)}`,
    text: [
      `Hello ${to.display_name},`,
      '',
      `You said you would come to ${l.title}.`,
      `When: ${when(l, timeZone)}`,
      `Where: ${l.site_name}${l.site_address ? `, ${l.site_address}` : ''}`,
      l.notes ? `\n${l.notes}` : '',
      '',
      `Details and your reply: ${publicUrl}/launches/${l.id}`,
      '',
      FLYING_NOTE,
    ].join('\n'),
  };
}

/** The notice that a launch someone said they would come to is called off; once per call-off. */
export function launchCalledOffMail(
  to: Recipient,
  l: LaunchRow,
  reason: string,
  timeZone: string,
  publicUrl: string,
): TransactionalEmail {
  return {
    to: to.email,
    template: 'launch-called-off',
    reason: { launch: l.title },
    dedupeKey: `launch-called-off:${l.id}:${to.user_id}`,
    subject: `Called off: ${l.title} on ${formatDay(l.launch_date)}`,
    text: [
      `Hello ${to.display_name},`,
      '',
      `${l.title} (${when(l, timeZone)}) is called off.`,
      `Reason: ${reason}`,
      '',
      `The club calendar: ${publicUrl}/launches`,
      '',
      FLYING_NOTE,
    ].join('\n'),
  };
}
