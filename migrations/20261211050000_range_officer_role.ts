import type { Knex } from 'knex';

const WITHOUT = "ARRAY['fan','member','sponsor','editor','treasurer','admin']::text[]";
const WITH = "ARRAY['fan','member','sponsor','editor','treasurer','admin','range_officer']::text[]";

/** The range officer (the club's range safety officer or launch director) becomes a role admins can grant. */
export async function up(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE users DROP CONSTRAINT users_roles_known');
  await knex.raw(`ALTER TABLE users ADD CONSTRAINT users_roles_known CHECK (roles <@ ${WITH})`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("UPDATE users SET roles = array_remove(roles, 'range_officer')");
  await knex.raw('ALTER TABLE users DROP CONSTRAINT users_roles_known');
  await knex.raw(`ALTER TABLE users ADD CONSTRAINT users_roles_known CHECK (roles <@ ${WITHOUT})`);
}
