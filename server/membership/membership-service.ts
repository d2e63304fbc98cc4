import type { Knex } from 'knex';
import type { DuesQuote, Membership, MembershipPolicy, Plan } from '../../contracts/membership/membership-answers';
import { AppError, badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { ClubCalendar } from '../platform/club-calendar';
import type { SessionUser } from '../platform/roles';
import type { SettingsService } from '../settings/settings-service';
import type { CardDues, CardDuesResult, CardSource } from './card-dues';
import { declined, type CardOnFile } from './card-on-file';
import { termPolicy } from './dues-settlement';
import { withVoidedVerifications } from './flying-status';
import { type MembershipRepository, type MembershipRow, type PlanRow } from './membership-repository';
import { checkAcceptance, checkProfile, priceFor, profilePatch, voidedNote } from './membership-rules';
import { MEMBERSHIP_SETTINGS } from './membership-settings';
import { membershipView, planView } from './membership-views';
import type { PlanRepository } from './plan-repository';
import { isJuniorOn, renewalOpensOn } from './terms';

/** The member profile as the join form sends it. */
export interface ProfileInput {
  legalName: string;
  dateOfBirth: string;
  address: string;
  phone: string;
  emergencyContact: string;
  associationNumber?: string | null;
  associationExpires?: string | null;
  certificationLevel?: string;
  certificationDate?: string | null;
  familyMembers?: { name: string; dateOfBirth: string }[];
}

export interface JoinInput {
  planId: number;
  profile: ProfileInput;
  waiverVersion: string;
  safetyCodeVersion?: string;
  paymentToken: string;
  autoRenew?: boolean;
}

export interface RenewInput {
  paymentToken?: string;
  planId?: number;
  waiverVersion?: string;
  safetyCodeVersion?: string;
  profile?: Partial<
    Pick<
      ProfileInput,
      | 'associationNumber'
      | 'associationExpires'
      | 'certificationLevel'
      | 'certificationDate'
      | 'address'
      | 'phone'
      | 'emergencyContact'
    >
  >;
}

const unknownOutcome = () =>
  new AppError(
    502,
    'payment_unconfirmed',
    'The card processor did not confirm the payment. It is recorded; the treasurer will check it before you are charged again.',
  );

/** The membership a card payment paid for, or the error the member sees. */
function paidMembership(result: CardDuesResult, inProgress: () => AppError): MembershipRow {
  if (result.outcome === 'paid') return result.membership;
  if (result.outcome === 'in_progress') throw inProgress();
  throw result.outcome === 'declined' ? declined(result.message) : unknownOutcome();
}

/** Plans on offer, prices, joining and renewing: the paying side of a membership, with no HTTP. */
export class MembershipService {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly planRepo: PlanRepository,
    private readonly settings: SettingsService,
    private readonly cardDues: CardDues,
    private readonly cardOnFile: CardOnFile,
    private readonly clock: Clock,
    private readonly calendar: ClubCalendar,
  ) {}

  /** Today in the club's time zone. */
  today(): string {
    return this.calendar.today();
  }

  /** The plans a visitor can join or renew on now. */
  async plans(): Promise<{ items: Plan[] }> {
    return { items: (await this.planRepo.offeredPlans()).map(planView) };
  }

  /** What the join form shows: the waiver, versions, certification levels and the term rule. */
  async policy(): Promise<MembershipPolicy> {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    return {
      termRule: s.termRule,
      lateSeasonFrom: s.lateSeasonFrom,
      graceDays: s.graceDays,
      prorate: s.prorate,
      waiverVersion: s.waiverVersion,
      waiverText: s.waiverText,
      safetyCodeVersion: s.safetyCodeVersion,
      associationName: s.associationName,
      certificationLevels: s.certificationLevels,
    };
  }

  /** Price and term of paying for a plan on `on` (default today), as a renewal if the caller already has a term. */
  async quote(userId: number | null, planId: number, on?: string): Promise<DuesQuote> {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const plan = await this.activePlan(planId);
    const m = userId ? await this.repo.byUser(userId) : undefined;
    const priced = priceFor(plan, m, on ?? this.today(), s);
    return {
      amountCents: priced.amountCents,
      duesCents: priced.duesCents,
      joiningFeeCents: priced.joiningFeeCents,
      termStart: priced.term.start,
      termEnd: priced.term.end,
      renewal: priced.term.renewal,
    };
  }

  /** Records the new member's profile and charges the first dues; the membership stays pending until the card goes through. */
  async join(user: SessionUser, input: JoinInput): Promise<{ membership: Membership }> {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const policy = termPolicy(s);
    const plan = await this.activePlan(input.planId);
    const existing = await this.repo.byUser(user.id);
    if (existing && existing.status !== 'pending')
      throw conflict('already_member', 'You already have a membership; renew it instead.');
    checkAcceptance(s, input.waiverVersion, input.safetyCodeVersion);
    const today = this.today();
    const priced = priceFor(plan, undefined, today, s);
    checkProfile(input.profile, plan, priced.term, s);
    const at = this.clock.now();
    const row = {
      plan_id: plan.id,
      legal_name: input.profile.legalName,
      date_of_birth: input.profile.dateOfBirth,
      address: input.profile.address,
      phone: input.profile.phone,
      emergency_contact: input.profile.emergencyContact,
      association_number: input.profile.associationNumber ?? null,
      association_expires: input.profile.associationExpires ?? null,
      certification_level: input.profile.certificationLevel ?? 'none',
      certification_date: input.profile.certificationDate ?? null,
      waiver_version: s.waiverVersion,
      waiver_accepted_at: at,
      safety_code_version: s.safetyCodeVersion,
      safety_code_accepted_at: at,
      auto_renew: input.autoRenew ?? false,
    };
    const m = await this.db
      .transaction(async (trx) => {
        // A second submit that arrives after the first one paid finds the membership no longer pending.
        if (existing && (await this.repo.lockById(trx, existing.id))!.status !== 'pending')
          throw conflict('already_member', 'You already have a membership; renew it instead.');
        const created = existing
          ? await this.repo.update(trx, existing.id, withVoidedVerifications(existing, row))
          : await this.repo.insert(trx, {
              ...row,
              user_id: user.id,
              status: 'pending',
              term_start: null,
              term_end: null,
              processor_customer_id: null,
            });
        await this.repo.replaceFamily(
          trx,
          created.id,
          plan.eligibility === 'family' ? (input.profile.familyMembers ?? []) : [],
        );
        await this.repo.addAudit(trx, created.id, user.id, existing ? 'profile_resubmitted' : 'joined', {
          plan: plan.code,
          waiverVersion: s.waiverVersion,
          safetyCodeVersion: s.safetyCodeVersion,
        });
        return created;
      })
      .catch((err: { code?: string }) => {
        // Two join submits at once: the account's one membership row already exists.
        throw err.code === '23505'
          ? conflict('already_member', 'Your membership is already being set up; reload the page.')
          : err;
      });
    const source: CardSource = input.autoRenew
      ? {
          keyTail: await this.cardDues.savedCardTail(m, priced.term, priced.amountCents, 'join'),
          saveCard: () => this.cardOnFile.save(m, user, input.paymentToken),
        }
      : { token: input.paymentToken };
    const result = await this.cardDues.pay(m, plan, priced.term, priced.amountCents, source, {
      today,
      policy,
      actorUserId: user.id,
      at,
    });
    const paid = paidMembership(result, () =>
      conflict(
        'payment_in_progress',
        'Your first payment is already being processed; check your membership in a moment.',
      ),
    );
    return { membership: membershipView(paid, plan, today, policy, s) };
  }

  /** Charges the next term's dues, priced from the locked membership so a second click cannot buy the year after. */
  async renew(user: SessionUser, input: RenewInput): Promise<{ membership: Membership }> {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const policy = termPolicy(s);
    const m = await this.repo.byUser(user.id);
    if (!m) throw notFound('You have no membership yet; join first.');
    if (m.status === 'pending')
      throw conflict('membership_pending', 'Your first payment has not gone through yet; finish joining first.');
    const plan = await this.activePlan(input.planId ?? m.plan_id);
    if (m.waiver_version !== s.waiverVersion || m.safety_code_version !== s.safetyCodeVersion)
      checkAcceptance(s, input.waiverVersion, input.safetyCodeVersion);
    const today = this.today();
    if (!input.paymentToken && !m.processor_customer_id)
      throw badRequest('Choose a card to pay with.', { paymentToken: 'Choose a card to pay with.' });
    const at = this.clock.now();
    const { updated, priced } = await this.db.transaction(async (trx) => {
      // Priced from the locked row: a click that waited behind a finished renewal must not buy the term after it.
      const locked = (await this.repo.lockById(trx, m.id))!;
      const paidThrough = locked.term_end;
      if (paidThrough && today < renewalOpensOn(paidThrough)) {
        throw conflict(
          'already_renewed',
          `Your dues are paid through ${paidThrough}; renewing for the term after opens on ${renewalOpensOn(paidThrough)}.`,
        );
      }
      const priced = priceFor(plan, locked, today, s);
      if (plan.eligibility === 'junior' && !isJuniorOn(locked.date_of_birth!, priced.term.start)) {
        throw badRequest('The junior plan is for members under 18 on the first day of the term; choose another plan.', {
          planId: 'You are 18 or over on the first day of the new term.',
        });
      }
      const patch: Partial<MembershipRow> = { plan_id: plan.id };
      if (m.waiver_version !== s.waiverVersion || m.safety_code_version !== s.safetyCodeVersion) {
        Object.assign(patch, {
          waiver_version: s.waiverVersion,
          waiver_accepted_at: at,
          safety_code_version: s.safetyCodeVersion,
          safety_code_accepted_at: at,
        });
      }
      Object.assign(patch, profilePatch(s, input.profile ?? {}));
      const full = withVoidedVerifications(locked, patch);
      const row = await this.repo.update(trx, m.id, full);
      await this.repo.addAudit(trx, m.id, user.id, 'renewal_started', {
        plan: plan.code,
        changed: Object.keys(patch),
        ...voidedNote(full),
      });
      return { updated: row, priced };
    });
    // The saved card's key is the same for every request of one attempt, so simultaneous clicks share one charge.
    const source: CardSource = input.paymentToken
      ? { token: input.paymentToken }
      : {
          customerId: updated.processor_customer_id!,
          keyTail: await this.cardDues.savedCardTail(updated, priced.term, priced.amountCents, 'member'),
        };
    const result = await this.cardDues.pay(updated, plan, priced.term, priced.amountCents, source, {
      today,
      policy,
      actorUserId: user.id,
      at,
    });
    const paid = paidMembership(result, () =>
      conflict('renewal_in_progress', 'Your renewal is already being paid; check your membership in a moment.'),
    );
    return { membership: membershipView(paid, plan, today, policy, s) };
  }

  private async activePlan(planId: number): Promise<PlanRow> {
    const plan = await this.planRepo.plan(planId);
    if (!plan || !plan.active)
      throw badRequest('Choose one of the plans on offer.', { planId: 'Choose one of the plans on offer.' });
    return plan;
  }
}
