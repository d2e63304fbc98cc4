/** The tax report's arithmetic: pure, over rows the repository already summed. */
import type { TaxAuthority, TaxReportLine, UnregisteredProvince } from '../../contracts/books/books-answers';

/** Tax collected or refunded per tax and jurisdiction (positive amounts). */
export interface TaxAmounts {
  code: string;
  jurisdiction: string;
  taxableCents: number;
  taxCents: number;
}

const FEDERAL_CODES = ['GST', 'HST'];
/** Who administers each province's own sales tax (from memory; the province's site has the last word). */
const PROVINCIAL_AUTHORITIES: Record<string, string> = {
  BC: 'B.C. Ministry of Finance',
  MB: 'Manitoba Finance',
  SK: 'Saskatchewan Ministry of Finance',
  QC: 'Revenu Québec',
};
const FEDERAL_NAME = 'Canada Revenue Agency';

/** GST and HST go to the federal agency whatever the place of supply; RST, PST and QST to their province. */
export function authorityOf(code: string, jurisdiction: string): { authority: string; name: string } {
  if (FEDERAL_CODES.includes(code)) return { authority: 'CA', name: FEDERAL_NAME };
  return { authority: jurisdiction, name: PROVINCIAL_AUTHORITIES[jurisdiction] ?? `Province ${jurisdiction}` };
}

const key = (a: { code: string; jurisdiction: string }) => `${a.code}|${a.jurisdiction}`;

/** Joins what was collected with what was refunded, one line per tax and jurisdiction, in code order. */
export function reportLines(collected: TaxAmounts[], refunded: TaxAmounts[]): TaxReportLine[] {
  const lines = new Map<string, TaxReportLine>();
  const line = (a: TaxAmounts) => {
    const k = key(a);
    if (!lines.has(k))
      lines.set(k, {
        code: a.code,
        jurisdiction: a.jurisdiction,
        taxableCents: 0,
        taxCents: 0,
        refundedCents: 0,
        netCents: 0,
      });
    return lines.get(k)!;
  };
  for (const c of collected) {
    const l = line(c);
    l.taxableCents += c.taxableCents;
    l.taxCents += c.taxCents;
  }
  for (const r of refunded) {
    const l = line(r);
    l.taxableCents -= r.taxableCents;
    l.refundedCents += r.taxCents;
  }
  for (const l of lines.values()) l.netCents = l.taxCents - l.refundedCents;
  return [...lines.values()].sort((a, b) => key(a).localeCompare(key(b)));
}

/** The federal agency first, then each province in code order, each with its totals. */
export function byAuthority(lines: TaxReportLine[]): TaxAuthority[] {
  const blocks = new Map<string, TaxAuthority>();
  for (const l of lines) {
    const a = authorityOf(l.code, l.jurisdiction);
    if (!blocks.has(a.authority))
      blocks.set(a.authority, {
        ...a,
        lines: [],
        totals: { taxableCents: 0, taxCents: 0, refundedCents: 0, netCents: 0 },
      });
    const b = blocks.get(a.authority)!;
    b.lines.push(l);
    b.totals.taxableCents += l.taxableCents;
    b.totals.taxCents += l.taxCents;
    b.totals.refundedCents += l.refundedCents;
    b.totals.netCents += l.netCents;
  }
  return [...blocks.values()].sort((a, b) =>
    a.authority === 'CA' ? -1 : b.authority === 'CA' ? 1 : a.authority.localeCompare(b.authority),
  );
}

/** Provinces with their own sales tax, and the seller-registration thresholds Padside states (from memory). */
export const PROVINCIAL_SALES_TAX: Record<string, { tax: string; threshold: string }> = {
  BC: {
    tax: 'PST',
    threshold: 'from memory: sellers outside B.C. register once their sales into B.C. pass C$10,000 a year',
  },
  MB: {
    tax: 'RST',
    threshold: 'from memory: sellers outside Manitoba register once their sales into Manitoba pass C$10,000 a year',
  },
  SK: {
    tax: 'PST',
    threshold: 'from memory: sellers delivering into Saskatchewan generally register; small-seller rules differ',
  },
  QC: {
    tax: 'QST',
    threshold: 'from memory: sellers outside Quebec register once their sales to Quebec consumers pass C$30,000 a year',
  },
};

/** Sales into one province in the period, net of tax. */
export interface ProvinceSales {
  province: string;
  orders: number;
  salesCents: number;
}

/** A note for each province with its own sales tax that the seller does not collect, where sales went in the period. */
export function unregisteredProvinceNotes(sales: ProvinceSales[], registrations: string[]): UnregisteredProvince[] {
  return sales
    .filter((s) => PROVINCIAL_SALES_TAX[s.province] && !registrations.includes(s.province) && s.orders > 0)
    .sort((a, b) => a.province.localeCompare(b.province))
    .map((s) => ({
      ...s,
      tax: PROVINCIAL_SALES_TAX[s.province].tax,
      threshold: PROVINCIAL_SALES_TAX[s.province].threshold,
    }));
}
