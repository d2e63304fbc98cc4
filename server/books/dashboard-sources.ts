import type {
  LaunchSeason,
  OverdueDeliverableNote,
  RunClosingSoon,
  SponsorValue,
  TaxRegistrations,
} from '../../contracts/books/books-answers';
import type { DateRange } from '../../contracts/books/books-schemas';
import type { ProvinceSales } from './tax-report';

/**
 * Numbers the dashboard shows that belong to other features; each feature's service provides its own, so the
 * books never read another feature's tables.
 */
export interface DashboardSources {
  ordersAwaitingShipment(): Promise<number>;
  runsClosingWithin(days: number): Promise<RunClosingSoon[]>;
  unitsBySize(runId: number): Promise<{ label: string; units: number }[]>;
  overdueDeliverables(): Promise<OverdueDeliverableNote[]>;
  membersLapsingWithin(days: number): Promise<number>;
  membersByStatus(): Promise<Record<string, number>>;
  /** The seller's tax registrations, shown at the top of the tax report. */
  taxRegistrations(): Promise<TaxRegistrations>;
  /** Paid orders delivered into each province in the period (club days), with their sales net of tax. */
  salesByProvince(range: DateRange): Promise<ProvinceSales[]>;
  launchSeason(): Promise<LaunchSeason>;
  sponsorValue(): Promise<SponsorValue>;
}
