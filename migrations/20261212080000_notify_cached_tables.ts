import type { Knex } from 'knex';

/** Each channel with the tables whose committed changes it reports. */
const CHANNELS: Record<string, string[]> = {
  // The storefront's catalogue answers.
  shop_catalogue: ['shop_products', 'shop_variants', 'shop_runs', 'shop_run_variant_caps'],
  // Every feature's settings.
  settings: ['settings'],
};

/**
 * Every committed change to these tables sends NOTIFY on its channel, so each server process drops its in-memory
 * copies at once: staff edits, sales, releases and restocks, and writes made outside the app. One notification per
 * statement; PostgreSQL folds identical ones within a transaction and sends them at commit.
 */
export async function up(knex: Knex): Promise<void> {
  for (const [channel, tables] of Object.entries(CHANNELS)) {
    await knex.raw(`
      CREATE FUNCTION notify_${channel}() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        PERFORM pg_notify('${channel}', '');
        RETURN NULL;
      END $$`);
    for (const table of tables) {
      await knex.raw(`CREATE TRIGGER ${table}_notify_${channel} AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON ${table} FOR EACH STATEMENT EXECUTE FUNCTION notify_${channel}()`);
    }
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const [channel, tables] of Object.entries(CHANNELS)) {
    for (const table of tables) await knex.raw(`DROP TRIGGER ${table}_notify_${channel} ON ${table}`);
    await knex.raw(`DROP FUNCTION notify_${channel}()`);
  }
}
