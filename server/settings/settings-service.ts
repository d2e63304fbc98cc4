import type { Knex } from 'knex';
import { z } from 'zod';

/**
 * Typed settings kept as JSON rows. Each feature declares its key, schema and default beside its own code,
 * e.g. `const SHOP = defineSetting('shop', ShopSettingsSchema, {...})`.
 */
export interface SettingDefinition<T> {
  key: string;
  schema: z.ZodType<T>;
  defaults: T;
}

export function defineSetting<T>(key: string, schema: z.ZodType<T>, defaults: T): SettingDefinition<T> {
  return { key, schema, defaults };
}

export class SettingsService {
  constructor(private readonly db: Knex) {}

  /** The stored value merged over the defaults, so a new field has a value before anyone saves it. */
  async get<T>(def: SettingDefinition<T>, trx: Knex | Knex.Transaction = this.db): Promise<T> {
    const row = await trx('settings').where('key', def.key).first();
    if (!row) return def.defaults;
    const merged = typeof def.defaults === 'object' && def.defaults !== null ? { ...def.defaults, ...row.value } : row.value;
    return def.schema.parse(merged);
  }

  async put<T>(def: SettingDefinition<T>, value: T, trx: Knex | Knex.Transaction = this.db): Promise<T> {
    const parsed = def.schema.parse(value);
    await trx('settings')
      .insert({ key: def.key, value: JSON.stringify(parsed), updated_at: trx.fn.now() })
      .onConflict('key')
      .merge();
    return parsed;
  }
}
