import type { Knex } from 'knex';

/**
 * Sign-in lockouts that an attacker cannot aim: consecutive failures per account, kept apart for the addresses the
 * account has signed in from before ("familiar") and for everywhere else, and the familiar addresses themselves.
 * Keyed by the normalised e-mail, so an address without an account behaves exactly like one with an account.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sign_in_lockouts', (t) => {
    t.string('account_key', 254).primary();
    t.integer('failures_elsewhere').notNullable().defaultTo(0);
    t.integer('failures_familiar').notNullable().defaultTo(0);
    t.timestamp('last_elsewhere_at', { useTz: true });
    t.timestamp('last_familiar_at', { useTz: true });
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.schema.createTable('sign_in_addresses', (t) => {
    t.bigInteger('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('ip', 64).notNullable();
    t.timestamp('last_success_at', { useTz: true }).notNullable();
    t.primary(['user_id', 'ip']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('sign_in_addresses');
  await knex.schema.dropTableIfExists('sign_in_lockouts');
}
