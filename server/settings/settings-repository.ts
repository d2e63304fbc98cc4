import type { Knex } from 'knex';

/** The stored settings, one JSON value per key. */
export class SettingsRepository {
  constructor(private readonly db: Knex) {}

  /** The stored value for a key; undefined while nobody has saved it. */
  async value(key: string, db: Knex = this.db): Promise<unknown> {
    return (await db('settings').where('key', key).first('value'))?.value;
  }

  /** Stores the whole value for a key; the table's trigger then notifies every process to drop its copy. */
  async save(trx: Knex.Transaction, key: string, value: unknown): Promise<void> {
    await trx('settings')
      .insert({ key, value: JSON.stringify(value), updated_at: trx.fn.now() })
      .onConflict('key')
      .merge();
  }
}
