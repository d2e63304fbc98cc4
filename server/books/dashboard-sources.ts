/**
 * Numbers the dashboard shows that belong to other features; each feature's service provides its own, so the
 * books never read another feature's tables.
 */
export interface DashboardSources {
  ordersAwaitingShipment(): Promise<number>;
  runsClosingWithin(days: number): Promise<{ id: number; name: string; closesAt: string }[]>;
  unitsBySize(runId: number): Promise<{ label: string; units: number }[]>;
  overdueDeliverables(): Promise<{ sponsor: string; kind: string; dueOn: string; missing: number }[]>;
  membersLapsingWithin(days: number): Promise<number>;
  membersByStatus(): Promise<Record<string, number>>;
  /** The seller's tax registrations, shown at the top of the tax report. */
  taxRegistrations(): Promise<{ sellerProvince: string; gstHstNumber: string; gstHstRegistered: boolean; provincialRegistrations: string[] }>;
  /** Paid orders delivered into each province in the period (club days), with their sales net of tax. */
  salesByProvince(range: { from: string; to: string }): Promise<{ province: string; orders: number; salesCents: number }[]>;
  /** The club's flying season (calendar year): launches by state, check-ins, flight cards, flown, best apogee. */
  launchSeason(): Promise<{ season: string; scheduled: number; calledOff: number; done: number; checkIns: number; flights: number; flown: number; bestApogeeMetres: number | null }>;
  sponsorValue(): Promise<{ season: string; items: { sponsor: string; tier: string | null; cashCents: number; inKindCents: number; totalCents: number; promised: number; delivered: number }[] }>;
}
