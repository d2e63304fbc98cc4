import type { Knex } from 'knex';
import type { DashboardSources } from '../books/dashboard-sources';
import type { Clock } from '../platform/clock';
import type { SettingsService } from '../settings/settings-service';
import type { CatalogueRepository } from './catalogue-repository';
import { SHOP_SETTINGS } from './shop-settings';
import { effectiveRunState } from './run-state';

/** The shop's numbers on the staff dashboard. */
export function shopDashboard(
  db: Knex,
  catalogue: CatalogueRepository,
  clock: Clock,
  settings: SettingsService,
  timeZone: string,
): Pick<
  DashboardSources,
  'ordersAwaitingShipment' | 'runsClosingWithin' | 'unitsBySize' | 'taxRegistrations' | 'salesByProvince'
> {
  return {
    /** Paid orders by the province they were delivered to (their place of supply), before refunds, net of tax. */
    async salesByProvince(range) {
      const rows = await db('shop_orders')
        .whereNotNull('paid_at')
        .whereNotNull('tax_jurisdiction')
        .where('paid_at', '>=', db.raw('(?::date)::timestamp AT TIME ZONE ?', [range.from, timeZone]))
        .andWhere('paid_at', '<', db.raw('((?::date + 1))::timestamp AT TIME ZONE ?', [range.to, timeZone]))
        .groupBy('tax_jurisdiction')
        .select(
          'tax_jurisdiction as province',
          db.raw('COUNT(*)::int AS orders'),
          db.raw('COALESCE(SUM(total_cents - tax_cents), 0)::bigint AS sales'),
        );
      return rows.map((r) => ({
        province: String(r.province),
        orders: r.orders as number,
        salesCents: r.sales as number,
      }));
    },
    async taxRegistrations() {
      const s = await settings.get(SHOP_SETTINGS);
      return {
        sellerProvince: s.sellerProvince,
        gstHstNumber: s.gstHstNumber,
        gstHstRegistered: s.gstHstRegistered,
        provincialRegistrations: s.provincialRegistrations,
      };
    },
    async ordersAwaitingShipment() {
      const [{ n }] = await db('shop_orders').whereIn('status', ['paid', 'packed']).count<{ n: number }[]>({ n: '*' });
      return n;
    },
    async runsClosingWithin(days) {
      const now = clock.now();
      const until = new Date(now.getTime() + days * 86_400_000);
      return (await catalogue.runs())
        .filter(
          (r) =>
            ['open', 'sold_out'].includes(
              effectiveRunState(
                { state: r.state, cap: r.cap, reserved: r.reserved, opensAt: r.opens_at, closesAt: r.closes_at },
                now,
              ),
            ) && r.closes_at <= until,
        )
        .map((r) => ({ id: r.id, name: r.name || r.product_name, closesAt: r.closes_at.toISOString() }));
    },
    async unitsBySize(runId) {
      const run = await catalogue.run(runId);
      if (!run) return [];
      const [bundle] = await catalogue.bundles({ id: run.product_id });
      const paid = await catalogue.paidUnits(runId);
      return (bundle?.variants ?? []).map((v) => ({ label: v.label, units: paid.get(v.id) ?? 0 }));
    },
  };
}
