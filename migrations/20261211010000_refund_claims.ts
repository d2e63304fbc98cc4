import type { Knex } from 'knex';

/**
 * Refunds are claimed before the processor is asked: a shop refund row starts `requested` with its own idempotency
 * key and ends `succeeded` or `failed`. Each refund keeps what it gave back (goods, shipping, each tax, the lines and
 * quantities), so later refunds and the tax report read the same figures. Dues refunds get the same states.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('shop_refunds', (t) => {
    t.string('state', 16).notNullable().defaultTo('succeeded');
    t.string('idempotency_key', 120);
    t.string('request_key', 120);
    t.string('request_hash', 64);
    t.integer('goods_cents').notNullable().defaultTo(0);
    t.integer('shipping_cents').notNullable().defaultTo(0);
    t.integer('tax_cents').notNullable().defaultTo(0);
    t.string('reason', 400);
    t.string('failure_message', 400);
    t.timestamp('settled_at', { useTz: true });
  });
  await knex.schema.createTable('shop_refund_lines', (t) => {
    t.bigInteger('refund_id').notNullable().references('shop_refunds.id').onDelete('CASCADE');
    t.bigInteger('order_item_id').notNullable().references('shop_order_items.id').onDelete('CASCADE');
    t.integer('quantity').notNullable();
    t.integer('goods_cents').notNullable();
    t.primary(['refund_id', 'order_item_id']);
  });
  await knex.raw('ALTER TABLE shop_refund_lines ADD CONSTRAINT shop_refund_lines_qty CHECK (quantity > 0 AND goods_cents >= 0)');
  await knex.schema.createTable('shop_refund_taxes', (t) => {
    t.bigInteger('refund_id').notNullable().references('shop_refunds.id').onDelete('CASCADE');
    t.string('code', 4).notNullable();
    t.string('jurisdiction', 2).notNullable();
    t.decimal('rate_percent', 7, 4).notNullable();
    t.integer('taxable_cents').notNullable();
    t.integer('tax_cents').notNullable();
    t.primary(['refund_id', 'code', 'jurisdiction']);
  });

  // Refunds recorded before this change: their tax is the one booked on their money movement; the rest was goods.
  await knex.raw(`
    INSERT INTO shop_refund_taxes (refund_id, code, jurisdiction, rate_percent, taxable_cents, tax_cents)
    SELECT r.id, t.code, t.jurisdiction, t.rate_percent, -t.taxable_cents, -t.tax_cents
    FROM shop_refunds r
    JOIN money_movements m ON m.idempotency_key = 'shop-refund-' || r.id
    JOIN money_movement_taxes t ON t.movement_id = m.id`);
  await knex.raw(`
    UPDATE shop_refunds r SET
      idempotency_key = 'padside-shop-refund-legacy-' || r.id,
      settled_at = r.created_at,
      tax_cents = coalesce((SELECT sum(tax_cents) FROM shop_refund_taxes WHERE refund_id = r.id), 0),
      goods_cents = r.amount_cents - coalesce((SELECT sum(tax_cents) FROM shop_refund_taxes WHERE refund_id = r.id), 0)`);
  await knex.raw('ALTER TABLE shop_refunds ALTER COLUMN idempotency_key SET NOT NULL');
  await knex.raw('CREATE UNIQUE INDEX shop_refunds_idempotency_key ON shop_refunds (idempotency_key)');
  await knex.raw('CREATE UNIQUE INDEX shop_refunds_request_key ON shop_refunds (order_id, request_key) WHERE request_key IS NOT NULL');
  await knex.raw('CREATE UNIQUE INDEX shop_refunds_processor_refund_id ON shop_refunds (processor_refund_id) WHERE processor_refund_id IS NOT NULL');
  await knex.raw("ALTER TABLE shop_refunds ADD CONSTRAINT shop_refunds_state CHECK (state IN ('requested','succeeded','failed'))");
  await knex.raw('ALTER TABLE shop_refunds ADD CONSTRAINT shop_refunds_parts CHECK (goods_cents >= 0 AND shipping_cents >= 0 AND goods_cents + shipping_cents + tax_cents = amount_cents)');

  await knex.schema.alterTable('membership_payments', (t) => {
    t.string('request_key', 120);
    t.string('processor_refund_id', 64);
  });
  await knex.raw('ALTER TABLE membership_payments DROP CONSTRAINT membership_payments_status');
  await knex.raw("ALTER TABLE membership_payments ADD CONSTRAINT membership_payments_status CHECK (status IN ('attempted','paid','declined','unknown','refunded','requested','failed'))");
  await knex.raw('CREATE UNIQUE INDEX membership_payments_request_key ON membership_payments (membership_id, request_key) WHERE request_key IS NOT NULL');
  await knex.raw('CREATE UNIQUE INDEX membership_payments_processor_refund_id ON membership_payments (processor_refund_id) WHERE processor_refund_id IS NOT NULL');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP INDEX IF EXISTS membership_payments_processor_refund_id');
  await knex.raw('DROP INDEX IF EXISTS membership_payments_request_key');
  // Claims that never settled are not refunds; failed ones gave nothing back.
  await knex('membership_payments').whereIn('status', ['requested', 'failed']).where('entry', 'refund').delete();
  await knex.raw('ALTER TABLE membership_payments DROP CONSTRAINT membership_payments_status');
  await knex.raw("ALTER TABLE membership_payments ADD CONSTRAINT membership_payments_status CHECK (status IN ('attempted','paid','declined','unknown','refunded'))");
  await knex.schema.alterTable('membership_payments', (t) => {
    t.dropColumn('processor_refund_id');
    t.dropColumn('request_key');
  });
  await knex.schema.dropTableIfExists('shop_refund_taxes');
  await knex.schema.dropTableIfExists('shop_refund_lines');
  await knex('shop_refunds').whereIn('state', ['requested', 'failed']).delete();
  await knex.raw('DROP INDEX IF EXISTS shop_refunds_processor_refund_id');
  await knex.raw('DROP INDEX IF EXISTS shop_refunds_request_key');
  await knex.raw('DROP INDEX IF EXISTS shop_refunds_idempotency_key');
  await knex.raw('ALTER TABLE shop_refunds DROP CONSTRAINT IF EXISTS shop_refunds_parts');
  await knex.raw('ALTER TABLE shop_refunds DROP CONSTRAINT IF EXISTS shop_refunds_state');
  await knex.schema.alterTable('shop_refunds', (t) => {
    for (const c of ['state', 'idempotency_key', 'request_key', 'request_hash', 'goods_cents', 'shipping_cents', 'tax_cents', 'reason', 'failure_message', 'settled_at']) t.dropColumn(c);
  });
}
