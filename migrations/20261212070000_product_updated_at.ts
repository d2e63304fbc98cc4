import type { Knex } from 'knex';

/** When a product was last edited, for the sitemap's `lastmod`; existing products start from when they were made. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('shop_products', (t) => {
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex('shop_products').update({ updated_at: knex.ref('created_at') });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('shop_products', (t) => {
    t.dropColumn('updated_at');
  });
}
