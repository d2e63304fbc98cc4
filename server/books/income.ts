/** Income net of tax: pure arithmetic over the repository's monthly sums. */
import type { IncomeFigures, RevenueRow } from '../../contracts/books/books-answers';

/** A month and source as the repository sums it; `taxCents` is the tax inside the money received. */
export type MonthSums = Pick<RevenueRow, 'month' | 'source' | 'grossCents' | 'taxCents' | 'refundsCents' | 'feesCents'>;
/** One row of the income report. */
export type IncomeRow = RevenueRow;
export type IncomeTotals = IncomeFigures;

/** Adds income, refunds and net, all net of tax, to each month and source. */
export function incomeRows(
  sums: MonthSums[],
  refundedTax: { month: string; source: string; taxCents: number }[],
): IncomeRow[] {
  return sums.map((s) => {
    const refundedTaxCents = refundedTax
      .filter((r) => r.month === s.month && r.source === s.source)
      .reduce((n, r) => n + r.taxCents, 0);
    const incomeCents = s.grossCents - s.taxCents;
    const refundsNetCents = s.refundsCents - refundedTaxCents;
    return {
      ...s,
      incomeCents,
      refundedTaxCents,
      refundsNetCents,
      netCents: incomeCents - refundsNetCents - s.feesCents,
    };
  });
}

/** The period's totals of every column. */
export function incomeTotals(rows: IncomeRow[]): IncomeTotals {
  const t: IncomeTotals = {
    grossCents: 0,
    taxCents: 0,
    incomeCents: 0,
    refundsCents: 0,
    refundedTaxCents: 0,
    refundsNetCents: 0,
    feesCents: 0,
    netCents: 0,
  };
  for (const r of rows) for (const k of Object.keys(t) as (keyof IncomeTotals)[]) t[k] += r[k];
  return t;
}
