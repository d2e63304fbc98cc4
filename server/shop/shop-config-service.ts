import type { Knex } from 'knex';
import type { ShippingMethod } from '../../contracts/shop/shop-answers';
import type { WeightBracket } from '../../contracts/shop/shipping-price';
import { notFound } from '../platform/app-error';
import type { ShippingMethodRow, ShopConfigRepository } from './shop-config-repository';

/** Shipping methods and the tax-rate table: what buyers may choose, and what staff read and change. */
export class ShopConfigService {
  constructor(
    private readonly db: Knex,
    private readonly config: ShopConfigRepository,
  ) {}

  /** The shipping methods a buyer can choose at checkout, as the storefront shows them (no switch, no position). */
  async activeShippingMethods(): Promise<ShippingMethod[]> {
    return (await this.config.activeShippingMethods()).map((m) => ({
      id: m.id,
      code: m.code,
      name: m.name,
      brackets: m.brackets,
    }));
  }

  /** Every shipping method, switched-off ones too, so staff can edit them all from the shop settings. */
  allShippingMethods(): Promise<ShippingMethodRow[]> {
    return this.config.allShippingMethods();
  }

  /** Saves a shipping method's name, brackets and switch and answers it as it now stands; 404 when there is none. */
  async saveShippingMethod(
    id: number,
    patch: { name: string; brackets: WeightBracket[]; active: boolean },
  ): Promise<ShippingMethodRow | null> {
    if (!(await this.db.transaction((trx) => this.config.updateShippingMethod(trx, id, patch))))
      throw notFound('No such shipping method.');
    return this.config.shippingMethod(id);
  }

  /** The tax-rate table with each rate's source, so staff can check the rates the shop charges. */
  taxRateTable(): ReturnType<ShopConfigRepository['taxRateTable']> {
    return this.config.taxRateTable();
  }
}
