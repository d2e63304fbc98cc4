import type { Knex } from 'knex';

/** Accounts, sessions, single-use tokens, shared rate-limit counters, the e-mail outbox and app settings. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.bigIncrements('id');
    t.string('email', 254).notNullable().unique();
    t.string('password_hash').notNullable();
    t.string('display_name', 80).notNullable();
    t.specificType('roles', 'text[]').notNullable().defaultTo(knex.raw("'{fan}'::text[]"));
    t.timestamp('email_verified_at', { useTz: true });
    t.boolean('marketing_opt_out').notNullable().defaultTo(false);
    t.timestamps(true, true);
  });
  await knex.raw(
    "ALTER TABLE users ADD CONSTRAINT users_roles_known CHECK (roles <@ ARRAY['fan','member','sponsor','editor','treasurer','admin']::text[])",
  );
  await knex.raw('ALTER TABLE users ADD CONSTRAINT users_email_lower CHECK (email = lower(email))');

  await knex.schema.createTable('auth_tokens', (t) => {
    t.bigIncrements('id');
    t.bigInteger('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('purpose', 32).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['user_id', 'purpose']);
  });

  // connect-pg-simple's own table layout.
  await knex.raw(`CREATE TABLE "session" ("sid" varchar NOT NULL COLLATE "default" PRIMARY KEY, "sess" json NOT NULL, "expire" timestamp(6) NOT NULL)`);
  await knex.raw('CREATE INDEX "IDX_session_expire" ON "session" ("expire")');

  // rate-limiter-flexible's layout for its PostgreSQL store.
  await knex.raw('CREATE TABLE rate_limits (key varchar(255) PRIMARY KEY, points integer NOT NULL DEFAULT 0, expire bigint)');

  await knex.schema.createTable('outbound_emails', (t) => {
    t.bigIncrements('id');
    t.string('to_address', 254).notNullable();
    t.string('subject', 200).notNullable();
    t.text('text_body').notNullable();
    t.text('html_body');
    t.string('template', 64).notNullable();
    t.string('dedupe_key', 200).unique();
    t.string('status', 16).notNullable().defaultTo('queued');
    t.integer('attempts').notNullable().defaultTo(0);
    t.text('last_error');
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('sent_at', { useTz: true });
  });
  await knex.raw("ALTER TABLE outbound_emails ADD CONSTRAINT outbound_emails_status CHECK (status IN ('queued','sent','failed'))");
  await knex.raw("CREATE INDEX outbound_emails_due ON outbound_emails (next_attempt_at) WHERE status = 'queued'");

  await knex.schema.createTable('settings', (t) => {
    t.string('key', 64).primary();
    t.jsonb('value').notNullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('app_meta', (t) => {
    t.string('key', 64).primary();
    t.text('value').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['app_meta', 'settings', 'outbound_emails', 'rate_limits', 'session', 'auth_tokens', 'users']) {
    await knex.schema.dropTableIfExists(table);
  }
}
