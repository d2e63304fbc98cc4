import type { Knex } from 'knex';

/**
 * Each sponsor agreement says how it is taxed: `promotion` (the sponsor buys credits, mentions, logos: a taxable
 * supply for a GST/HST-registered team, charged at the rate of the sponsor's province) or `gift` (no promotion,
 * no tax). Existing agreements were recorded without tax, so they start as `gift`; the treasurer changes that
 * before recording the cash.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sponsor_agreements', (t) => {
    t.string('tax_treatment', 16).notNullable().defaultTo('gift');
    t.string('tax_province', 2);
  });
  await knex.raw(
    "ALTER TABLE sponsor_agreements ADD CONSTRAINT sponsor_agreements_tax CHECK (tax_treatment IN ('promotion','gift') AND (tax_treatment = 'gift' OR tax_province IS NOT NULL))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE sponsor_agreements DROP CONSTRAINT IF EXISTS sponsor_agreements_tax');
  await knex.schema.alterTable('sponsor_agreements', (t) => {
    t.dropColumn('tax_province');
    t.dropColumn('tax_treatment');
  });
}
