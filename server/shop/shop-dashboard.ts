import type { Knex } from 'knex';
import type { DashboardSources } from '../books/dashboard-sources';
import type { Clock } from '../platform/clock';
import type { SettingsService } from '../settings/settings-service';
import type { CatalogueRepository } from './catalogue-repository';
import { SHOP_SETTINGS } from './shop-settings';
import { effectiveRunState } from './run-state';

/** The shop's numbers on the staff dashboard. */
export function shopDashboard(db: Knex, catalogue: CatalogueRepository, clock: Clock, settings: SettingsService): Pick<DashboardSources, 'ordersAwaitingShipment' | 'runsClosingWithin' | 'unitsBySize' | 'taxRegistrations'> {
  return {
    async taxRegistrations() {
      const s = await settings.get(SHOP_SETTINGS);
      return { sellerProvince: s.sellerProvince, gstHstNumber: s.gstHstNumber, gstHstRegistered: s.gstHstRegistered, provincialRegistrations: s.provincialRegistrations };
    },
    async ordersAwaitingShipment() {
      const [{ n }] = await db('shop_orders').whereIn('status', ['paid', 'packed']).count<{ n: string }[]>({ n: '*' });
      return Number(n);
    },
    async runsClosingWithin(days) {
      const now = clock.now();
      const until = new Date(now.getTime() + days * 86_400_000);
      return (await catalogue.runs())
        .filter((r) => ['open', 'sold_out'].includes(effectiveRunState({ state: r.state, cap: r.cap, reserved: r.reserved, opensAt: r.opens_at, closesAt: r.closes_at }, now)) && r.closes_at <= until)
        .map((r) => ({ id: r.id, name: r.name || r.product_name, closesAt: r.closes_at.toISOString() }));
    },
    async unitsBySize(runId) {
      const run = await catalogue.run(runId);
      if (!run) return [];
      const [bundle] = await catalogue.bundles({ id: run.product_id });
      const paid = await catalogue.paidUnits(runId);
      return (bundle?.variants ?? []).map((v) => ({ label: v.label, units: paid.get(Number(v.id)) ?? 0 }));
    },
  };
}
