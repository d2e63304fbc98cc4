import type { Knex } from 'knex';
import { DELETED_MAIL_DOMAIN } from '../platform/personal-data';
import { reasonText, withReason, type ReasonFacts, type TransactionalTemplate } from './mail-reasons';

/** What every e-mail to queue has; `dedupeKey` makes it once-only however many times it is queued. */
interface MailBody {
  to: string;
  subject: string;
  text: string;
  html?: string;
  dedupeKey?: string;
}

/**
 * Transactional mail (receipts, reminders, account mail): its template must be one of MAIL_REASONS, and `reason`
 * holds the facts of that template's "why you got this" line, which the outbox appends. It never carries list headers.
 */
export type TransactionalEmail = {
  [T in TransactionalTemplate]: MailBody & { template: T; category?: 'transactional'; reason: ReasonFacts<T> };
}[TransactionalTemplate];

/** Commercial mail (announcements, drop notices, promotional roster mail), built only by commercial-mail.ts. */
export interface CommercialEmail extends MailBody {
  template: string;
  category: 'commercial';
  /** The list it belongs to (a topic); a suppression for this list or for every list stops it. */
  list: string;
  /** `List-Unsubscribe` and `List-Unsubscribe-Post` (RFC 8058). */
  headers: Record<string, string>;
  announcementId?: number;
}

export type OutgoingEmail = TransactionalEmail | CommercialEmail;

const toRow = (mail: OutgoingEmail) => {
  const common = {
    to_address: mail.to,
    subject: mail.subject,
    template: mail.template,
    dedupe_key: mail.dedupeKey ?? null,
  };
  if (mail.category === 'commercial') {
    const { list, headers, announcementId } = mail;
    return {
      ...common,
      text_body: mail.text,
      html_body: mail.html ?? null,
      category: 'commercial',
      list,
      headers: JSON.stringify(headers),
      announcement_id: announcementId ?? null,
    };
  }
  const body = withReason(mail, reasonText(mail));
  return {
    ...common,
    text_body: body.text,
    html_body: body.html,
    category: 'transactional',
    list: null,
    headers: null,
    announcement_id: null,
  };
};

/**
 * Queues an e-mail in the caller's transaction, so the mail exists exactly when the change that caused it does.
 * Returns false when a mail with the same dedupe key was already queued, or when it is addressed to a deleted account.
 */
export async function enqueueEmail(trx: Knex.Transaction, mail: OutgoingEmail): Promise<boolean> {
  return (await enqueueEmails(trx, [mail])) === 1;
}

/** Queues many e-mails at once (an announcement's audience); returns how many were new by their dedupe keys. */
export async function enqueueEmails(trx: Knex.Transaction, mails: OutgoingEmail[]): Promise<number> {
  // A deleted account's tombstone address never receives anything, whoever queues it.
  mails = mails.filter((m) => !m.to.endsWith('@' + DELETED_MAIL_DOMAIN));
  let queued = 0;
  // Chunks keep each statement well under PostgreSQL's 65,535 bind parameters.
  for (let i = 0; i < mails.length; i += 500) {
    const rows = await trx('outbound_emails')
      .insert(mails.slice(i, i + 500).map(toRow))
      .onConflict('dedupe_key')
      .ignore()
      .returning('id');
    queued += rows.length;
  }
  return queued;
}
