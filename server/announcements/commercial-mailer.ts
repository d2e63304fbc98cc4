import type { Knex } from 'knex';
import { enqueueEmails, type CommercialEmail } from '../mail/outbox';
import { SuppressionList } from '../mail/suppression-list';
import type { Platform } from '../feature';
import type { SettingsService } from '../settings/settings-service';
import { ANNOUNCEMENT_SETTINGS } from './announcement-settings';
import { commercialMail, type CommercialContent, type SenderIdentity } from './commercial-mail';
import type { MailList } from './topics';
import { UnsubscribeTokens } from './unsubscribe-token';

/** One address a commercial mail goes to, and why (the footer says it). */
export interface CommercialAddressee {
  email: string;
  why: string;
}

/**
 * The one way any feature queues commercial mail: sender identity from the settings, an unsubscribe link and the
 * one-click headers per address and list, and the suppression list consulted before anything is queued (the worker
 * consults it again before sending).
 */
export class CommercialMailer {
  private readonly suppressions: SuppressionList;

  constructor(
    db: Knex,
    private readonly settings: SettingsService,
    private readonly tokens: UnsubscribeTokens,
    private readonly teamName: string,
  ) {
    this.suppressions = new SuppressionList(db);
  }

  /** Who the mail is from, as the footer must say: the team's name, its postal address and a contact address from the settings. */
  async sender(trx?: Knex.Transaction): Promise<SenderIdentity> {
    const s = await this.settings.get(ANNOUNCEMENT_SETTINGS, trx);
    return { teamName: this.teamName, mailingAddress: s.mailingAddress, contactEmail: s.contactEmail };
  }

  /** The mail for one addressee, as it will be queued. */
  mailFor(
    content: CommercialContent,
    to: CommercialAddressee,
    sender: SenderIdentity,
    dedupeKey?: string,
  ): CommercialEmail {
    return commercialMail(
      content,
      {
        ...to,
        oneClickUrl: this.tokens.oneClickUrl(to.email, content.topic),
        pageUrl: this.tokens.pageUrl(to.email, content.topic),
      },
      sender,
      dedupeKey,
    );
  }

  /**
   * Queues one mail per addressee not suppressed for the list; `build` gives each its content and dedupe key.
   * Returns how many were queued and how many the suppression list left out.
   */
  async queue<T extends CommercialAddressee>(
    trx: Knex.Transaction,
    list: MailList,
    to: T[],
    build: (a: T) => { content: CommercialContent; dedupeKey: string },
  ): Promise<{ queued: number; suppressed: number }> {
    const blocked = await this.suppressions.emailsFor(list, trx);
    const sender = await this.sender(trx);
    const allowed = to.filter((a) => !blocked.has(a.email.trim().toLowerCase()));
    const queued = await enqueueEmails(
      trx,
      allowed.map((a) => {
        const { content, dedupeKey } = build(a);
        return this.mailFor(content, a, sender, dedupeKey);
      }),
    );
    return { queued, suppressed: to.length - allowed.length };
  }
}

/** The commercial mailer of a platform; every feature that sends commercial mail builds it this way. */
export function commercialMailer(platform: Platform): CommercialMailer {
  const { db, config } = platform.deps;
  return new CommercialMailer(
    db,
    platform.settings,
    new UnsubscribeTokens(config.sessionSecret, config.publicUrl),
    config.site.teamName,
  );
}
