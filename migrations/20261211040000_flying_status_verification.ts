import type { Knex } from 'knex';

/**
 * Certification level and association membership as members enter them are claims; staff who have seen the card or
 * certificate mark them verified (who, when, against what). A change of the value voids its verification.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('memberships', (t) => {
    t.timestamp('association_verified_at', { useTz: true });
    t.bigInteger('association_verified_by').references('users.id').onDelete('SET NULL');
    t.string('association_verified_against', 200);
    t.timestamp('certification_verified_at', { useTz: true });
    t.bigInteger('certification_verified_by').references('users.id').onDelete('SET NULL');
    t.string('certification_verified_against', 200);
  });
  // A verification always names the document it was checked against (the staff member may later be deleted).
  await knex.raw('ALTER TABLE memberships ADD CONSTRAINT memberships_association_verified CHECK ((association_verified_at IS NULL) = (association_verified_against IS NULL))');
  await knex.raw('ALTER TABLE memberships ADD CONSTRAINT memberships_certification_verified CHECK ((certification_verified_at IS NULL) = (certification_verified_against IS NULL))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE memberships DROP CONSTRAINT IF EXISTS memberships_certification_verified');
  await knex.raw('ALTER TABLE memberships DROP CONSTRAINT IF EXISTS memberships_association_verified');
  await knex.schema.alterTable('memberships', (t) => {
    for (const c of ['association_verified_at', 'association_verified_by', 'association_verified_against', 'certification_verified_at', 'certification_verified_by', 'certification_verified_against']) t.dropColumn(c);
  });
}
