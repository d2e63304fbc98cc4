import type { Knex } from 'knex';
import type { SponsorValue } from '../../contracts/books/books-answers';
import type { AgreementCreated, CashReceived, OverdueItem } from '../../contracts/sponsors/sponsor-answers';
import { recordMovement, type Movement } from '../books/ledger-writer';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Province } from '../shop/tax';
import type { AgreementRepository } from './agreement-repository';
import { ledgerLines, nextDue, summaryByKind, type DeliverableKind } from './sponsor-ledger';
import type { SponsorRepository } from './sponsor-repository';
import type { TaxTreatment } from './sponsor-tax';
import type { SponsorTaxService } from './sponsor-tax-service';
import type { SponsorTierService } from './sponsor-tier-service';
import { seasonOf } from './sponsor-tiers';
import { toInput, type AgreementView } from './sponsor-views';

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

/** Season agreements: recording them and their cash, each sponsor's ledger, the season's value and what is overdue; no HTTP here. */
export class AgreementService {
  constructor(
    private readonly db: Knex,
    private readonly sponsors: SponsorRepository,
    private readonly repo: AgreementRepository,
    private readonly taxes: SponsorTaxService,
    private readonly tiers: SponsorTierService,
  ) {}

  /** Records a season's agreement with its in-kind items and deliverables in one transaction, so no half-agreement is ever seen. */
  async addAgreement(sponsorId: number, input: AgreementInput): Promise<AgreementCreated> {
    if (!(await this.sponsors.byId(sponsorId))) throw notFound('No such sponsor.');
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
  ): Promise<CashReceived> {
    return this.db.transaction(async (trx) => {
      const a = await this.repo.lockAgreement(trx, agreementId);
      if (!a) throw notFound('No such agreement.');
      if (a.cash_movement_id !== null || a.cash_received_on !== null)
        throw conflict('cash_already_received', 'The cash for this agreement is already recorded as received.');
      if (a.cash_cents === 0)
        throw badRequest('This agreement promises no cash.', { receivedOn: 'Nothing to receive.' });
      const sponsor = (await this.sponsors.byId(a.sponsor_id, trx))!;
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
      this.tiers.listedNow(today),
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

  /** The season's sponsorship per sponsor: cash, declared in-kind value, tier, and deliverables promised vs delivered. */
  async seasonValue(today: string): Promise<SponsorValue> {
    const season = seasonOf(today);
    const sponsors = await this.tiers.withTiers(today);
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

  /** Overdue deliverables across every sponsor, for the staff dashboard card. */
  async overdue(today: string): Promise<OverdueItem[]> {
    const [rows, sponsors, listed] = await Promise.all([
      this.repo.deliverables(null),
      this.sponsors.all(),
      this.tiers.listedNow(today),
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
}
