import type { Knex } from 'knex';
import type { TaxTreatmentAnswer } from '../../contracts/sponsors/sponsor-answers';
import type { MovementTax } from '../books/ledger-writer';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { SettingsService } from '../settings/settings-service';
import { SHOP_SETTINGS } from '../shop/shop-settings';
import type { Province, TaxLine, TaxRate } from '../shop/tax';
import type { AgreementRepository, AgreementRow } from './agreement-repository';
import type { SponsorRepository } from './sponsor-repository';
import { sponsorshipTaxes, type TaxTreatment } from './sponsor-tax';

/** The sales-tax rate table, read where the shop keeps it. */
export interface TaxRateSource {
  taxRates(): Promise<TaxRate[]>;
}

/** What a sponsorship invoice shows. */
export interface SponsorInvoice {
  number: string;
  date: string;
  paidOn: string | null;
  seller: { name: string; gstHstNumber: string; gstHstRegistered: boolean };
  sponsorName: string;
  season: string;
  promised: { kind: string; quantity: number; dueOn: string }[];
  amountCents: number;
  taxes: { label: string; amountCents: number }[];
  totalCents: number;
}

/** How sponsorships are taxed: the agreement's treatment, its GST/HST, and the invoice for promotion bought. */
export class SponsorTaxService {
  constructor(
    private readonly db: Knex,
    private readonly sponsors: SponsorRepository,
    private readonly repo: AgreementRepository,
    private readonly settings: SettingsService,
    private readonly rates: TaxRateSource,
    private readonly teamName: string,
  ) {}

  /** The GST/HST on an agreement's cash on `date` (none for a gift or an unregistered team). */
  async taxLines(
    a: Pick<AgreementRow, 'tax_treatment' | 'tax_province' | 'cash_cents'>,
    date: string,
  ): Promise<TaxLine[]> {
    const shop = await this.settings.get(SHOP_SETTINGS);
    return sponsorshipTaxes(
      {
        treatment: a.tax_treatment,
        province: (a.tax_province as Province | null) ?? null,
        cashCents: a.cash_cents,
        date,
      },
      await this.rates.taxRates(),
      shop.gstHstRegistered,
    );
  }

  /** The same lines as the ledger records them. */
  async movementTaxes(a: AgreementRow, date: string): Promise<MovementTax[]> {
    return (await this.taxLines(a, date)).map((t) => ({
      code: t.code,
      jurisdiction: t.jurisdiction,
      ratePercent: t.ratePercent,
      taxableCents: t.taxableCents,
      taxCents: t.amountCents,
    }));
  }

  /** Sets promotion (with the sponsor's province) or gift; refused once the cash is recorded with its tax. */
  async setTreatment(
    agreementId: number,
    input: { taxTreatment: TaxTreatment; province?: Province | null },
  ): Promise<TaxTreatmentAnswer> {
    const province = input.taxTreatment === 'promotion' ? (input.province ?? null) : null;
    if (input.taxTreatment === 'promotion' && !province)
      throw badRequest('Choose the sponsor’s province.', {
        province: 'Promotion is taxed at the rate of the sponsor’s province.',
      });
    return this.db.transaction(async (trx) => {
      const a = await this.repo.lockAgreement(trx, agreementId);
      if (!a) throw notFound('No such agreement.');
      if (a.cash_movement_id !== null || a.cash_received_on !== null) {
        throw conflict(
          'cash_already_received',
          'The cash is already recorded with its tax; the treatment can no longer change.',
          { taxTreatment: 'Fixed once the cash is recorded.' },
        );
      }
      await this.repo.setTaxTreatment(trx, agreementId, input.taxTreatment, province);
      return { taxTreatment: input.taxTreatment, taxProvince: province };
    });
  }

  /** The invoice of a promotion agreement, dated the day the cash came in (or `today` while it is due). */
  async invoice(agreementId: number, today: string): Promise<SponsorInvoice> {
    const a = await this.repo.agreementById(agreementId);
    if (!a) throw notFound('No such agreement.');
    if (a.tax_treatment !== 'promotion')
      throw conflict('not_promotion', 'A gift gets no invoice: set the agreement to promotion first.');
    if (a.cash_cents === 0) throw conflict('no_cash', 'This agreement promises no cash to invoice.');
    const [sponsor, shop, deliverables] = await Promise.all([
      this.sponsors.byId(a.sponsor_id),
      this.settings.get(SHOP_SETTINGS),
      this.repo.deliverables(a.sponsor_id),
    ]);
    const date = a.cash_received_on ?? today;
    const taxes = await this.taxLines(a, date);
    const taxCents = taxes.reduce((s, t) => s + t.amountCents, 0);
    return {
      number: `SP-${a.season}-${a.id}`,
      date,
      paidOn: a.cash_received_on,
      seller: {
        name: shop.sellerName.trim() || this.teamName,
        gstHstNumber: shop.gstHstNumber,
        gstHstRegistered: shop.gstHstRegistered,
      },
      sponsorName: sponsor?.name ?? '',
      season: a.season,
      promised: deliverables
        .filter((d) => d.agreement_id === a.id)
        .map((d) => ({ kind: d.kind, quantity: d.quantity, dueOn: d.due_on })),
      amountCents: a.cash_cents,
      taxes: taxes.map((t) => ({ label: t.label, amountCents: t.amountCents })),
      totalCents: a.cash_cents + taxCents,
    };
  }
}
