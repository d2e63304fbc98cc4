import type { Knex } from 'knex';
import type { WeightBracket } from '../../contracts/shop/shipping-price';
import type { TaxRate } from './tax';

// DATE columns as text, so no time zone shifts the day.
const DAY = "to_char(effective_from, 'YYYY-MM-DD') as effective_from";

export type ShippingCode = 'pickup' | 'canada' | 'usa' | 'international';

export interface ShippingMethodRow {
  id: number;
  code: ShippingCode;
  name: string;
  brackets: WeightBracket[];
  active: boolean;
  position: number;
}

/** Shipping methods and the tax-rate table as plain rows. */
export class ShopConfigRepository {
  constructor(private readonly db: Knex) {}

  async shippingMethods(activeOnly: boolean): Promise<ShippingMethodRow[]> {
    const q = this.db<ShippingMethodRow>('shop_shipping_methods').orderBy('position');
    if (activeOnly) q.where('active', true);
    return (await q).map((m) => ({ ...m, id: Number(m.id) }));
  }

  async shippingMethod(id: number): Promise<ShippingMethodRow | null> {
    const m = await this.db<ShippingMethodRow>('shop_shipping_methods').where('id', id).first();
    return m ? { ...m, id: Number(m.id) } : null;
  }

  async updateShippingMethod(id: number, patch: { name: string; brackets: WeightBracket[]; active: boolean }): Promise<boolean> {
    return (await this.db('shop_shipping_methods').where('id', id).update({ ...patch, brackets: JSON.stringify(patch.brackets) })) > 0;
  }

  async taxRates(): Promise<TaxRate[]> {
    const rows = await this.db('shop_tax_rates').select('jurisdiction', 'code', 'rate_percent', this.db.raw(DAY));
    return rows.map((r) => ({ jurisdiction: r.jurisdiction, code: r.code, ratePercent: String(r.rate_percent), effectiveFrom: r.effective_from }));
  }

  async taxRateTable(): Promise<{ jurisdiction: string; code: string; ratePercent: string; effectiveFrom: string; source: string }[]> {
    const rows = await this.db('shop_tax_rates').select('jurisdiction', 'code', 'rate_percent', 'source', this.db.raw(DAY)).orderBy(['jurisdiction', 'code', 'effective_from']);
    return rows.map((r) => ({ jurisdiction: r.jurisdiction, code: r.code, ratePercent: String(r.rate_percent), effectiveFrom: r.effective_from, source: r.source }));
  }
}

