import type { Knex } from 'knex';
import { dateInZone } from '../platform/clock';
import { IMPLIED_TOPICS, impliedConsentHolds, type ImpliedBasis } from './implied-consent';
import type { SubscriptionRepository } from './subscription-repository';
import { TOPIC_LABELS, type Topic } from './topics';

/** One address an announcement may go to, with the reason the footer gives. */
export interface Recipient {
  email: string;
  why: string;
}

/**
 * Who may receive a list today: express consent, then implied consent that has not lapsed. The suppression list is
 * applied when the mail is queued (CommercialMailer) and again when it is sent.
 */
export class AnnouncementAudience {
  constructor(
    private readonly subscriptions: SubscriptionRepository,
    private readonly site: { teamName: string; clubName: string; timeZone: string },
  ) {}

  /**
   * The recipients of a list on `today`. `productId` (drop notices) keeps the drop requests for that product or for
   * every product, and only express consent: people asked for those notices.
   */
  async of(
    trx: Knex.Transaction,
    topic: Topic,
    today: string,
    opts: { productId?: number; expressOnly?: boolean } = {},
  ): Promise<Recipient[]> {
    const byEmail = new Map<string, Recipient>();
    for (const r of await this.subscriptions.expressAudience(trx, topic, opts.productId)) {
      byEmail.set(r.email, {
        email: r.email,
        why: `you asked for e-mails about ${TOPIC_LABELS[topic]} on ${dateInZone(new Date(r.since), this.site.timeZone)}`,
      });
    }
    if (!opts.expressOnly) {
      const bases = (Object.keys(IMPLIED_TOPICS) as ImpliedBasis[]).filter((b) => IMPLIED_TOPICS[b].includes(topic));
      for (const r of await this.subscriptions.impliedConsents(trx, bases)) {
        if (byEmail.has(r.email) || !impliedConsentHolds(r.basis_on, today)) continue;
        const why =
          r.basis === 'purchase'
            ? `you bought from ${this.site.teamName} on ${r.basis_on}`
            : `you are or were a member of ${this.site.clubName} (membership to ${r.basis_on})`;
        byEmail.set(r.email, { email: r.email, why });
      }
    }
    return [...byEmail.values()];
  }
}
