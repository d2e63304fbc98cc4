import type { Knex } from 'knex';
import { DELETED_MAIL_DOMAIN } from '../platform/personal-data';

/** One e-mail to queue; `dedupeKey` makes it once-only however many times it is queued. */
export interface OutgoingEmail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  template: string;
  dedupeKey?: string;
  /** Commercial mail (announcements, drop notices, promotional roster mail) is checked against the suppression list. */
  category?: 'transactional' | 'commercial';
  /** The list a commercial mail belongs to (a topic); a suppression for this list or for every list stops it. */
  list?: string;
  /** Extra headers, such as `List-Unsubscribe` (RFC 8058). */
  headers?: Record<string, string>;
  announcementId?: number;
}

const toRow = (mail: OutgoingEmail) => ({
  to_address: mail.to,
  subject: mail.subject,
  text_body: mail.text,
  html_body: mail.html ?? null,
  template: mail.template,
  dedupe_key: mail.dedupeKey ?? null,
  category: mail.category ?? 'transactional',
  list: mail.list ?? null,
  headers: mail.headers ? JSON.stringify(mail.headers) : null,
  announcement_id: mail.announcementId ?? null,
});

/**
 * Queues an e-mail in the caller's transaction, so the mail exists exactly when the change that caused it does.
 * Returns false when a mail with the same dedupe key was already queued, or when it is addressed to a deleted account.
 */
export async function enqueueEmail(db: Knex | Knex.Transaction, mail: OutgoingEmail): Promise<boolean> {
  return (await enqueueEmails(db, [mail])) === 1;
}

/** Queues many e-mails at once (an announcement's audience); returns how many were new by their dedupe keys. */
export async function enqueueEmails(db: Knex | Knex.Transaction, mails: OutgoingEmail[]): Promise<number> {
  // A deleted account's tombstone address never receives anything, whoever queues it.
  mails = mails.filter((m) => !m.to.endsWith('@' + DELETED_MAIL_DOMAIN));
  let queued = 0;
  // Chunks keep each statement well under PostgreSQL's 65,535 bind parameters.
  for (let i = 0; i < mails.length; i += 500) {
    const rows = await db('outbound_emails').insert(mails.slice(i, i + 500).map(toRow)).onConflict('dedupe_key').ignore().returning('id');
    queued += rows.length;
  }
  return queued;
}
