import type { Knex } from 'knex';

/**
 * Manitoba RST was 8% from 2013-07-01 to 2019-06-30 and 7% from 2019-07-01 (Manitoba Finance, from memory). The
 * table held only the 7% row, so anything dated before July 2019 was priced at 7%; the earlier rate joins the history.
 */
const ROW = { jurisdiction: 'MB', code: 'RST', rate_percent: '8.0000', effective_from: '2013-07-01', source: 'Manitoba Finance, "Retail Sales Tax" (8% until 2019-06-30; from memory)' };

export async function up(knex: Knex): Promise<void> {
  await knex('shop_tax_rates').insert(ROW).onConflict(['jurisdiction', 'code', 'effective_from']).ignore();
}

export async function down(knex: Knex): Promise<void> {
  await knex('shop_tax_rates').where({ jurisdiction: ROW.jurisdiction, code: ROW.code, effective_from: ROW.effective_from }).delete();
}
