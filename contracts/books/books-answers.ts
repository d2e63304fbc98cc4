/** What the treasurer's report and dashboard routes answer: the server types its reports with these; the console reads them. */
import type { MovementSource } from '../labels/money-movements';

/** One line of the tax report: a tax in one jurisdiction. */
export interface TaxReportLine {
  code: string;
  jurisdiction: string;
  /** Taxable sales net of refunds. */
  taxableCents: number;
  /** Tax collected on sales and other taxed income. */
  taxCents: number;
  /** Tax given back by refunds. */
  refundedCents: number;
  /** Net tax collected: collected minus refunded (input tax credits are not in Padside). */
  netCents: number;
}

/** The lines one tax authority receives a return for, with their totals. */
export interface TaxAuthority {
  /** 'CA' for the federal agency, else the province's code. */
  authority: string;
  name: string;
  lines: TaxReportLine[];
  totals: Omit<TaxReportLine, 'code' | 'jurisdiction'>;
}

/** The seller's tax registrations, shown at the top of the tax report. */
export interface TaxRegistrations {
  sellerProvince: string;
  gstHstNumber: string;
  gstHstRegistered: boolean;
  provincialRegistrations: string[];
}

/** Sales into a province whose own sales tax the seller does not collect, with the registration rule Padside states. */
export interface UnregisteredProvince {
  province: string;
  orders: number;
  salesCents: number;
  tax: string;
  threshold: string;
}

/** GET /api/admin/reports/tax. */
export interface TaxReport {
  from: string;
  to: string;
  timeZone: string;
  /** Null when no feature sells taxed goods. */
  registrations: TaxRegistrations | null;
  authorities: TaxAuthority[];
  lines: TaxReportLine[];
  unregisteredProvinces: UnregisteredProvince[];
}

/** The income report's columns. Tax collected is owed to the tax authorities, so it is not income. */
export interface IncomeFigures {
  /** Money received, tax included. */
  grossCents: number;
  /** The tax inside `grossCents`. */
  taxCents: number;
  /** Gross received minus the tax inside it. */
  incomeCents: number;
  /** Money refunded, tax included. */
  refundsCents: number;
  /** The tax inside the refunds (given back to the buyer, no longer owed). */
  refundedTaxCents: number;
  /** Refunds minus their tax: the income given back. */
  refundsNetCents: number;
  feesCents: number;
  /** Income net of tax, minus refunds net of tax, minus processor fees. */
  netCents: number;
}

/** One month and source of the income report. */
export interface RevenueRow extends IncomeFigures {
  month: string;
  source: MovementSource;
}

/** GET /api/admin/reports/revenue. */
export interface RevenueReport {
  from: string;
  to: string;
  timeZone: string;
  rows: RevenueRow[];
  totals: IncomeFigures;
}

/** GET /api/admin/reports/sponsor-value: each sponsor's cash and in-kind value this season. */
export interface SponsorValue {
  season: string;
  items: {
    sponsor: string;
    tier: string | null;
    cashCents: number;
    inKindCents: number;
    totalCents: number;
    promised: number;
    delivered: number;
  }[];
}

/** A print run closing within the week. */
export interface RunClosingSoon {
  id: number;
  name: string;
  closesAt: string;
}

/** A sponsor promise past its day, for the dashboard. */
export interface OverdueDeliverableNote {
  sponsor: string;
  kind: string;
  dueOn: string;
  missing: number;
}

/** The club's flying season (calendar year): launches by state, check-ins, flight cards, flown, best apogee. */
export interface LaunchSeason {
  season: string;
  scheduled: number;
  calledOff: number;
  done: number;
  checkIns: number;
  flights: number;
  flown: number;
  bestApogeeMetres: number | null;
}

/** GET /api/admin/dashboard; a number is null when the feature behind it is not installed. */
export interface Dashboard {
  today: string;
  salesTodayCents: number;
  salesMonthCents: number;
  duesMonthCents: number;
  ordersAwaitingShipment: number | null;
  runsClosingSoon: RunClosingSoon[] | null;
  overdueDeliverables: OverdueDeliverableNote[] | null;
  membersLapsingSoon: number | null;
  membersByStatus: Record<string, number> | null;
  launchSeason: LaunchSeason | null;
  /** Net of tax: the tax collected is owed to the authorities, not income. */
  revenueByMonth: Pick<RevenueRow, 'month' | 'source' | 'netCents' | 'grossCents' | 'incomeCents'>[];
}
