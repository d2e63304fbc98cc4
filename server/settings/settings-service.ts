import type { Knex } from 'knex';
import { z } from 'zod';
import type { DatabaseNotifications } from '../platform/database-notifications';
import { ALWAYS, NotifiedCache } from '../platform/notified-cache';
import { SettingsRepository } from './settings-repository';

/**
 * Typed settings kept as JSON rows. Each feature declares its key, schema and default beside its own code,
 * e.g. `const SHOP = defineSetting('shop', ShopSettingsSchema, {...})`.
 */
export interface SettingDefinition<T> {
  key: string;
  schema: z.ZodType<T>;
  defaults: T;
}

/** Declares a feature's setting: its key, the schema its stored value must match, and the defaults. */
export function defineSetting<T>(key: string, schema: z.ZodType<T>, defaults: T): SettingDefinition<T> {
  return { key, schema, defaults };
}

/** Reads and writes the typed settings of every feature, with a per-process cache kept fresh by database notifications. */
export class SettingsService {
  /** Parsed settings by key, dropped by any commit to the table (the `settings` trigger); a checkout reads four. */
  private readonly cache: NotifiedCache<unknown> | null;
  private readonly repo: SettingsRepository;

  constructor(
    private readonly db: Knex,
    notifications?: DatabaseNotifications,
  ) {
    this.cache = notifications ? new NotifiedCache(notifications, 'settings') : null;
    this.repo = new SettingsRepository(db);
  }

  /**
   * The stored value merged over the defaults, so a new field has a value before anyone saves it. Inside a
   * transaction it is read there; otherwise from this process's copy, as fresh as a read (see NotifiedCache).
   */
  async get<T>(def: SettingDefinition<T>, trx?: Knex.Transaction): Promise<T> {
    if (trx || !this.cache) return this.read(def, trx ?? this.db);
    const value = await this.cache.get(def.key, new Date(), async () => ({
      value: await this.read(def, this.db),
      ...ALWAYS,
    }));
    // A copy, so a caller that changes what it got cannot change what the next caller gets.
    return structuredClone(value as T);
  }

  private async read<T>(def: SettingDefinition<T>, db: Knex): Promise<T> {
    const stored = await this.repo.value(def.key, db);
    if (stored === undefined) return def.defaults;
    const merged =
      typeof def.defaults === 'object' && def.defaults !== null ? { ...def.defaults, ...(stored as object) } : stored;
    return def.schema.parse(merged);
  }

  /**
   * Validates a value against its schema and stores it as the whole setting, in `trx` or a transaction of its own;
   * the trigger then drops every process's cached copy.
   */
  async put<T>(def: SettingDefinition<T>, value: T, trx?: Knex.Transaction): Promise<T> {
    const parsed = def.schema.parse(value);
    if (trx) await this.repo.save(trx, def.key, parsed);
    else await this.db.transaction((t) => this.repo.save(t, def.key, parsed));
    return parsed;
  }
}
