import type { Knex } from 'knex';

/**
 * The brand and last four digits of the card kept with the processor, as the processor reported them when it was
 * saved, so the member sees which card is on file. Cards saved before this stay unnamed until they are replaced.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('memberships', (t) => {
    t.string('card_brand', 32);
    t.string('card_last4', 4);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('memberships', (t) => {
    t.dropColumns('card_brand', 'card_last4');
  });
}
