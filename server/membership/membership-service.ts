import type { Knex } from 'knex';
import QRCode from 'qrcode';
import { AppError, badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { ClubCalendar } from '../platform/club-calendar';
import type { SessionUser } from '../platform/roles';
import type { SettingsService } from '../settings/settings-service';
import type { SaveCardResult } from '../payments/saved-cards';
import type { CardDues, CardDuesResult, CardSource } from './card-dues';
import type { CheckInTokens } from './check-in-token';
import { termPolicy, type DuesSettlement } from './dues-settlement';
import { dateOnly, type MembershipRepository, type MembershipRow, type PlanRow } from './membership-repository';
import { MEMBERSHIP_SETTINGS, type MembershipSettings } from './membership-settings';
import { membershipView, planView } from './membership-views';
import { withVoidedVerifications } from './flying-status';
import { duesFor, isJuniorOn, renewalOpensOn, termForPayment, type Term } from './terms';

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
  profile?: Partial<Pick<ProfileInput, 'associationNumber' | 'associationExpires' | 'certificationLevel' | 'certificationDate' | 'address' | 'phone' | 'emergencyContact'>>;
}

const declined = (message: string) => new AppError(402, 'payment_declined', message, { paymentToken: message });
const unknownOutcome = () =>
  new AppError(502, 'payment_unconfirmed', 'The card processor did not confirm the payment. It is recorded; the treasurer will check it before you are charged again.');

/** The membership a card payment paid for, or the error the member sees. */
function paidMembership(result: CardDuesResult, inProgress: () => AppError): MembershipRow {
  if (result.outcome === 'paid') return result.membership;
  if (result.outcome === 'in_progress') throw inProgress();
  throw result.outcome === 'declined' ? declined(result.message) : unknownOutcome();
}

/** For the audit: which verifications an edit voided. */
const voidedNote = (patch: Partial<MembershipRow>) => {
  const voided = [...('association_verified_at' in patch ? ['association'] : []), ...('certification_verified_at' in patch ? ['certification'] : [])];
  return voided.length ? { verificationVoided: voided } : {};
};

/** Joining, renewing and the member's own card: the rules, with no HTTP. */
export class MembershipService {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly settings: SettingsService,
    private readonly settlement: DuesSettlement,
    private readonly cardDues: CardDues,
    private readonly tokens: CheckInTokens,
    private readonly clock: Clock,
    private readonly calendar: ClubCalendar,
  ) {}

  /** Today in the club's time zone. */
  today(): string {
    return this.calendar.today();
  }

  async plans() {
    return { items: (await this.repo.plans(false)).map(planView) };
  }

  /** What the join form shows: the waiver, versions, certification levels and the term rule. */
  async policy() {
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
  async quote(userId: number | null, planId: number, on?: string) {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const plan = await this.activePlan(planId);
    const m = userId ? await this.repo.byUser(userId) : undefined;
    const priced = this.price(plan, m, on ?? this.today(), s);
    return { amountCents: priced.amountCents, duesCents: priced.duesCents, joiningFeeCents: priced.joiningFeeCents, termStart: priced.term.start, termEnd: priced.term.end, renewal: priced.term.renewal };
  }

  async join(user: SessionUser, input: JoinInput) {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const policy = termPolicy(s);
    const plan = await this.activePlan(input.planId);
    const existing = await this.repo.byUser(user.id);
    if (existing && existing.status !== 'pending') throw conflict('already_member', 'You already have a membership; renew it instead.');
    this.checkAcceptance(s, input.waiverVersion, input.safetyCodeVersion);
    const today = this.today();
    const priced = this.price(plan, undefined, today, s);
    this.checkProfile(input.profile, plan, priced.term, s);
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
        if (existing && (await this.repo.byId(Number(existing.id), trx, true))!.status !== 'pending') throw conflict('already_member', 'You already have a membership; renew it instead.');
        const created = existing
          ? await this.repo.update(trx, Number(existing.id), withVoidedVerifications(existing, row))
          : await this.repo.insert(trx, { ...row, user_id: String(user.id), status: 'pending', term_start: null, term_end: null, processor_customer_id: null });
        await this.repo.replaceFamily(trx, Number(created.id), plan.eligibility === 'family' ? (input.profile.familyMembers ?? []) : []);
        await this.repo.addAudit(trx, Number(created.id), user.id, existing ? 'profile_resubmitted' : 'joined', { plan: plan.code, waiverVersion: s.waiverVersion, safetyCodeVersion: s.safetyCodeVersion });
        return created;
      })
      .catch((err: { code?: string }) => {
        // Two join submits at once: the account's one membership row already exists.
        throw err.code === '23505' ? conflict('already_member', 'Your membership is already being set up; reload the page.') : err;
      });
    const source: CardSource = input.autoRenew
      ? { keyTail: await this.cardDues.savedCardTail(m, priced.term, priced.amountCents, 'join'), saveCard: () => this.saveCard(m, user, input.paymentToken) }
      : { token: input.paymentToken };
    const result = await this.cardDues.pay(m, plan, priced.term, priced.amountCents, source, { today, policy, actorUserId: user.id, at });
    const paid = paidMembership(result, () => conflict('payment_in_progress', 'Your first payment is already being processed; check your membership in a moment.'));
    return { membership: membershipView(paid, plan, today, policy, s) };
  }

  async renew(user: SessionUser, input: RenewInput) {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const policy = termPolicy(s);
    const m = await this.repo.byUser(user.id);
    if (!m) throw notFound('You have no membership yet; join first.');
    if (m.status === 'pending') throw conflict('membership_pending', 'Your first payment has not gone through yet; finish joining first.');
    const plan = await this.activePlan(input.planId ?? Number(m.plan_id));
    if (m.waiver_version !== s.waiverVersion || m.safety_code_version !== s.safetyCodeVersion) this.checkAcceptance(s, input.waiverVersion, input.safetyCodeVersion);
    const today = this.today();
    if (!input.paymentToken && !m.processor_customer_id) throw badRequest('Choose a card to pay with.', { paymentToken: 'Choose a card to pay with.' });
    const at = this.clock.now();
    const { updated, priced } = await this.db.transaction(async (trx) => {
      // Priced from the locked row: a click that waited behind a finished renewal must not buy the term after it.
      const locked = (await this.repo.byId(Number(m.id), trx, true))!;
      const paidThrough = dateOnly(locked.term_end);
      if (paidThrough && today < renewalOpensOn(paidThrough)) {
        throw conflict('already_renewed', `Your dues are paid through ${paidThrough}; renewing for the term after opens on ${renewalOpensOn(paidThrough)}.`);
      }
      const priced = this.price(plan, locked, today, s);
      if (plan.eligibility === 'junior' && !isJuniorOn(dateOnly(locked.date_of_birth)!, priced.term.start)) {
        throw badRequest('The junior plan is for members under 18 on the first day of the term; choose another plan.', { planId: 'You are 18 or over on the first day of the new term.' });
      }
      const patch: Partial<MembershipRow> = { plan_id: plan.id };
      if (m.waiver_version !== s.waiverVersion || m.safety_code_version !== s.safetyCodeVersion) {
        Object.assign(patch, { waiver_version: s.waiverVersion, waiver_accepted_at: at, safety_code_version: s.safetyCodeVersion, safety_code_accepted_at: at });
      }
      Object.assign(patch, this.profilePatch(s, input.profile ?? {}));
      const full = withVoidedVerifications(locked, patch);
      const row = await this.repo.update(trx, Number(m.id), full);
      await this.repo.addAudit(trx, Number(m.id), user.id, 'renewal_started', { plan: plan.code, changed: Object.keys(patch), ...voidedNote(full) });
      return { updated: row, priced };
    });
    // The saved card's key is the same for every request of one attempt, so simultaneous clicks share one charge.
    const source: CardSource = input.paymentToken
      ? { token: input.paymentToken }
      : { customerId: updated.processor_customer_id!, keyTail: await this.cardDues.savedCardTail(updated, priced.term, priced.amountCents, 'member') };
    const result = await this.cardDues.pay(updated, plan, priced.term, priced.amountCents, source, { today, policy, actorUserId: user.id, at });
    const paid = paidMembership(result, () => conflict('renewal_in_progress', 'Your renewal is already being paid; check your membership in a moment.'));
    return { membership: membershipView(paid, plan, today, policy, s) };
  }

  /** The caller's membership; the stored status and role catch up with the dates on the way. */
  /**
   * The caller's membership, or {membership: null} before they join: a signed-in fan without one is an ordinary
   * state, and a 404 would be written to the browser console as an error on every visit to the dues page.
   */
  async meOrNone(userId: number) {
    if (!(await this.repo.byUser(userId))) return { membership: null };
    return this.me(userId);
  }

  async me(userId: number) {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const policy = termPolicy(s);
    const today = this.today();
    let m = await this.repo.byUser(userId);
    if (!m) throw notFound('You have no membership yet.');
    await this.db.transaction(async (trx) => this.settlement.refreshStatus(trx, (await this.repo.byId(Number(m!.id), trx, true))!, today, policy, userId));
    m = (await this.repo.byId(Number(m.id)))!;
    const family = await this.repo.family(Number(m.id));
    return { membership: { ...membershipView(m, await this.repo.plan(Number(m.plan_id)), today, policy, s), familyMembers: family.map((f) => ({ name: f.name, dateOfBirth: dateOnly(f.date_of_birth) })) } };
  }

  /** The member's own corrections between renewals (a renewed association expiry, a new certification); audited. */
  async updateProfile(user: SessionUser, input: NonNullable<RenewInput['profile']>) {
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const patch = this.profilePatch(s, input, 'certificationLevel');
    await this.db.transaction(async (trx) => {
      const m = await this.repo.byUser(user.id, trx, true);
      if (!m) throw notFound('You have no membership yet.');
      if (!Object.keys(patch).length) return;
      // A member's own edit of a verified value makes it a claim again until staff check it anew.
      const full = withVoidedVerifications(m, patch);
      await this.repo.update(trx, Number(m.id), full);
      await this.repo.addAudit(trx, Number(m.id), user.id, 'profile_updated', { changed: Object.keys(patch), ...voidedNote(full) });
    });
    return this.me(user.id);
  }

  /** Turns auto-renew on or off; `paymentToken` puts a new card on file. */
  async setAutoRenew(user: SessionUser, input: { autoRenew: boolean; paymentToken?: string }) {
    const m = await this.repo.byUser(user.id);
    if (!m) throw notFound('You have no membership yet.');
    if (input.autoRenew && !m.processor_customer_id && !input.paymentToken) throw badRequest('Choose a card to keep on file.', { paymentToken: 'Choose a card to keep on file.' });
    if (input.paymentToken) {
      const saved = await this.saveCard(m, user, input.paymentToken);
      if (saved.outcome === 'declined') throw declined(saved.message);
    }
    await this.db.transaction(async (trx) => {
      await this.repo.update(trx, Number(m.id), { auto_renew: input.autoRenew, renewal_failed_at: input.paymentToken ? null : m.renewal_failed_at });
      await this.repo.addAudit(trx, Number(m.id), user.id, 'auto_renew_changed', { autoRenew: input.autoRenew, newCard: Boolean(input.paymentToken) });
    });
    return this.me(user.id);
  }

  /** The printable card: who, number, plan, term end, certification and the signed check-in token as a QR code. */
  async card(userId: number) {
    const { membership } = await this.me(userId);
    if (membership.status === 'pending') throw conflict('membership_pending', 'Your card is ready once your first payment has gone through.');
    const s = await this.settings.get(MEMBERSHIP_SETTINGS);
    const token = this.tokens.sign(membership.memberNumber, this.clock.now());
    // A quiet zone of four modules on every side, black on white (ISO/IEC 18004, from memory), so phone scanners find it.
    const qrSvg = await QRCode.toString(token, { type: 'svg', errorCorrectionLevel: 'M', margin: 4, color: { dark: '#000000ff', light: '#ffffffff' } });
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

  /** Puts the card on file with the processor and keeps the customer id and the card's brand and last four. */
  private async saveCard(m: MembershipRow, user: SessionUser, token: string): Promise<SaveCardResult> {
    const saved = m.processor_customer_id
      ? await this.cardDues.savedCards.replace(m.processor_customer_id, token)
      : await this.cardDues.savedCards.save(token, user.email, m.legal_name, `customer:${m.id}:${token}`);
    if (saved.outcome === 'saved') {
      await this.repo.update(this.db, Number(m.id), { processor_customer_id: saved.customerId, card_brand: saved.card?.brand ?? null, card_last4: saved.card?.last4 ?? null });
    }
    return saved;
  }

  private async activePlan(planId: number): Promise<PlanRow> {
    const plan = await this.repo.plan(planId);
    if (!plan || !plan.active) throw badRequest('Choose one of the plans on offer.', { planId: 'Choose one of the plans on offer.' });
    return plan;
  }

  private price(plan: PlanRow, m: MembershipRow | undefined, today: string, s: MembershipSettings) {
    const policy = termPolicy(s);
    const currentEnd = dateOnly(m?.term_end);
    const term = termForPayment(today, currentEnd, policy);
    const duesCents = duesFor(plan.dues_cents, term, policy);
    const joiningFeeCents = currentEnd ? 0 : plan.joining_fee_cents;
    return { term, duesCents, joiningFeeCents, amountCents: duesCents + joiningFeeCents };
  }

  private checkAcceptance(s: MembershipSettings, waiverVersion?: string, safetyCodeVersion?: string): void {
    if (waiverVersion !== s.waiverVersion) throw badRequest('Read and accept the current waiver.', { waiverVersion: `Accept waiver version ${s.waiverVersion}.` });
    if (safetyCodeVersion !== undefined && safetyCodeVersion !== s.safetyCodeVersion) {
      throw badRequest('Read and accept the current safety code.', { safetyCodeVersion: `Accept safety code version ${s.safetyCodeVersion}.` });
    }
  }

  private profilePatch(s: MembershipSettings, p: NonNullable<RenewInput['profile']>, field = 'profile.certificationLevel'): Partial<MembershipRow> {
    const patch: Partial<MembershipRow> = {};
    if (p.associationNumber !== undefined) patch.association_number = p.associationNumber;
    if (p.associationExpires !== undefined) patch.association_expires = p.associationExpires;
    if (p.certificationLevel !== undefined) patch.certification_level = this.checkLevel(s, p.certificationLevel, field);
    if (p.certificationDate !== undefined) patch.certification_date = p.certificationDate;
    if (p.address !== undefined) patch.address = p.address;
    if (p.phone !== undefined) patch.phone = p.phone;
    if (p.emergencyContact !== undefined) patch.emergency_contact = p.emergencyContact;
    return patch;
  }

  private checkLevel(s: MembershipSettings, level: string, field = 'profile.certificationLevel'): string {
    if (!s.certificationLevels.some((l) => l.code === level)) throw badRequest('Choose a certification level from the list.', { [field]: 'Choose a level from the list.' });
    return level;
  }

  private checkProfile(p: ProfileInput, plan: PlanRow, term: Term, s: MembershipSettings): void {
    if (p.dateOfBirth > term.start) throw badRequest('Check the date of birth.', { 'profile.dateOfBirth': 'The date of birth is in the future.' });
    if (plan.eligibility === 'junior' && !isJuniorOn(p.dateOfBirth, term.start)) {
      throw badRequest('The junior plan is for members under 18 on the first day of the term.', { planId: 'You are 18 or over on the first day of the term; choose another plan.' });
    }
    if (plan.eligibility !== 'family' && p.familyMembers?.length) throw badRequest('Only the family plan covers more people.', { 'profile.familyMembers': 'Choose the family plan to add family members.' });
    this.checkLevel(s, p.certificationLevel ?? 'none');
  }
}
