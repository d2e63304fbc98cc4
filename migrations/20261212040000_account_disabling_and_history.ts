import type { Knex } from 'knex';

/**
 * Admins can disable an account (it cannot sign in, its sessions end) and enable it again; every change of an
 * account's roles or of its disabled state is kept, with who made it and when.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.timestamp('disabled_at', { useTz: true }).nullable();
  });
  await knex.schema.createTable('account_changes', (t) => {
    t.bigIncrements('id');
    t.bigInteger('user_id').notNullable().references('users.id').onDelete('CASCADE');
    // Null when no person made the change (dues status driving the member role, for example).
    t.bigInteger('changed_by').nullable().references('users.id').onDelete('SET NULL');
    t.string('kind', 16).notNullable();
    t.specificType('roles_before', 'text[]').notNullable();
    t.specificType('roles_after', 'text[]').notNullable();
    t.timestamp('changed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['user_id', 'changed_at']);
  });
  await knex.raw("ALTER TABLE account_changes ADD CONSTRAINT account_changes_kind CHECK (kind IN ('roles', 'disabled', 'enabled'))");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('account_changes');
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('disabled_at');
  });
}
