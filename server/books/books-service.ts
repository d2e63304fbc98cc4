import type { Knex } from 'knex';
import type { PaymentGateway } from '../payments/payment-gateway';
import type { ClubCalendar } from '../platform/club-calendar';
import { labelOf, yesNo } from '../../contracts/labels/label-of';
import { MOVEMENT_KIND_LABELS, MOVEMENT_SOURCE_LABELS } from '../../contracts/labels/money-movements';
import { PAYMENT_METHOD_LABELS } from '../../contracts/labels/payment-methods';
import { centsToDecimal, csvLines, toCsv, zonedHeader } from '../platform/csv';
import type { SettingsService } from '../settings/settings-service';
import { BooksRepository } from './books-repository';
import type { DashboardSources } from './dashboard-sources';
import type { DateRange } from '../../contracts/books/books-schemas';
import type { Dashboard, RevenueReport, SponsorValue, TaxReport } from '../../contracts/books/books-answers';
import { checkRange } from './date-range';
import { incomeRows, incomeTotals } from './income';
import { PROCESSOR_FEES, type ProcessorFeeSettings } from './processor-fees';
import { byAuthority, reportLines, unregisteredProvinceNotes } from './tax-report';

const TAX_CODES = ['GST', 'HST', 'PST', 'QST', 'RST'] as const;
const LEDGER_PAGE = 1000;

/** The treasurer's reports. Every number is an SQL aggregate over money_movements. */
export class BooksService {
  readonly repo: BooksRepository;

  constructor(
    private readonly db: Knex,
    repo: BooksRepository,
    private readonly settings: SettingsService,
    private readonly calendar: ClubCalendar,
    private readonly sources: () => Partial<DashboardSources>,
  ) {
    this.repo = repo;
  }

  /**
   * Tax per authority, per tax and jurisdiction: taxable sales net of refunds, collected, refunded, net collected.
   * Input tax credits (tax the team paid) are not in Padside; the page says so.
   */
  async taxReport(range: DateRange): Promise<TaxReport> {
    checkRange(range);
    const src = this.sources();
    const [collected, refunded, registrations, sales] = await Promise.all([
      this.repo.taxCollected(range),
      this.repo.refundedTax(range),
      src.taxRegistrations?.() ?? null,
      src.salesByProvince?.(range) ?? null,
    ]);
    const lines = reportLines(collected, refunded);
    return {
      from: range.from,
      to: range.to,
      timeZone: this.calendar.timeZone,
      registrations,
      authorities: byAuthority(lines),
      lines,
      unregisteredProvinces:
        registrations && sales ? unregisteredProvinceNotes(sales, registrations.provincialRegistrations) : [],
    };
  }

  /** The tax report as CSV for the accountant, amounts in dollars with two decimals. */
  async taxCsv(range: DateRange): Promise<string> {
    const { authorities } = await this.taxReport(range);
    return toCsv(
      [
        'Tax authority',
        'Tax',
        'Jurisdiction',
        'Taxable sales net of refunds (CAD)',
        'Tax collected (CAD)',
        'Tax refunded (CAD)',
        'Net tax collected (CAD)',
      ],
      authorities.flatMap((a) =>
        a.lines.map((l) => [
          a.name,
          l.code,
          l.jurisdiction,
          centsToDecimal(l.taxableCents),
          centsToDecimal(l.taxCents),
          centsToDecimal(l.refundedCents),
          centsToDecimal(l.netCents),
        ]),
      ),
    );
  }

  /** Gross received, tax collected, income net of tax, refunds, fees and net, by month and source, with totals. */
  async revenue(range: DateRange): Promise<RevenueReport> {
    checkRange(range);
    const [sums, refunded] = await Promise.all([this.repo.revenue(range), this.repo.refundedTax(range)]);
    const rows = incomeRows(sums, refunded);
    return { from: range.from, to: range.to, timeZone: this.calendar.timeZone, rows, totals: incomeTotals(rows) };
  }

  /** The ledger as CSV chunks, a page of movements at a time, in the order they happened. */
  async *ledgerCsv(range: DateRange): AsyncGenerator<string> {
    checkRange(range);
    yield toCsv(
      [
        zonedHeader('Date', this.calendar.timeZone),
        'Kind',
        'Source',
        'Reference',
        'Counterparty',
        'Method',
        'Gross (CAD)',
        ...TAX_CODES.map((c) => `${c} (CAD)`),
        'Fee (CAD)',
        'Fee estimated',
        'Net (CAD)',
      ],
      [],
    );
    for (let after: { occurredAt: string; id: number } | null = null; ;) {
      const page = await this.repo.ledgerPage(range, after, LEDGER_PAGE);
      if (!page.length) return;
      const rows = page.map((m) => [
        m.date,
        labelOf(MOVEMENT_KIND_LABELS, m.kind),
        labelOf(MOVEMENT_SOURCE_LABELS, m.source),
        m.reference,
        m.counterparty,
        labelOf(PAYMENT_METHOD_LABELS, m.method),
        centsToDecimal(m.grossCents),
        ...TAX_CODES.map((c) => (m.taxes[c] === undefined ? '' : centsToDecimal(m.taxes[c]))),
        centsToDecimal(m.feeCents),
        yesNo(m.feeEstimated),
        centsToDecimal(m.grossCents - m.feeCents),
      ]);
      yield csvLines(rows);
      after = page[page.length - 1];
    }
  }

  /** Replaces estimated fees with the processor's actual ones where it reports them; returns how many changed. */
  async syncActualFees(payments: Pick<PaymentGateway, 'actualFeeCents'>, batch = 200): Promise<number> {
    let updated = 0;
    // Pages by movement id through every estimate: charges the processor has no fee for yet stay estimated, and
    // must not hold back the ones after them.
    let page = await this.repo.chargesWithEstimatedFees(0, batch);
    while (page.length > 0) {
      for (const { chargeId } of page) {
        const fee = await payments.actualFeeCents(chargeId);
        // The processor is asked outside any transaction; only the write opens one.
        if (fee !== null) updated += await this.db.transaction((trx) => this.repo.setActualFee(trx, chargeId, fee));
      }
      page = await this.repo.chargesWithEstimatedFees(page[page.length - 1].id, batch);
    }
    return updated;
  }

  /** The card-fee estimate rates, used for a charge until the processor reports its real fee. */
  feeSettings(): Promise<ProcessorFeeSettings> {
    return this.settings.get(PROCESSOR_FEES);
  }

  /** Validates and saves the card-fee estimate rates. */
  saveFeeSettings(value: ProcessorFeeSettings): Promise<ProcessorFeeSettings> {
    return this.settings.put(PROCESSOR_FEES, value);
  }

  /** The cards' numbers, sales and dues net of tax; a number whose feature is not installed is null. */
  async dashboard(): Promise<Dashboard> {
    const today = this.calendar.today();
    const monthStart = today.slice(0, 8) + '01';
    const src = this.sources();
    const sums = await this.repo.sumsForToday(today, monthStart);
    const yearStart = `${Number(today.slice(0, 4)) - 1}${today.slice(4, 8)}01`;
    const [
      ordersAwaitingShipment,
      runsClosingSoon,
      overdueDeliverables,
      membersLapsingSoon,
      membersByStatus,
      monthly,
      refunded,
      launchSeason,
    ] = await Promise.all([
      src.ordersAwaitingShipment?.() ?? null,
      src.runsClosingWithin?.(7) ?? null,
      src.overdueDeliverables?.() ?? null,
      src.membersLapsingWithin?.(30) ?? null,
      src.membersByStatus?.() ?? null,
      this.repo.revenue({ from: yearStart, to: today }),
      this.repo.refundedTax({ from: yearStart, to: today }),
      src.launchSeason?.() ?? null,
    ]);
    return {
      today,
      salesTodayCents: sums.salesToday,
      salesMonthCents: sums.salesMonth,
      duesMonthCents: sums.duesMonth,
      ordersAwaitingShipment,
      runsClosingSoon,
      overdueDeliverables,
      membersLapsingSoon,
      membersByStatus,
      launchSeason,
      // Net of tax: the tax collected is owed to the authorities, not income.
      revenueByMonth: incomeRows(monthly, refunded).map((r) => ({
        month: r.month,
        source: r.source,
        netCents: r.netCents,
        grossCents: r.grossCents,
        incomeCents: r.incomeCents,
      })),
    };
  }

  /** Each sponsor's cash and in-kind value this season, or an empty list when the sponsors feature is not installed. */
  sponsorValue(): Promise<SponsorValue> {
    return this.sources().sponsorValue?.() ?? Promise.resolve({ season: '', items: [] });
  }

  /** Units sold per size for a run, or none when the shop feature is not installed. */
  unitsBySize(runId: number) {
    return this.sources().unitsBySize?.(runId) ?? Promise.resolve([]);
  }
}
