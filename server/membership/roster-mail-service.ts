import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { RosterMailPurpose, RosterQuery } from '../../contracts/membership/roster-schemas';
import type { RosterMailResult } from '../../contracts/membership/staff-member-answers';
import type { CommercialMailer } from '../announcements/commercial-mailer';
import { impliedConsentHolds } from '../announcements/implied-consent';
import { enqueueEmail } from '../mail/outbox';
import type { ClubCalendar } from '../platform/club-calendar';
import type { SettingsService } from '../settings/settings-service';
import { termPolicy } from './dues-settlement';
import { MEMBERSHIP_SETTINGS } from './membership-settings';
import type { RosterRepository } from './roster-repository';

/** The treasurer's e-mail to the members a roster filter matches. */
export class RosterMailService {
  constructor(
    private readonly db: Knex,
    private readonly rosterRepo: RosterRepository,
    private readonly settings: SettingsService,
    private readonly calendar: ClubCalendar,
    private readonly mailer: CommercialMailer,
    private readonly clubName: string,
  ) {}

  /**
   * An e-mail to the filtered roster. `news` is promotional, so it follows the consent rules: members who turned off
   * news mail, whose membership ended more than two years ago (implied consent lapsed), or who are on the suppression
   * list for club news are skipped, and each message carries the sender's address and the one-click stop link.
   * `club-business` (dues, launches they replied to) is transactional: it goes to everyone matched and says why.
   */
  async emailRoster(
    q: RosterQuery,
    mail: { subject: string; text: string },
    purpose: RosterMailPurpose = 'news',
  ): Promise<RosterMailResult> {
    const rows = await this.rosterRepo.rosterAll(q, {
      today: this.calendar.today(),
      graceDays: termPolicy(await this.settings.get(MEMBERSHIP_SETTINGS)).graceDays,
    });
    const batch = randomUUID();
    if (purpose === 'club-business') {
      let queued = 0;
      await this.db.transaction(async (trx) => {
        for (const r of rows) {
          if (
            await enqueueEmail(trx, {
              to: r.email,
              subject: mail.subject,
              text: `Hello ${r.legal_name},\n\n${mail.text}`,
              template: 'membership-roster-business',
              reason: { club: this.clubName },
              dedupeKey: `membership-business:${batch}:${r.id}`,
            })
          )
            queued++;
        }
      });
      return { queued, skippedOptedOut: 0, skippedLapsedConsent: 0, skippedSuppressed: 0 };
    }
    const today = this.calendar.today();
    const optedOut = rows.filter((r) => r.marketing_opt_out);
    const consentHolds = (termEnd: string | null) => termEnd !== null && impliedConsentHolds(termEnd, today);
    const lapsed = rows.filter((r) => !r.marketing_opt_out && !consentHolds(r.term_end));
    const to = rows
      .filter((r) => !optedOut.includes(r) && !lapsed.includes(r))
      .map((r) => ({
        email: r.email,
        why: `you are or were a member of ${this.clubName}`,
        id: r.id,
        name: r.legal_name,
      }));
    const { queued, suppressed } = await this.db.transaction((trx) =>
      this.mailer.queue(trx, 'club-news', to, (a) => ({
        content: {
          topic: 'club-news',
          subject: mail.subject,
          markdown: `Hello ${a.name},\n\n${mail.text}`,
          template: 'membership-roster-news',
        },
        dedupeKey: `membership-news:${batch}:${a.id}`,
      })),
    );
    return {
      queued,
      skippedOptedOut: optedOut.length,
      skippedLapsedConsent: lapsed.length,
      skippedSuppressed: suppressed,
    };
  }
}
