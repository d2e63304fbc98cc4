import type { Knex } from 'knex';

/**
 * When a dues card charge was last handed to the processor. While that is recent, the attempt holds its term, so a
 * second request for the same member and term waits its turn instead of charging again; an old one (its process
 * gone) no longer holds it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('membership_payments', (t) => {
    t.timestamp('attempted_at', { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('membership_payments', (t) => {
    t.dropColumn('attempted_at');
  });
}
