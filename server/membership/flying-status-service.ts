import type { Knex } from 'knex';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { ClubCalendar } from '../platform/club-calendar';
import type { SettingsService } from '../settings/settings-service';
import type { CheckInTokens } from './check-in-token';
import { termPolicy } from './dues-settlement';
import { associationVerification, certificationVerification, flyingVerdict, type Verification } from './flying-status';
import { type MembershipRepository, type MembershipRow } from './membership-repository';
import { MEMBERSHIP_SETTINGS } from './membership-settings';
import { liveStatus } from './membership-views';
import { UNKNOWN_CARD, type CheckInResult } from '../../contracts/membership/check-in-answers';
import type { VerifiedPart, VerifyInput } from '../../contracts/membership/staff-member-schemas';
import type { Verifications } from '../../contracts/membership/staff-member-answers';

/** The verifications on a record, with the staff names. */
export async function verificationsView(repo: MembershipRepository, m: MembershipRow): Promise<Verifications> {
  const [a, c] = [associationVerification(m), certificationVerification(m)];
  const names = await repo.userNames([a?.byUserId ?? null, c?.byUserId ?? null]);
  const view = (v: Verification | null) =>
    v
      ? { at: v.at.toISOString(), by: v.byUserId !== null ? (names.get(v.byUserId) ?? null) : null, against: v.against }
      : null;
  return { association: view(a), certification: view(c) };
}

/** Staff verification of association and certification claims, and the launch check-in built on it. No HTTP here. */
export class FlyingStatusService {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly settings: SettingsService,
    private readonly tokens: CheckInTokens,
    private readonly clock: Clock,
    private readonly calendar: ClubCalendar,
  ) {}

  private today(): string {
    return this.calendar.today();
  }

  /** Marks the association membership or the certification as checked, if the record still shows what staff saw. */
  async verify(actorId: number, id: number, input: VerifyInput): Promise<void> {
    const today = this.today();
    await this.db.transaction(async (trx) => {
      const m = await this.repo.lockById(trx, id);
      if (!m) throw notFound('No such member.');
      const changed = () =>
        conflict('record_changed', 'The record changed since you loaded it; reload the page and check again.', {
          what: 'The record changed since you loaded it.',
        });
      if (input.what === 'association') {
        const expires = m.association_expires;
        if (!m.association_number || !expires)
          throw badRequest('There is no association membership on file to verify.', {
            what: 'No association number and expiry on file.',
          });
        if (expires < today)
          throw badRequest('The association membership on file has expired; enter the renewed expiry first.', {
            what: `Expired on ${expires}.`,
          });
        if (input.associationNumber !== m.association_number || input.associationExpires !== expires) throw changed();
        await this.repo.update(trx, id, {
          association_verified_at: this.clock.now(),
          association_verified_by: actorId,
          association_verified_against: input.against,
        });
        await this.repo.addAudit(trx, id, actorId, 'association_verified', {
          number: m.association_number,
          expires,
          against: input.against,
        });
      } else {
        if (m.certification_level === 'none')
          throw badRequest('There is no certification on file to verify.', { what: 'No certification level on file.' });
        if (input.certificationLevel !== m.certification_level) throw changed();
        await this.repo.update(trx, id, {
          certification_verified_at: this.clock.now(),
          certification_verified_by: actorId,
          certification_verified_against: input.against,
        });
        await this.repo.addAudit(trx, id, actorId, 'certification_verified', {
          level: m.certification_level,
          against: input.against,
        });
      }
    });
  }

  /** Takes a verification back (a document turned out wrong): the value is a claim again. */
  async withdraw(actorId: number, id: number, what: VerifiedPart): Promise<void> {
    await this.db.transaction(async (trx) => {
      const m = await this.repo.lockById(trx, id);
      if (!m) throw notFound('No such member.');
      const cleared =
        what === 'association'
          ? { association_verified_at: null, association_verified_by: null, association_verified_against: null }
          : { certification_verified_at: null, certification_verified_by: null, certification_verified_against: null };
      await this.repo.update(trx, id, cleared);
      await this.repo.addAudit(trx, id, actorId, `${what}_verification_withdrawn`, {});
    });
  }

  /** Launch-day check-in: three separate answers and "may fly" only when dues and a verified association are current. */
  async checkIn(token: string): Promise<CheckInResult> {
    const verified = this.tokens.verify(token);
    const m = verified ? await this.repo.byNumber(verified.memberNumber) : undefined;
    if (!m || m.status === 'pending') return UNKNOWN_CARD;
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const today = this.today();
    const status = liveStatus(m, today, termPolicy(s));
    // A record with no term yet has never been paid for: the card says as little as one Padside does not know.
    if (status === 'pending') return UNKNOWN_CARD;
    const verdict = flyingVerdict(m, status, today);
    const checks = await verificationsView(this.repo, m);
    const label = s.certificationLevels.find((l) => l.code === m.certification_level)?.label ?? m.certification_level;
    return {
      status,
      memberNumber: m.member_number,
      name: m.legal_name,
      mayFly: verdict.mayFly,
      termEnd: verdict.dues.termEnd,
      associationName: s.associationName,
      dues: { answer: verdict.dues.answer, termEnd: verdict.dues.termEnd },
      association: {
        answer: verdict.association.answer,
        number: verdict.association.number,
        expires: verdict.association.expires,
        verified: checks.association,
      },
      certification: {
        answer: verdict.certification.answer,
        level: verdict.certification.level,
        label,
        verified: checks.certification,
      },
    };
  }
}
