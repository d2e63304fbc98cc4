import type { Knex } from 'knex';

/**
 * A deleted account stays as a row (orders, dues and flight cards point at it) marked `deleted_at`, its name, e-mail
 * and password replaced. A deleted member's date of birth is erased with the rest, so the column takes null.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.timestamp('deleted_at', { useTz: true });
  });
  await knex.raw('ALTER TABLE memberships ALTER COLUMN date_of_birth DROP NOT NULL');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("UPDATE memberships SET date_of_birth = '1900-01-01' WHERE date_of_birth IS NULL");
  await knex.raw('ALTER TABLE memberships ALTER COLUMN date_of_birth SET NOT NULL');
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('deleted_at');
  });
}
