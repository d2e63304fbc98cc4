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
}

/**
 * Queues an e-mail in the caller's transaction, so the mail exists exactly when the change that caused it does.
 * Returns false when a mail with the same dedupe key was already queued, or when it is addressed to a deleted account.
 */
export async function enqueueEmail(db: Knex | Knex.Transaction, mail: OutgoingEmail): Promise<boolean> {
  if (mail.to.endsWith('@' + DELETED_MAIL_DOMAIN)) return false;
  const rows = await db('outbound_emails')
    .insert({
      to_address: mail.to,
      subject: mail.subject,
      text_body: mail.text,
      html_body: mail.html ?? null,
      template: mail.template,
      dedupe_key: mail.dedupeKey ?? null,
    })
    .onConflict('dedupe_key')
    .ignore()
    .returning('id');
  return rows.length > 0;
}
