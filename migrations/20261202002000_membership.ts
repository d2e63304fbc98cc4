import type { Knex } from 'knex';

/**
 * Club membership: plans, one membership per account (its member number comes from a sequence, so a number is
 * never handed out twice), family members, dues payments and refunds, and an audit of every change.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('membership_plans', (t) => {
    t.bigIncrements('id');
    t.string('code', 32).notNullable().unique();
    t.string('name', 80).notNullable();
    t.string('description', 400).notNullable().defaultTo('');
    t.string('eligibility', 16).notNullable().defaultTo('any');
    t.integer('dues_cents').notNullable();
    t.integer('joining_fee_cents').notNullable().defaultTo(0);
    t.boolean('active').notNullable().defaultTo(true);
    t.integer('sort_order').notNullable().defaultTo(0);
    t.timestamps(true, true);
  });
  await knex.raw("ALTER TABLE membership_plans ADD CONSTRAINT membership_plans_eligibility CHECK (eligibility IN ('any','junior','family'))");
  await knex.raw('ALTER TABLE membership_plans ADD CONSTRAINT membership_plans_amounts CHECK (dues_cents >= 0 AND joining_fee_cents >= 0)');
  // The three plans every club starts with; staff change names and dues in the console.
  await knex('membership_plans').insert([
    { code: 'adult', name: 'Adult', description: 'One flyer aged 18 or over on the first day of the term.', eligibility: 'any', dues_cents: 4500, sort_order: 1 },
    { code: 'junior', name: 'Junior', description: 'One flyer under 18 on the first day of the term.', eligibility: 'junior', dues_cents: 2000, sort_order: 2 },
    { code: 'family', name: 'Family', description: 'Adults and juniors living at one address.', eligibility: 'family', dues_cents: 7000, sort_order: 3 },
  ]);

  await knex.raw('CREATE SEQUENCE membership_number_seq START 1001');
  await knex.schema.createTable('memberships', (t) => {
    t.bigIncrements('id');
    t.bigInteger('user_id').notNullable().unique().references('users.id').onDelete('RESTRICT');
    t.string('member_number', 16).notNullable().unique();
    t.bigInteger('plan_id').notNullable().references('membership_plans.id');
    t.string('status', 16).notNullable().defaultTo('pending');
    t.date('term_start');
    t.date('term_end');
    t.string('legal_name', 120).notNullable();
    t.date('date_of_birth').notNullable();
    t.string('address', 400).notNullable();
    t.string('phone', 40).notNullable();
    t.string('emergency_contact', 200).notNullable();
    t.string('association_number', 40);
    t.date('association_expires');
    t.string('certification_level', 16).notNullable().defaultTo('none');
    t.date('certification_date');
    t.string('waiver_version', 32).notNullable();
    t.timestamp('waiver_accepted_at', { useTz: true }).notNullable();
    t.string('safety_code_version', 32).notNullable();
    t.timestamp('safety_code_accepted_at', { useTz: true }).notNullable();
    t.boolean('auto_renew').notNullable().defaultTo(false);
    t.string('processor_customer_id', 64);
    t.integer('renewal_attempts').notNullable().defaultTo(0);
    t.date('next_renewal_attempt_on');
    t.timestamp('renewal_failed_at', { useTz: true });
    t.timestamps(true, true);
    t.index(['status']);
    t.index(['term_end']);
  });
  await knex.raw("ALTER TABLE memberships ADD CONSTRAINT memberships_status CHECK (status IN ('pending','active','lapsing','lapsed'))");

  await knex.schema.createTable('membership_family_members', (t) => {
    t.bigIncrements('id');
    t.bigInteger('membership_id').notNullable().references('memberships.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.date('date_of_birth').notNullable();
  });

  await knex.schema.createTable('membership_payments', (t) => {
    t.bigIncrements('id');
    t.bigInteger('membership_id').notNullable().references('memberships.id');
    t.bigInteger('plan_id').notNullable().references('membership_plans.id');
    t.string('entry', 16).notNullable().defaultTo('payment');
    t.string('status', 16).notNullable();
    t.string('method', 16).notNullable();
    t.integer('amount_cents').notNullable();
    t.string('receipt_number', 40);
    t.string('processor_charge_id', 64);
    t.string('idempotency_key', 160).notNullable().unique();
    t.date('term_start');
    t.date('term_end');
    t.date('previous_term_end');
    t.bigInteger('refund_of').references('membership_payments.id');
    t.string('note', 400);
    t.string('failure_message', 400);
    t.bigInteger('recorded_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['membership_id']);
  });
  await knex.raw("ALTER TABLE membership_payments ADD CONSTRAINT membership_payments_entry CHECK (entry IN ('payment','refund'))");
  await knex.raw("ALTER TABLE membership_payments ADD CONSTRAINT membership_payments_status CHECK (status IN ('attempted','paid','declined','unknown','refunded'))");
  await knex.raw("ALTER TABLE membership_payments ADD CONSTRAINT membership_payments_method CHECK (method IN ('card','cash','e-transfer','cheque'))");

  await knex.schema.createTable('membership_audit', (t) => {
    t.bigIncrements('id');
    t.bigInteger('membership_id').notNullable().references('memberships.id').onDelete('CASCADE');
    t.bigInteger('actor_user_id').references('users.id').onDelete('SET NULL');
    t.string('action', 40).notNullable();
    t.jsonb('detail').notNullable().defaultTo('{}');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['membership_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['membership_audit', 'membership_payments', 'membership_family_members', 'memberships', 'membership_plans']) {
    await knex.schema.dropTableIfExists(table);
  }
  await knex.raw('DROP SEQUENCE IF EXISTS membership_number_seq');
}
