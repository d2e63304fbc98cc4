import type { Knex } from 'knex';

/**
 * How many units of one product a single order may hold, a product setting shown on its page. 20 was the fixed
 * limit before, so existing products keep it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('shop_products', (t) => {
    t.integer('max_per_order').notNullable().defaultTo(20);
  });
  await knex.raw('ALTER TABLE shop_products ADD CONSTRAINT shop_products_max_per_order CHECK (max_per_order BETWEEN 1 AND 100)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE shop_products DROP CONSTRAINT shop_products_max_per_order');
  await knex.schema.alterTable('shop_products', (t) => {
    t.dropColumn('max_per_order');
  });
}
