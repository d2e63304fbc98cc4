import type { Knex } from 'knex';
import type { DateRange } from '../../contracts/books/books-schemas';
import type { MovementSource } from '../../contracts/labels/money-movements';

/** Taxable amount and tax per tax and jurisdiction. */
export interface TaxTotalRow {
  code: string;
  jurisdiction: string;
  taxableCents: number;
  taxCents: number;
}

/** Tax refunded, positive, per month, source, tax and jurisdiction. */
export interface RefundTaxRow extends TaxTotalRow {
  month: string;
  source: MovementSource;
}

export interface RevenueRow {
  month: string;
  source: MovementSource;
  /** Money received, tax included. */
  grossCents: number;
  /** The tax inside `grossCents`. */
  taxCents: number;
  /** Money refunded, tax included. */
  refundsCents: number;
  feesCents: number;
}

/** The tax rows of one movement, summed (a correlated subquery on `m`). */
const MOVEMENT_TAX = '(SELECT COALESCE(SUM(x.tax_cents), 0) FROM money_movement_taxes x WHERE x.movement_id = m.id)';

export interface LedgerRow {
  id: number;
  /** The exact instant as PostgreSQL writes it (microseconds kept), for the next page's cursor. */
  occurredAt: string;
  date: string;
  kind: string;
  source: string;
  reference: string;
  counterparty: string;
  method: string;
  grossCents: number;
  feeCents: number;
  feeEstimated: boolean;
  taxes: Record<string, number>;
}

/** A row as PostgreSQL returns it: bigint columns and sums (cast back to bigint) arrive as numbers. */
type RawRow = Record<string, string | number | boolean | null | Record<string, number>>;

/** Aggregates over money_movements, all in SQL; instants are bucketed by day and month in the club's time zone. */
export class BooksRepository {
  constructor(
    private readonly db: Knex,
    private readonly timeZone: string,
  ) {}

  /** `occurred_at` within [from 00:00, to+1 00:00) in the club's zone. */
  private inRange(qb: Knex.QueryBuilder, range: DateRange, column = 'm.occurred_at'): Knex.QueryBuilder {
    return qb
      .where(column, '>=', this.db.raw('(?::date)::timestamp AT TIME ZONE ?', [range.from, this.timeZone]))
      .andWhere(column, '<', this.db.raw('((?::date + 1))::timestamp AT TIME ZONE ?', [range.to, this.timeZone]));
  }

  /** Tax collected on money coming in (sales, sponsorship invoiced with tax), per tax and jurisdiction. */
  async taxCollected(range: DateRange): Promise<TaxTotalRow[]> {
    const rows = await this.inRange(
      this.db('money_movement_taxes as t').join('money_movements as m', 'm.id', 't.movement_id'),
      range,
    )
      .whereNot('m.kind', 'refund')
      .groupBy('t.code', 't.jurisdiction')
      .orderBy(['t.code', 't.jurisdiction'])
      .select(
        't.code',
        't.jurisdiction',
        this.db.raw('COALESCE(SUM(t.taxable_cents), 0)::bigint AS taxable'),
        this.db.raw('COALESCE(SUM(t.tax_cents), 0)::bigint AS tax'),
      );
    return (rows as (RawRow & { taxable: number; tax: number })[]).map((r) => ({
      code: String(r.code),
      jurisdiction: String(r.jurisdiction),
      taxableCents: r.taxable,
      taxCents: r.tax,
    }));
  }

  /**
   * Tax given back by refunds in the period, per month, source, tax and jurisdiction, as positive amounts. Every
   * report reads refunded tax through this one function. Today it reads the refund movements' tax rows, which the
   * shop writes as a share of the order's taxes in proportion to the amount; when refunds carry their own tax lines
   * (a credit note per refunded line), only this query changes.
   */
  async refundedTax(range: DateRange): Promise<RefundTaxRow[]> {
    const month = this.db.raw("to_char(m.occurred_at AT TIME ZONE ?, 'YYYY-MM')", [this.timeZone]);
    const rows = await this.inRange(
      this.db('money_movement_taxes as t').join('money_movements as m', 'm.id', 't.movement_id'),
      range,
    )
      .where('m.kind', 'refund')
      .groupByRaw('1, 2, 3, 4')
      .orderByRaw('1, 2, 3, 4')
      .select(
        this.db.raw('? AS month', [month]),
        'm.source',
        't.code',
        't.jurisdiction',
        this.db.raw('COALESCE(-SUM(t.taxable_cents), 0)::bigint AS taxable'),
        this.db.raw('COALESCE(-SUM(t.tax_cents), 0)::bigint AS tax'),
      );
    return (rows as (RawRow & { taxable: number; tax: number })[]).map((r) => ({
      month: String(r.month),
      source: String(r.source) as MovementSource,
      code: String(r.code),
      jurisdiction: String(r.jurisdiction),
      taxableCents: r.taxable,
      taxCents: r.tax,
    }));
  }

  /** Money in and out per month and source; `taxCents` is the tax inside the money that came in. */
  async revenue(range: DateRange): Promise<RevenueRow[]> {
    const month = this.db.raw("to_char(m.occurred_at AT TIME ZONE ?, 'YYYY-MM')", [this.timeZone]);
    const rows = await this.inRange(this.db('money_movements as m'), range)
      .groupByRaw('1, 2')
      .orderByRaw('1, 2')
      .select(
        this.db.raw('? AS month', [month]),
        'm.source',
        this.db.raw('COALESCE(SUM(m.gross_cents) FILTER (WHERE m.gross_cents > 0), 0)::bigint AS gross'),
        this.db.raw(`COALESCE(SUM(${MOVEMENT_TAX}) FILTER (WHERE m.gross_cents > 0), 0)::bigint AS tax`),
        this.db.raw('COALESCE(-SUM(m.gross_cents) FILTER (WHERE m.gross_cents < 0), 0)::bigint AS refunds'),
        this.db.raw('COALESCE(SUM(m.fee_cents), 0)::bigint AS fees'),
      );
    return (rows as (RawRow & { gross: number; tax: number; refunds: number; fees: number })[]).map((r) => ({
      month: String(r.month),
      source: String(r.source) as MovementSource,
      grossCents: r.gross,
      taxCents: r.tax,
      refundsCents: r.refunds,
      feesCents: r.fees,
    }));
  }

  /**
   * Movements in date order (when they happened, then id), one page at a time after the last row of the page before,
   * so an export never holds every row in memory. The page is read straight off the `occurred_at` index from the
   * cursor on, and each row's taxes are a subquery: a join with GROUP BY made PostgreSQL aggregate and sort the whole
   * range for every page (quadratic in the range's size).
   */
  async ledgerPage(
    range: DateRange,
    after: { occurredAt: string; id: number } | null,
    limit: number,
  ): Promise<LedgerRow[]> {
    const q = this.inRange(this.db('money_movements as m'), range);
    // The plain bound lets the index start at the cursor; the row comparison then breaks ties within an instant.
    if (after)
      q.where('m.occurred_at', '>=', this.db.raw('?::timestamptz', [after.occurredAt])).whereRaw(
        '(m.occurred_at, m.id) > (?::timestamptz, ?)',
        [after.occurredAt, after.id],
      );
    const rows = await q
      .orderBy([{ column: 'm.occurred_at' }, { column: 'm.id' }])
      .limit(limit)
      .select(
        'm.id',
        this.db.raw('m.occurred_at::text AS occurred_key'),
        this.db.raw("to_char(m.occurred_at AT TIME ZONE ?, 'YYYY-MM-DD') AS date", [this.timeZone]),
        'm.kind',
        'm.source',
        'm.reference',
        'm.counterparty',
        'm.method',
        'm.gross_cents',
        'm.fee_cents',
        'm.fee_estimated',
        this.db.raw(
          "COALESCE((SELECT jsonb_object_agg(t.code, t.tax_cents) FROM money_movement_taxes t WHERE t.movement_id = m.id), '{}'::jsonb) AS taxes",
        ),
      );
    return (rows as (RawRow & { id: number; gross_cents: number; fee_cents: number })[]).map((r) => ({
      id: r.id,
      occurredAt: String(r.occurred_key),
      date: String(r.date),
      kind: String(r.kind),
      source: String(r.source),
      reference: String(r.reference),
      counterparty: String(r.counterparty),
      method: String(r.method),
      grossCents: r.gross_cents,
      feeCents: r.fee_cents,
      feeEstimated: r.fee_estimated === true,
      // jsonb: the bigint cents arrive as JSON numbers.
      taxes: r.taxes as Record<string, number>,
    }));
  }

  /** Card payments whose fee is still an estimate, oldest first, one page after the movement id `afterId`. */
  async chargesWithEstimatedFees(afterId: number, limit: number): Promise<{ id: number; chargeId: string }[]> {
    const rows = await this.db('money_movements')
      .where('fee_estimated', true)
      .where('id', '>', afterId)
      .whereNotNull('processor_charge_id')
      .whereIn('kind', ['order_payment', 'dues_payment'])
      .orderBy('id')
      .limit(limit)
      .select('id', 'processor_charge_id');
    return rows.map((r) => ({ id: Number(r.id), chargeId: r.processor_charge_id as string }));
  }

  /** Replaces the estimated fee of the movement for a charge with the processor's actual fee. */
  async setActualFee(trx: Knex.Transaction, chargeId: string, feeCents: number): Promise<number> {
    return trx('money_movements')
      .where({ processor_charge_id: chargeId, fee_estimated: true })
      .whereIn('kind', ['order_payment', 'dues_payment'])
      .update({ fee_cents: feeCents, fee_estimated: false });
  }

  /** The dashboard's sums, each net of the tax inside it: sales today and this month, dues this month. */
  async sumsForToday(
    today: string,
    monthStart: string,
  ): Promise<{ salesToday: number; salesMonth: number; duesMonth: number }> {
    const net = `m.gross_cents - ${MOVEMENT_TAX}`;
    const [row] = await this.inRange(this.db('money_movements as m'), { from: monthStart, to: today }).select(
      this.db.raw(
        `COALESCE(SUM(${net}) FILTER (WHERE m.source = 'merch' AND m.kind = 'order_payment' AND (m.occurred_at AT TIME ZONE ?)::date = ?::date), 0)::bigint AS sales_today`,
        [this.timeZone, today],
      ),
      this.db.raw(
        `COALESCE(SUM(${net}) FILTER (WHERE m.source = 'merch' AND m.kind = 'order_payment'), 0)::bigint AS sales_month`,
      ),
      this.db.raw(
        `COALESCE(SUM(${net}) FILTER (WHERE m.source = 'dues' AND m.gross_cents > 0), 0)::bigint AS dues_month`,
      ),
    );
    return {
      salesToday: row.sales_today,
      salesMonth: row.sales_month,
      duesMonth: row.dues_month,
    };
  }
}
