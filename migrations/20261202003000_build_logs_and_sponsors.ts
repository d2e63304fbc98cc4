import type { Knex } from 'knex';

/**
 * Build-log posts and the sponsor ledger: sponsors and their contacts, agreements per season with in-kind items
 * and promised deliverables, the sponsors a post credits, and every credit delivered (from a post or by hand).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sponsors', (t) => {
    t.bigIncrements('id');
    t.string('slug', 80).notNullable().unique();
    t.string('name', 120).notNullable();
    t.string('website', 300);
    t.text('blurb');
    t.string('logo_url', 120);
    t.timestamps(true, true);
  });

  await knex.schema.createTable('sponsor_contacts', (t) => {
    t.bigInteger('sponsor_id').notNullable().references('sponsors.id').onDelete('CASCADE');
    t.bigInteger('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['sponsor_id', 'user_id']);
  });

  await knex.schema.createTable('posts', (t) => {
    t.bigIncrements('id');
    t.string('slug', 120).notNullable().unique();
    t.string('title', 160).notNullable();
    t.string('summary', 400).notNullable().defaultTo('');
    t.string('cover_url', 120);
    t.text('markdown').notNullable();
    t.specificType('tags', 'text[]').notNullable().defaultTo(knex.raw("'{}'::text[]"));
    t.bigInteger('author_id').references('users.id').onDelete('SET NULL');
    t.string('status', 16).notNullable().defaultTo('draft');
    t.timestamp('publish_at', { useTz: true });
    t.timestamp('published_at', { useTz: true });
    t.boolean('members_only').notNullable().defaultTo(false);
    t.boolean('hazard_requested').notNullable().defaultTo(false);
    t.timestamps(true, true);
    t.index(['status', 'published_at']);
  });
  await knex.raw("ALTER TABLE posts ADD CONSTRAINT posts_status CHECK (status IN ('draft','scheduled','published'))");
  await knex.raw("ALTER TABLE posts ADD CONSTRAINT posts_scheduled_time CHECK (status <> 'scheduled' OR publish_at IS NOT NULL)");
  await knex.raw('CREATE INDEX posts_tags ON posts USING gin (tags)');

  await knex.schema.createTable('post_credits', (t) => {
    t.bigInteger('post_id').notNullable().references('posts.id').onDelete('CASCADE');
    t.bigInteger('sponsor_id').notNullable().references('sponsors.id').onDelete('RESTRICT');
    t.primary(['post_id', 'sponsor_id']);
  });

  await knex.schema.createTable('sponsor_agreements', (t) => {
    t.bigIncrements('id');
    t.bigInteger('sponsor_id').notNullable().references('sponsors.id').onDelete('CASCADE');
    t.string('season', 9).notNullable();
    t.bigInteger('cash_cents').notNullable().defaultTo(0);
    t.date('cash_received_on');
    t.bigInteger('cash_movement_id').references('money_movements.id').onDelete('SET NULL');
    t.text('note');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['sponsor_id', 'season']);
  });
  await knex.raw('ALTER TABLE sponsor_agreements ADD CONSTRAINT sponsor_agreements_cash CHECK (cash_cents >= 0)');

  await knex.schema.createTable('agreement_in_kind', (t) => {
    t.bigIncrements('id');
    t.bigInteger('agreement_id').notNullable().references('sponsor_agreements.id').onDelete('CASCADE');
    t.string('description', 200).notNullable();
    t.bigInteger('value_cents').notNullable();
    t.date('received_on');
  });
  await knex.raw('ALTER TABLE agreement_in_kind ADD CONSTRAINT agreement_in_kind_value CHECK (value_cents >= 0)');

  await knex.schema.createTable('agreement_deliverables', (t) => {
    t.bigIncrements('id');
    t.bigInteger('agreement_id').notNullable().references('sponsor_agreements.id').onDelete('CASCADE');
    t.string('kind', 32).notNullable();
    t.integer('quantity').notNullable();
    t.date('due_on').notNullable();
  });
  await knex.raw(
    "ALTER TABLE agreement_deliverables ADD CONSTRAINT agreement_deliverables_kind CHECK (kind IN ('build_log_credit','video_mention','logo_on_merch','sponsors_page','social_post'))",
  );
  await knex.raw('ALTER TABLE agreement_deliverables ADD CONSTRAINT agreement_deliverables_quantity CHECK (quantity > 0)');

  await knex.schema.createTable('sponsor_credits', (t) => {
    t.bigIncrements('id');
    t.bigInteger('sponsor_id').notNullable().references('sponsors.id').onDelete('CASCADE');
    t.bigInteger('deliverable_id').references('agreement_deliverables.id').onDelete('SET NULL');
    t.string('kind', 32).notNullable();
    t.string('url', 500);
    t.string('video_timestamp', 12);
    t.text('note');
    t.bigInteger('post_id').references('posts.id').onDelete('SET NULL');
    t.bigInteger('recorded_by').references('users.id').onDelete('SET NULL');
    t.timestamp('credited_at', { useTz: true }).notNullable();
    t.timestamp('withdrawn_at', { useTz: true });
    t.index(['sponsor_id']);
  });
  // One live credit per post and sponsor; a withdrawn one stays as history.
  await knex.raw('CREATE UNIQUE INDEX sponsor_credits_live_post ON sponsor_credits (post_id, sponsor_id) WHERE withdrawn_at IS NULL AND post_id IS NOT NULL');
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['sponsor_credits', 'agreement_deliverables', 'agreement_in_kind', 'sponsor_agreements', 'post_credits', 'posts', 'sponsor_contacts', 'sponsors']) {
    await knex.schema.dropTableIfExists(table);
  }
}
