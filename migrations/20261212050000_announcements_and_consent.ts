import type { Knex } from 'knex';

/**
 * Announcements people asked for, and the proof of their consent:
 * - `subscriptions`: one express consent per address, topic and (for drop notices) product, with the wording shown,
 *   where and from which network address it was asked, how and when it was confirmed, and when it was withdrawn;
 * - `implied_consents`: a purchase or a membership with its date (it lapses, see implied-consent.ts);
 * - `email_suppressions`: addresses (per list, or every list when `list` is null) that no commercial send reaches;
 * - `announcements`: staff announcements and automatic drop notices;
 * - `outbound_emails` learns headers, whether a mail is commercial, its list and its announcement, and a
 *   `suppressed` status for mail the worker refused to send.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('subscriptions', (t) => {
    t.bigIncrements('id');
    t.string('email', 254).notNullable();
    t.string('topic', 16).notNullable();
    t.bigInteger('product_id').references('shop_products.id').onDelete('CASCADE');
    t.bigInteger('user_id').references('users.id').onDelete('SET NULL');
    t.string('wording_version', 32).notNullable();
    t.text('wording_text').notNullable();
    t.string('source_page', 16).notNullable();
    t.string('source_ip', 64).notNullable();
    t.timestamp('requested_at', { useTz: true }).notNullable();
    t.string('confirm_token_hash', 64);
    t.timestamp('confirm_expires_at', { useTz: true });
    t.timestamp('confirmed_at', { useTz: true });
    t.string('confirmed_ip', 64);
    t.string('confirmed_how', 16);
    t.timestamp('withdrawn_at', { useTz: true });
    t.string('withdrawn_how', 24);
    t.index(['email']);
    t.index(['confirm_token_hash']);
    t.index(['topic', 'product_id']);
  });
  await knex.raw("ALTER TABLE subscriptions ADD CONSTRAINT subscriptions_topic CHECK (topic IN ('drops','launches','build-logs'))");
  await knex.raw("ALTER TABLE subscriptions ADD CONSTRAINT subscriptions_product_drops CHECK (product_id IS NULL OR topic = 'drops')");
  // One live consent (pending or confirmed) per address, topic and product; withdrawn ones stay as history.
  await knex.raw('CREATE UNIQUE INDEX subscriptions_live ON subscriptions (email, topic, COALESCE(product_id, 0)) WHERE withdrawn_at IS NULL');

  await knex.schema.createTable('implied_consents', (t) => {
    t.bigIncrements('id');
    t.string('email', 254).notNullable();
    t.string('basis', 16).notNullable();
    t.string('basis_ref', 64).notNullable();
    t.date('basis_on').notNullable();
    t.timestamp('recorded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['basis', 'basis_ref']);
    t.index(['email']);
  });
  await knex.raw("ALTER TABLE implied_consents ADD CONSTRAINT implied_consents_basis CHECK (basis IN ('purchase','membership'))");

  await knex.schema.createTable('email_suppressions', (t) => {
    t.bigIncrements('id');
    t.string('email', 254).notNullable();
    t.string('list', 16);
    t.string('reason', 16).notNullable();
    t.text('detail');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("ALTER TABLE email_suppressions ADD CONSTRAINT email_suppressions_reason CHECK (reason IN ('unsubscribed','hard_bounce','complaint','manual'))");
  await knex.raw("CREATE UNIQUE INDEX email_suppressions_one ON email_suppressions (email, COALESCE(list, ''))");

  await knex.schema.createTable('announcements', (t) => {
    t.bigIncrements('id');
    t.string('kind', 16).notNullable().defaultTo('announcement');
    t.string('topic', 16).notNullable();
    t.string('subject', 200).notNullable();
    t.text('markdown').notNullable();
    t.string('status', 16).notNullable().defaultTo('draft');
    t.bigInteger('product_id').references('shop_products.id').onDelete('SET NULL');
    t.bigInteger('run_id').unique().references('shop_runs.id').onDelete('SET NULL');
    t.bigInteger('created_by').references('users.id').onDelete('SET NULL');
    t.integer('recipients').notNullable().defaultTo(0);
    t.integer('skipped_suppressed').notNullable().defaultTo(0);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('sent_at', { useTz: true });
  });
  await knex.raw("ALTER TABLE announcements ADD CONSTRAINT announcements_kind CHECK (kind IN ('announcement','drop_notice'))");
  await knex.raw("ALTER TABLE announcements ADD CONSTRAINT announcements_status CHECK (status IN ('draft','sending'))");

  await knex.schema.alterTable('outbound_emails', (t) => {
    t.jsonb('headers');
    t.string('category', 16).notNullable().defaultTo('transactional');
    t.string('list', 16);
    t.bigInteger('announcement_id').references('announcements.id').onDelete('SET NULL');
    t.index(['announcement_id']);
  });
  await knex.raw("ALTER TABLE outbound_emails ADD CONSTRAINT outbound_emails_category CHECK (category IN ('transactional','commercial'))");
  await knex.raw('ALTER TABLE outbound_emails DROP CONSTRAINT outbound_emails_status');
  await knex.raw("ALTER TABLE outbound_emails ADD CONSTRAINT outbound_emails_status CHECK (status IN ('queued','sent','failed','suppressed'))");
}

export async function down(knex: Knex): Promise<void> {
  await knex('outbound_emails').where('status', 'suppressed').update({ status: 'failed' });
  await knex.raw('ALTER TABLE outbound_emails DROP CONSTRAINT outbound_emails_status');
  await knex.raw("ALTER TABLE outbound_emails ADD CONSTRAINT outbound_emails_status CHECK (status IN ('queued','sent','failed'))");
  await knex.raw('ALTER TABLE outbound_emails DROP CONSTRAINT outbound_emails_category');
  await knex.schema.alterTable('outbound_emails', (t) => {
    t.dropColumn('announcement_id');
    t.dropColumn('list');
    t.dropColumn('category');
    t.dropColumn('headers');
  });
  for (const table of ['announcements', 'email_suppressions', 'implied_consents', 'subscriptions']) await knex.schema.dropTableIfExists(table);
}
