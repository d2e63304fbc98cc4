import type { Knex } from 'knex';

/** Mail to this domain is never queued; `.invalid` never resolves (RFC 2606). */
export const DELETED_MAIL_DOMAIN = 'deleted.invalid';

/** The e-mail a deleted account's rows keep: unique per account, never a mailbox, and the owner's address is free again. */
export const deletedEmail = (userId: number) => `deleted-${userId}@${DELETED_MAIL_DOMAIN}`;

/** The person whose data is exported or erased, as the account held them before any erasure. */
export interface DataSubject {
  userId: number;
  /** The account's e-mail (lower case): guest orders and mail are found by it. */
  email: string;
  emailVerified: boolean;
  /** What replaces names, e-mails and addresses in rows the books must keep: "Deleted account #12". */
  marker: string;
}

/** One JSON file of the export and its entry on the summary page. */
export interface PersonalDataSection {
  /** File name inside the ZIP without `.json`, kebab-case and unique across features: `shop-orders`. */
  name: string;
  /** Heading on the summary page: "Orders". */
  title: string;
  /** One sentence: why Padside holds this. */
  purpose: string;
  /** The rows, as plain JSON values (camelCase keys, amounts in cents, instants as ISO strings). */
  records: unknown[];
}

/** Work with an outside service once the erasure has committed (forgetting a saved card at the card processor). */
export type AfterErase = () => Promise<void>;

/**
 * What a feature holds about one person. The account feature calls every feature's part: all exports in one
 * snapshot, all erasures in one transaction (so a refusal or a failure leaves the account as it was).
 */
export interface PersonalDataPart {
  /** The sections this feature adds to the download. */
  export(trx: Knex.Transaction, subject: DataSubject): Promise<PersonalDataSection[]>;
  /** Why the account cannot be deleted now ("order PS-001234 is still to be shipped"); empty when nothing holds it. */
  holds?(trx: Knex.Transaction, subject: DataSubject): Promise<string[]>;
  /**
   * Erases or replaces this feature's personal data in the caller's transaction. Rows the books need keep their
   * amounts and take `subject.marker` for names, e-mails and addresses; nothing that moves money is deleted.
   */
  erase(trx: Knex.Transaction, subject: DataSubject): Promise<AfterErase | void>;
}

/** A database row for the export: camelCase keys and instants as ISO strings, so every file reads alike. */
export function plainRecord(row: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(row)) {
    const camel = key.replace(/_([a-z0-9])/g, (_m, c: string) => c.toUpperCase());
    out[camel] = value instanceof Date ? value.toISOString() : value;
  }
  return out;
}
