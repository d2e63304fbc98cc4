import type { Knex } from 'knex';

/** The tables the storefront's catalogue answers are built from. */
const TABLES = ['shop_products', 'shop_variants', 'shop_runs', 'shop_run_variant_caps'];

/**
 * Every committed change to the catalogue's tables sends NOTIFY shop_catalogue, so each server process drops its
 * ready catalogue answers at once: staff edits, sales, releases and restocks, and writes made outside the app. One
 * notification per statement; PostgreSQL folds identical ones within a transaction and sends them at commit.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE FUNCTION shop_catalogue_changed() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM pg_notify('shop_catalogue', '');
      RETURN NULL;
    END $$`);
  for (const table of TABLES) {
    await knex.raw(`CREATE TRIGGER ${table}_catalogue_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON ${table} FOR EACH STATEMENT EXECUTE FUNCTION shop_catalogue_changed()`);
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const table of TABLES) await knex.raw(`DROP TRIGGER ${table}_catalogue_changed ON ${table}`);
  await knex.raw('DROP FUNCTION shop_catalogue_changed()');
}
