import type { Knex } from 'knex';

/**
 * One row per money movement, fed by every feature in the same transaction as the change itself, so the books
 * read one table. Tax charged on a movement is itemised in money_movement_taxes.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('money_movements', (t) => {
    t.bigIncrements('id');
    t.timestamp('occurred_at', { useTz: true }).notNullable();
    t.string('kind', 32).notNullable();
    t.string('source', 16).notNullable();
    t.string('reference', 64).notNullable();
    t.string('counterparty', 200).notNullable();
    t.bigInteger('gross_cents').notNullable();
    t.bigInteger('fee_cents').notNullable().defaultTo(0);
    t.boolean('fee_estimated').notNullable().defaultTo(false);
    t.string('processor_charge_id', 64);
    t.string('method', 32).notNullable();
    t.string('idempotency_key', 120).unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['occurred_at']);
    t.index(['processor_charge_id']);
  });
  await knex.raw(
    "ALTER TABLE money_movements ADD CONSTRAINT money_movements_kind CHECK (kind IN ('order_payment','refund','dues_payment','manual_payment','sponsor_cash','processor_fee'))",
  );
  await knex.raw("ALTER TABLE money_movements ADD CONSTRAINT money_movements_source CHECK (source IN ('merch','dues','sponsor'))");

  await knex.schema.createTable('money_movement_taxes', (t) => {
    t.bigInteger('movement_id').notNullable().references('money_movements.id').onDelete('CASCADE');
    t.string('code', 8).notNullable();
    t.string('jurisdiction', 8).notNullable();
    t.decimal('rate_percent', 7, 4).notNullable();
    t.bigInteger('taxable_cents').notNullable();
    t.bigInteger('tax_cents').notNullable();
    t.primary(['movement_id', 'code', 'jurisdiction']);
  });

  await knex.schema.createTable('uploads', (t) => {
    t.bigIncrements('id');
    t.string('key', 80).notNullable().unique();
    t.string('content_type', 64).notNullable();
    t.integer('bytes').notNullable();
    t.integer('width');
    t.integer('height');
    t.string('thumbnail_key', 80);
    t.string('original_name', 200);
    t.bigInteger('uploaded_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('uploads');
  await knex.schema.dropTableIfExists('money_movement_taxes');
  await knex.schema.dropTableIfExists('money_movements');
}
