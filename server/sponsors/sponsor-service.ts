import type { Knex } from 'knex';
import type { SponsorValue } from '../../contracts/books/books-answers';
import type { OverdueItem } from '../../contracts/sponsors/sponsor-answers';
import type { UserRepository } from '../auth/user-repository';
import { recordMovement, type Movement } from '../books/ledger-writer';
import { slugify, uniqueSlug } from '../platform/slug';
import { AppError, badRequest, conflict, notFound } from '../platform/app-error';
import type { SettingsService } from '../settings/settings-service';
import type { Province } from '../shop/tax';
import type { CreditService } from './credit-service';
import { ledgerLines, nextDue, summaryByKind, type DeliverableKind } from './sponsor-ledger';
import type { SponsorRepository } from './sponsor-repository';
import type { TaxTreatment } from './sponsor-tax';
import type { SponsorTaxService } from './sponsor-tax-service';
import type { StoredImage } from '../uploads/image-uploads';
import { seasonOf, SPONSOR_TIERS, tierFor, type Tier } from './sponsor-tiers';
import { toCredit, toInput, toView, type AgreementView, type CreditView, type SponsorView } from './sponsor-views';

export interface SponsorInput {
  name: string;
  website?: string | null;
  blurb?: string | null;
  logoUrl?: string | null;
}

export interface AgreementInput {
  season: string;
  taxTreatment?: TaxTreatment;
  taxProvince?: Province | null;
  cashCents?: number;
  cashReceivedOn?: string | null;
  note?: string | null;
  inKind?: { description: string; valueCents: number; receivedOn?: string | null }[];
  deliverables: { kind: DeliverableKind; quantity: number; dueOn: string }[];
}

/** Sponsors, agreements, the ledger, tiers and the portal's view; no HTTP here. */
export class SponsorService {
  constructor(
    private readonly db: Knex,
    private readonly repo: SponsorRepository,
    private readonly credits: CreditService,
    private readonly users: UserRepository,
    private readonly settings: SettingsService,
    private readonly taxes: SponsorTaxService,
    /** Sizes of uploaded logos, so the sponsors page can reserve each logo's space before it loads. */
    private readonly describeImages: (urls: readonly string[]) => Promise<Map<string, StoredImage>> = async () =>
      new Map(),
  ) {}

  /** Adds a sponsor under a slug made from its name and not yet taken. */
  async create(input: SponsorInput): Promise<SponsorView> {
    return this.db.transaction(async (trx) => {
      const base = slugify(input.name);
      const slug = uniqueSlug(base, await this.repo.slugsLike(base, trx));
      return toView(
        await this.repo.insert(trx, {
          slug,
          name: input.name,
          website: input.website ?? null,
          blurb: input.blurb ?? null,
          logoUrl: input.logoUrl ?? null,
        }),
      );
    });
  }

  /** Saves a sponsor's public details; 404 when there is no such sponsor. */
  async update(id: number, input: SponsorInput): Promise<SponsorView> {
    const row = await this.repo.update(this.db, id, {
      name: input.name,
      website: input.website ?? null,
      blurb: input.blurb ?? null,
      logoUrl: input.logoUrl ?? null,
    });
    if (!row) throw notFound('No such sponsor.');
    return toView(row);
  }

  /** One sponsor as staff see it; 404 when there is none. */
  async get(id: number): Promise<SponsorView> {
    const row = await this.repo.byId(id);
    if (!row) throw notFound('No such sponsor.');
    return toView(row);
  }

  /** Records a season's agreement with its in-kind items and deliverables in one transaction, so no half-agreement is ever seen. */
  async addAgreement(sponsorId: number, input: AgreementInput): Promise<{ id: number }> {
    await this.get(sponsorId);
    try {
      return await this.db.transaction(async (trx) => {
        const taxTreatment = input.taxTreatment ?? 'gift';
        const taxProvince = taxTreatment === 'promotion' ? (input.taxProvince ?? null) : null;
        if (taxTreatment === 'promotion' && !taxProvince)
          throw badRequest('Choose the sponsor’s province.', {
            taxProvince: 'Promotion is taxed at the rate of the sponsor’s province.',
          });
        const id = await this.repo.insertAgreement(trx, {
          sponsorId,
          season: input.season,
          cashCents: input.cashCents ?? 0,
          cashReceivedOn: null,
          note: input.note ?? null,
          taxTreatment,
          taxProvince,
        });
        await this.repo.insertInKind(
          trx,
          id,
          (input.inKind ?? []).map((i) => ({
            description: i.description,
            valueCents: i.valueCents,
            receivedOn: i.receivedOn ?? null,
          })),
        );
        await this.repo.insertDeliverables(trx, id, input.deliverables);
        return { id };
      });
    } catch (err) {
      if ((err as { code?: string }).code === '23505')
        throw conflict('season_taken', `This sponsor already has an agreement for ${input.season}.`, {
          season: 'One agreement per season; edit the existing one.',
        });
      throw err;
    }
  }

  /** Staff record the promised cash as received: one money movement, in the same transaction, once. */
  async recordCashReceived(
    agreementId: number,
    input: { receivedOn: string; method: Movement['method'] },
    at: Date,
  ): Promise<{ movementId: number | null }> {
    return this.db.transaction(async (trx) => {
      const a = await this.repo.lockAgreement(trx, agreementId);
      if (!a) throw notFound('No such agreement.');
      if (a.cash_movement_id !== null || a.cash_received_on !== null)
        throw conflict('cash_already_received', 'The cash for this agreement is already recorded as received.');
      if (a.cash_cents === 0)
        throw badRequest('This agreement promises no cash.', { receivedOn: 'Nothing to receive.' });
      const sponsor = (await this.repo.byId(a.sponsor_id, trx))!;
      // Promotion bought is taxed on the day the cash comes in; the sponsor pays the amount plus GST/HST.
      const taxes = await this.taxes.movementTaxes(a, input.receivedOn);
      const movementId = await recordMovement(trx, {
        occurredAt: at,
        kind: 'sponsor_cash',
        source: 'sponsor',
        reference: String(a.id),
        counterparty: sponsor.name,
        grossCents: a.cash_cents + taxes.reduce((n, t) => n + t.taxCents, 0),
        method: input.method,
        idempotencyKey: `sponsor-cash:${a.id}`,
        taxes,
      });
      await this.repo.markCashReceived(trx, agreementId, input.receivedOn, movementId);
      return { movementId };
    });
  }

  /** Every agreement of the sponsor with its ledger as of `today`. */
  async agreements(sponsorId: number, today: string): Promise<AgreementView[]> {
    const rows = await this.repo.agreements(sponsorId);
    const ids = rows.map((a) => a.id);
    const [inKind, deliverables, listed] = await Promise.all([
      this.repo.inKind(ids),
      this.repo.deliverables(sponsorId),
      this.listedNow(today),
    ]);
    return rows.map((a) => {
      const items = inKind
        .filter((i) => i.agreement_id === a.id)
        .map((i) => ({
          id: i.id,
          description: i.description,
          valueCents: i.value_cents,
          receivedOn: i.received_on,
        }));
      const lines = ledgerLines(
        deliverables.filter((d) => d.agreement_id === a.id).map((d) => toInput(d, listed, seasonOf(today))),
        today,
      );
      const inKindCents = items.reduce((s, i) => s + i.valueCents, 0);
      return {
        id: a.id,
        season: a.season,
        cashCents: a.cash_cents,
        cashReceivedOn: a.cash_received_on,
        cashReceivedCents: a.cash_received_on !== null ? a.cash_cents : 0,
        taxTreatment: a.tax_treatment,
        taxProvince: a.tax_province,
        inKind: items,
        inKindCents,
        totalCents: a.cash_cents + inKindCents,
        note: a.note,
        deliverables: lines,
        byKind: summaryByKind(lines),
        overdue: lines.filter((l) => l.overdue),
        nextDue: nextDue(lines, today),
      };
    });
  }

  /** Every credit the sponsor was given, for the ledger. */
  async creditsOf(sponsorId: number): Promise<CreditView[]> {
    return (await this.repo.credits(sponsorId)).map(toCredit);
  }

  /** Records a credit given by hand, counted against an open promise of its kind when there is one. */
  async recordCredit(
    sponsorId: number,
    input: {
      kind: DeliverableKind;
      url: string | null;
      videoTimestamp?: string | null;
      note?: string | null;
      creditedAt: Date;
    },
    userId: number,
  ): Promise<{ id: number; counted: boolean }> {
    await this.get(sponsorId);
    const r = await this.db.transaction((trx) =>
      this.credits.recordByHand(
        trx,
        sponsorId,
        { ...input, videoTimestamp: input.videoTimestamp ?? null, note: input.note ?? null },
        userId,
      ),
    );
    return { id: r.id, counted: r.deliverableId !== null };
  }

  /** Links an account as a contact; only accounts holding the `sponsor` role can be contacts. */
  async addContact(sponsorId: number, who: { userId?: number; email?: string }): Promise<{ userId: number }> {
    await this.get(sponsorId);
    const user =
      who.userId !== undefined ? await this.users.byId(who.userId) : await this.users.byEmail(who.email ?? '');
    if (!user)
      throw new AppError(404, 'not_found', 'No account matches.', {
        [who.userId !== undefined ? 'userId' : 'email']: 'No account matches.',
      });
    if (!user.roles.includes('sponsor'))
      throw conflict(
        'not_a_sponsor_account',
        'That account does not hold the sponsor role; an admin can grant it on the accounts page.',
        { email: 'Needs the sponsor role first.' },
      );
    await this.repo.addContact(this.db, sponsorId, user.id);
    return { userId: user.id };
  }

  /** Takes portal access away from an account; 404 when it was not a contact. */
  async removeContact(sponsorId: number, userId: number): Promise<void> {
    if (!(await this.db.transaction((trx) => this.repo.removeContact(trx, sponsorId, userId))))
      throw notFound('That account is not a contact of this sponsor.');
  }

  /** The accounts that can open the sponsor's portal. */
  async contacts(sponsorId: number): Promise<{ userId: number; email: string; displayName: string }[]> {
    return (await this.repo.contacts(sponsorId)).map((c) => ({
      userId: c.user_id,
      email: c.email,
      displayName: c.display_name,
    }));
  }

  /** The sponsor tiers as configured. */
  tiers(): Promise<{ tiers: Tier[] }> {
    return this.settings.get(SPONSOR_TIERS);
  }

  /** Saves the sponsor tiers, lowest threshold first, so the tier rule can read them in order. */
  setTiers(value: { tiers: Tier[] }): Promise<{ tiers: Tier[] }> {
    return this.settings.put(SPONSOR_TIERS, { tiers: [...value.tiers].sort((a, b) => a.minCents - b.minCents) });
  }

  /** The sponsors the public page lists now: those holding a tier this season. */
  private async listedNow(today: string): Promise<Set<number>> {
    return new Set((await this.withTiers(today)).filter((s) => s.tier !== null).map((s) => s.id));
  }

  /** Every sponsor with the tier its current-season total reaches (null without an agreement this season). */
  async withTiers(today: string): Promise<(SponsorView & { tier: string | null; seasonTotalCents: number })[]> {
    const season = seasonOf(today);
    const [rows, totals, { tiers }] = await Promise.all([
      this.repo.all(),
      this.repo.seasonTotals(season),
      this.tiers(),
    ]);
    return rows.map((s) => {
      const total = totals.get(s.id);
      return {
        ...toView(s),
        tier: total === undefined ? null : (tierFor(total, tiers)?.name ?? null),
        seasonTotalCents: total ?? 0,
      };
    });
  }

  /** The season's sponsorship per sponsor: cash, declared in-kind value, tier, and deliverables promised vs delivered. */
  async seasonValue(today: string): Promise<SponsorValue> {
    const season = seasonOf(today);
    const sponsors = await this.withTiers(today);
    const items = [];
    for (const s of sponsors) {
      const agreements = (await this.agreements(s.id, today)).filter((a) => a.season === season);
      if (!agreements.length) continue;
      const sum = (f: (a: AgreementView) => number) => agreements.reduce((n, a) => n + f(a), 0);
      items.push({
        sponsor: s.name,
        tier: s.tier,
        cashCents: sum((a) => a.cashCents),
        inKindCents: sum((a) => a.inKindCents),
        totalCents: sum((a) => a.totalCents),
        promised: sum((a) => a.deliverables.reduce((n, d) => n + d.promised, 0)),
        delivered: sum((a) => a.deliverables.reduce((n, d) => n + Math.min(d.delivered, d.promised), 0)),
      });
    }
    return { season, items: items.sort((a, b) => b.totalCents - a.totalCents) };
  }

  /** The public sponsors page: tiers from the highest down, each sponsor with the posts that credit it. */
  async publicWall(today: string): Promise<{
    season: string;
    tiers: {
      name: string;
      sponsors: (SponsorView & {
        logoSize: { width: number; height: number } | null;
        posts: { slug: string; title: string }[];
      })[];
    }[];
  }> {
    const [sponsors, posts, { tiers }] = await Promise.all([
      this.withTiers(today),
      this.repo.creditingPosts(),
      this.tiers(),
    ]);
    const logos = await this.describeImages(sponsors.flatMap((s) => (s.logoUrl ? [s.logoUrl] : [])));
    const ordered = [...tiers].sort((a, b) => b.minCents - a.minCents);
    return {
      season: seasonOf(today),
      tiers: ordered
        .map((t) => ({
          name: t.name,
          sponsors: sponsors
            .filter((s) => s.tier === t.name)
            .sort((a, b) => b.seasonTotalCents - a.seasonTotalCents || a.name.localeCompare(b.name))
            .map((s) => ({
              id: s.id,
              slug: s.slug,
              name: s.name,
              website: s.website,
              blurb: s.blurb,
              logoUrl: s.logoUrl,
              logoSize: logoSizeOf(logos, s.logoUrl),
              posts: posts.filter((p) => p.sponsor_id === s.id).map((p) => ({ slug: p.slug, title: p.title })),
            })),
        }))
        .filter((t) => t.sponsors.length),
    };
  }

  /** Overdue deliverables across every sponsor, for the staff dashboard card. */
  async overdue(today: string): Promise<OverdueItem[]> {
    const [rows, sponsors, listed] = await Promise.all([
      this.repo.deliverables(null),
      this.repo.all(),
      this.listedNow(today),
    ]);
    const names = new Map(sponsors.map((s) => [s.id, s.name]));
    return ledgerLines(
      rows.map((d) => toInput(d, listed, seasonOf(today))),
      today,
    )
      .filter((l) => l.overdue)
      .map((l) => {
        const d = rows.find((r) => r.id === l.id)!;
        return {
          sponsorId: d.sponsor_id,
          sponsorName: names.get(d.sponsor_id) ?? '',
          agreementId: d.agreement_id,
          kind: l.kind,
          promised: l.promised,
          delivered: l.delivered,
          dueOn: l.dueOn,
        };
      });
  }

  /** The sponsor an account is a contact of; 404 when it is linked to none. */
  async sponsorOfUser(userId: number): Promise<SponsorView> {
    const row = await this.repo.sponsorOfUser(userId);
    if (!row)
      throw notFound('Your account is not linked to a sponsor yet. Ask the club’s treasurer to add you as a contact.');
    return toView(row);
  }
}

/** A logo's stored size in pixels; null when the address is not a stored upload. */
function logoSizeOf(logos: Map<string, StoredImage>, url: string | null): { width: number; height: number } | null {
  const logo = url ? logos.get(url) : undefined;
  return logo ? { width: logo.width, height: logo.height } : null;
}
