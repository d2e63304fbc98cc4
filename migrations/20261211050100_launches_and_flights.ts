import type { Knex } from 'knex';

/**
 * Launch days, who said they would come, who was checked in at the field, the flight cards filed there, and the
 * analysed altimeter log of a flown card. A launch's `uid` never changes, so a subscribed calendar updates the
 * same event; `sequence` goes up with every change a calendar must notice (calling the launch off).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('launches', (t) => {
    t.bigIncrements('id');
    t.uuid('uid').notNullable().unique().defaultTo(knex.raw('gen_random_uuid()'));
    t.string('title', 120).notNullable();
    t.date('launch_date').notNullable();
    t.string('starts_at', 5).notNullable();
    t.string('ends_at', 5).notNullable();
    t.string('site_name', 120).notNullable();
    t.string('site_address', 400);
    t.decimal('site_lat', 9, 6);
    t.decimal('site_lon', 9, 6);
    t.integer('ceiling_metres');
    t.string('waiver_version', 32);
    t.text('notes').notNullable().defaultTo('');
    t.string('status', 16).notNullable().defaultTo('scheduled');
    t.string('call_off_reason', 400);
    t.timestamp('called_off_at', { useTz: true });
    t.integer('sequence').notNullable().defaultTo(0);
    t.bigInteger('created_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['launch_date']);
  });
  await knex.raw("ALTER TABLE launches ADD CONSTRAINT launches_status CHECK (status IN ('scheduled','called_off','done'))");
  await knex.raw("ALTER TABLE launches ADD CONSTRAINT launches_window CHECK (starts_at ~ '^([01][0-9]|2[0-3]):[0-5][0-9]$' AND ends_at ~ '^([01][0-9]|2[0-3]):[0-5][0-9]$' AND starts_at < ends_at)");
  await knex.raw('ALTER TABLE launches ADD CONSTRAINT launches_ceiling CHECK (ceiling_metres IS NULL OR ceiling_metres > 0)');

  await knex.schema.createTable('launch_rsvps', (t) => {
    t.bigInteger('launch_id').notNullable().references('launches.id').onDelete('CASCADE');
    t.bigInteger('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.boolean('going').notNullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['launch_id', 'user_id']);
  });

  await knex.schema.createTable('launch_attendance', (t) => {
    t.bigInteger('launch_id').notNullable().references('launches.id').onDelete('CASCADE');
    t.bigInteger('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('member_number', 16).notNullable();
    t.timestamp('checked_in_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.bigInteger('checked_in_by').references('users.id').onDelete('SET NULL');
    t.primary(['launch_id', 'user_id']);
  });

  await knex.schema.createTable('flights', (t) => {
    t.bigIncrements('id');
    t.bigInteger('launch_id').notNullable().references('launches.id').onDelete('RESTRICT');
    t.bigInteger('user_id').notNullable().references('users.id').onDelete('RESTRICT');
    t.string('rocket_name', 120).notNullable();
    t.string('post_slug', 120);
    t.integer('liftoff_mass_grams').notNullable();
    t.jsonb('motors').notNullable();
    t.integer('expected_altitude_metres');
    t.string('recovery', 16);
    t.string('pad', 16);
    t.text('notes').notNullable().defaultTo('');
    t.decimal('thrust_to_weight', 8, 2).notNullable();
    t.jsonb('warnings').notNullable().defaultTo('[]');
    t.boolean('needs_high_power').notNullable().defaultTo(false);
    t.string('certification_level', 16).notNullable();
    t.string('status', 16).notNullable().defaultTo('filed');
    t.string('decision_reason', 400);
    t.bigInteger('decided_by').references('users.id').onDelete('SET NULL');
    t.timestamp('decided_at', { useTz: true });
    t.string('outcome', 16);
    t.text('outcome_notes');
    t.timestamp('flown_at', { useTz: true });
    t.timestamps(true, true);
    t.index(['launch_id']);
    t.index(['user_id']);
  });
  await knex.raw("ALTER TABLE flights ADD CONSTRAINT flights_status CHECK (status IN ('filed','approved','sent_back','flown'))");
  await knex.raw("ALTER TABLE flights ADD CONSTRAINT flights_recovery CHECK (recovery IS NULL OR recovery IN ('parachute','streamer','dual_deploy'))");
  await knex.raw("ALTER TABLE flights ADD CONSTRAINT flights_outcome CHECK (outcome IS NULL OR outcome IN ('recovered','damaged','lost','tree','motor_failure'))");
  await knex.raw('ALTER TABLE flights ADD CONSTRAINT flights_mass CHECK (liftoff_mass_grams > 0)');

  await knex.schema.createTable('flight_data', (t) => {
    t.bigInteger('flight_id').primary().references('flights.id').onDelete('CASCADE');
    t.jsonb('summary').notNullable();
    t.jsonb('series').notNullable();
    t.jsonb('events').notNullable();
    t.jsonb('mapping').notNullable();
    t.text('filter').notNullable();
    t.string('file_name', 200);
    t.bigInteger('uploaded_by').references('users.id').onDelete('SET NULL');
    t.timestamp('uploaded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['flight_data', 'flights', 'launch_attendance', 'launch_rsvps', 'launches']) {
    await knex.schema.dropTableIfExists(table);
  }
}
