import type { Knex } from 'knex';
import QRCode from 'qrcode';
import type { MemberCard, Membership } from '../../contracts/membership/membership-answers';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { ClubCalendar } from '../platform/club-calendar';
import type { SessionUser } from '../platform/roles';
import type { SettingsService } from '../settings/settings-service';
import { declined, type CardOnFile } from './card-on-file';
import type { CheckInTokens } from './check-in-token';
import { termPolicy, type DuesSettlement } from './dues-settlement';
import { withVoidedVerifications } from './flying-status';
import { type MembershipRepository } from './membership-repository';
import { profilePatch, voidedNote } from './membership-rules';
import type { RenewInput } from './membership-service';
import { MEMBERSHIP_SETTINGS } from './membership-settings';
import { membershipView } from './membership-views';
import type { PlanRepository } from './plan-repository';

/** The member's own record between payments: reading it, correcting it, auto-renew and the printable card. */
export class MemberRecordService {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly planRepo: PlanRepository,
    private readonly settings: SettingsService,
    private readonly settlement: DuesSettlement,
    private readonly cardOnFile: CardOnFile,
    private readonly tokens: CheckInTokens,
    private readonly clock: Clock,
    private readonly calendar: ClubCalendar,
  ) {}

  private today(): string {
    return this.calendar.today();
  }

  /**
   * The caller's membership, or {membership: null} before they join: a signed-in fan without one is an ordinary
   * state, and a 404 would be written to the browser console as an error on every visit to the dues page.
   */
  async meOrNone(userId: number) {
    if (!(await this.repo.byUser(userId))) return { membership: null };
    return this.me(userId);
  }

  /** The caller's membership; the stored status and role catch up with the dates on the way. */
  async me(userId: number): Promise<{ membership: Membership }> {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const policy = termPolicy(s);
    const today = this.today();
    let m = await this.repo.byUser(userId);
    if (!m) throw notFound('You have no membership yet.');
    await this.db.transaction(async (trx) =>
      this.settlement.refreshStatus(trx, (await this.repo.lockById(trx, m!.id))!, today, policy, userId),
    );
    m = (await this.repo.byId(m.id))!;
    const family = await this.repo.family(m.id);
    return {
      membership: {
        ...membershipView(m, await this.planRepo.plan(m.plan_id), today, policy, s),
        familyMembers: family.map((f) => ({ name: f.name, dateOfBirth: f.date_of_birth })),
      },
    };
  }

  /** The member's own corrections between renewals (a renewed association expiry, a new certification); audited. */
  async updateProfile(user: SessionUser, input: NonNullable<RenewInput['profile']>) {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const patch = profilePatch(s, input, 'certificationLevel');
    await this.db.transaction(async (trx) => {
      const m = await this.repo.lockByUser(trx, user.id);
      if (!m) throw notFound('You have no membership yet.');
      if (!Object.keys(patch).length) return;
      // A member's own edit of a verified value makes it a claim again until staff check it anew.
      const full = withVoidedVerifications(m, patch);
      await this.repo.update(trx, m.id, full);
      await this.repo.addAudit(trx, m.id, user.id, 'profile_updated', {
        changed: Object.keys(patch),
        ...voidedNote(full),
      });
    });
    return this.me(user.id);
  }

  /** Turns auto-renew on or off; `paymentToken` puts a new card on file. */
  async setAutoRenew(user: SessionUser, input: { autoRenew: boolean; paymentToken?: string }) {
    const m = await this.repo.byUser(user.id);
    if (!m) throw notFound('You have no membership yet.');
    if (input.autoRenew && !m.processor_customer_id && !input.paymentToken)
      throw badRequest('Choose a card to keep on file.', { paymentToken: 'Choose a card to keep on file.' });
    if (input.paymentToken) {
      const saved = await this.cardOnFile.save(m, user, input.paymentToken);
      if (saved.outcome === 'declined') throw declined(saved.message);
    }
    await this.db.transaction(async (trx) => {
      await this.repo.update(trx, m.id, {
        auto_renew: input.autoRenew,
        renewal_failed_at: input.paymentToken ? null : m.renewal_failed_at,
      });
      await this.repo.addAudit(trx, m.id, user.id, 'auto_renew_changed', {
        autoRenew: input.autoRenew,
        newCard: Boolean(input.paymentToken),
      });
    });
    return this.me(user.id);
  }

  /** The printable card: who, number, plan, term end, certification and the signed check-in token as a QR code. */
  async card(userId: number): Promise<{ card: MemberCard }> {
    const { membership } = await this.me(userId);
    if (membership.status === 'pending')
      throw conflict('membership_pending', 'Your card is ready once your first payment has gone through.');
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const token = this.tokens.sign(membership.memberNumber, this.clock.now());
    // A quiet zone of four modules on every side, black on white (ISO/IEC 18004, from memory), so phone scanners find it.
    const qrSvg = await QRCode.toString(token, {
      type: 'svg',
      errorCorrectionLevel: 'M',
      margin: 4,
      color: { dark: '#000000ff', light: '#ffffffff' },
    });
    const level = s.certificationLevels.find((l) => l.code === membership.certificationLevel);
    return {
      card: {
        name: membership.legalName,
        memberNumber: membership.memberNumber,
        planName: membership.planName,
        status: membership.status,
        termEnd: membership.termEnd,
        certificationLevel: membership.certificationLevel,
        certificationLabel: level?.label ?? membership.certificationLevel,
        associationName: s.associationName,
        associationNumber: membership.associationNumber,
        associationExpires: membership.associationExpires,
        // The card shows a claim as a claim: staff at the field read these before trusting the printed level.
        associationVerified: membership.associationVerifiedAt !== null,
        certificationVerified: membership.certificationVerifiedAt !== null,
        token,
        qrSvg,
      },
    };
  }
}
