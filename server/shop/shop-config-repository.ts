import type { Knex } from 'knex';
import type { WeightBracket } from '../../contracts/shop/shipping-price';
import type { StaffShippingMethod } from '../../contracts/shop/staff-shop-answers';
import type { TaxRate } from './tax';

// DATE columns as text, so no time zone shifts the day.
const DAY = "to_char(effective_from, 'YYYY-MM-DD') as effective_from";

/** A row of shop_shipping_methods, which the staff settings answer as it is. */
export type ShippingMethodRow = StaffShippingMethod;

/** Shipping methods and the tax-rate table as plain rows. */
export class ShopConfigRepository {
  constructor(private readonly db: Knex) {}

  /** Every shipping method, switched-off ones too, for the shop settings. */
  async allShippingMethods(): Promise<ShippingMethodRow[]> {
    return this.db<ShippingMethodRow>('shop_shipping_methods').orderBy('position');
  }

  /** The shipping methods a buyer can choose at checkout. */
  async activeShippingMethods(): Promise<ShippingMethodRow[]> {
    return this.db<ShippingMethodRow>('shop_shipping_methods').where('active', true).orderBy('position');
  }

  /** One shipping method by id, switched off or not. */
  async shippingMethod(id: number): Promise<ShippingMethodRow | null> {
    const m = await this.db<ShippingMethodRow>('shop_shipping_methods').where('id', id).first();
    return m ?? null;
  }

  /** Saves a shipping method's name, weight brackets and switch; false when there is no such method. */
  async updateShippingMethod(
    trx: Knex.Transaction,
    id: number,
    patch: { name: string; brackets: WeightBracket[]; active: boolean },
  ): Promise<boolean> {
    return (
      (await trx('shop_shipping_methods')
        .where('id', id)
        .update({ ...patch, brackets: JSON.stringify(patch.brackets) })) > 0
    );
  }

  /** Every tax rate with the day it takes effect, for pricing an order on its day. */
  async taxRates(): Promise<TaxRate[]> {
    const rows = await this.db('shop_tax_rates').select('jurisdiction', 'code', 'rate_percent', this.db.raw(DAY));
    return rows.map((r) => ({
      jurisdiction: r.jurisdiction,
      code: r.code,
      ratePercent: String(r.rate_percent),
      effectiveFrom: r.effective_from,
    }));
  }

  /** The tax-rate table with each rate's source, in the order staff read it. */
  async taxRateTable(): Promise<
    { jurisdiction: string; code: string; ratePercent: string; effectiveFrom: string; source: string }[]
  > {
    const rows = await this.db('shop_tax_rates')
      .select('jurisdiction', 'code', 'rate_percent', 'source', this.db.raw(DAY))
      .orderBy(['jurisdiction', 'code', 'effective_from']);
    return rows.map((r) => ({
      jurisdiction: r.jurisdiction,
      code: r.code,
      ratePercent: String(r.rate_percent),
      effectiveFrom: r.effective_from,
      source: r.source,
    }));
  }
}
