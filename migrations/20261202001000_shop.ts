import type { Knex } from 'knex';

/**
 * The merch shop: products with variants, limited runs with caps, shipping methods, the sales-tax rate table,
 * orders with their lines, tax lines and refunds, and the payment processor's events already handled.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shop_products', (t) => {
    t.bigIncrements('id');
    t.string('slug', 80).notNullable().unique();
    t.string('name', 120).notNullable();
    t.text('description_md').notNullable().defaultTo('');
    t.integer('price_cents').notNullable();
    t.integer('weight_grams').notNullable();
    t.jsonb('size_chart');
    t.jsonb('images').notNullable().defaultTo('[]');
    t.boolean('active').notNullable().defaultTo(true);
    t.integer('position').notNullable().defaultTo(0);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw('ALTER TABLE shop_products ADD CONSTRAINT shop_products_money CHECK (price_cents >= 0 AND weight_grams >= 0)');

  await knex.schema.createTable('shop_variants', (t) => {
    t.bigIncrements('id');
    t.bigInteger('product_id').notNullable().references('shop_products.id').onDelete('CASCADE');
    t.string('label', 60).notNullable();
    t.string('sku', 60).notNullable().unique();
    t.integer('weight_grams');
    t.integer('price_cents');
    // Ordinary stock for products sold without a run; null while a run governs the product.
    t.integer('stock_on_hand');
    t.integer('position').notNullable().defaultTo(0);
    t.index(['product_id']);
  });
  await knex.raw('ALTER TABLE shop_variants ADD CONSTRAINT shop_variants_stock CHECK (stock_on_hand IS NULL OR stock_on_hand >= 0)');

  await knex.schema.createTable('shop_runs', (t) => {
    t.bigIncrements('id');
    t.bigInteger('product_id').notNullable().references('shop_products.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.integer('cap').notNullable();
    t.integer('reserved').notNullable().defaultTo(0);
    t.timestamp('opens_at', { useTz: true }).notNullable();
    t.timestamp('closes_at', { useTz: true }).notNullable();
    t.string('state', 16).notNullable().defaultTo('scheduled');
    t.integer('unit_cost_cents');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['product_id']);
  });
  await knex.raw('ALTER TABLE shop_runs ADD CONSTRAINT shop_runs_cap CHECK (cap > 0 AND reserved >= 0 AND reserved <= cap AND closes_at > opens_at)');
  await knex.raw("ALTER TABLE shop_runs ADD CONSTRAINT shop_runs_state CHECK (state IN ('scheduled','open','closed','in_production','shipped'))");

  await knex.schema.createTable('shop_run_variant_caps', (t) => {
    t.bigInteger('run_id').notNullable().references('shop_runs.id').onDelete('CASCADE');
    t.bigInteger('variant_id').notNullable().references('shop_variants.id').onDelete('CASCADE');
    t.integer('cap').notNullable();
    t.integer('reserved').notNullable().defaultTo(0);
    t.primary(['run_id', 'variant_id']);
  });
  await knex.raw('ALTER TABLE shop_run_variant_caps ADD CONSTRAINT shop_run_variant_caps_cap CHECK (cap >= 0 AND reserved >= 0 AND reserved <= cap)');

  await knex.schema.createTable('shop_shipping_methods', (t) => {
    t.bigIncrements('id');
    t.string('code', 16).notNullable().unique();
    t.string('name', 80).notNullable();
    // [{maxGrams: number|null, priceCents}] in ascending order; null = any weight.
    t.jsonb('brackets').notNullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.integer('position').notNullable().defaultTo(0);
  });
  await knex.raw("ALTER TABLE shop_shipping_methods ADD CONSTRAINT shop_shipping_methods_code CHECK (code IN ('pickup','canada','usa','international'))");

  await knex.schema.createTable('shop_tax_rates', (t) => {
    t.bigIncrements('id');
    t.string('jurisdiction', 2).notNullable();
    t.string('code', 4).notNullable();
    t.decimal('rate_percent', 7, 4).notNullable();
    t.date('effective_from').notNullable();
    t.string('source', 200).notNullable();
    t.unique(['jurisdiction', 'code', 'effective_from']);
  });

  await knex.raw('CREATE SEQUENCE shop_order_numbers START 1001');
  await knex.schema.createTable('shop_orders', (t) => {
    t.bigIncrements('id');
    t.string('number', 20).notNullable().unique().defaultTo(knex.raw("('PS-' || lpad(nextval('shop_order_numbers')::text, 6, '0'))"));
    t.bigInteger('user_id').references('users.id').onDelete('SET NULL');
    t.string('email', 254).notNullable();
    t.string('status', 16).notNullable().defaultTo('pending');
    t.string('ship_name', 120).notNullable();
    t.string('ship_line1', 200);
    t.string('ship_line2', 200);
    t.string('ship_city', 100);
    t.string('ship_province', 40);
    t.string('ship_postal_code', 20);
    t.string('ship_country', 2).notNullable();
    t.bigInteger('shipping_method_id').references('shop_shipping_methods.id');
    t.string('shipping_code', 16).notNullable();
    t.string('shipping_name', 80).notNullable();
    t.string('tax_jurisdiction', 2);
    t.date('priced_on').notNullable();
    t.integer('weight_grams').notNullable();
    t.integer('discount_percent').notNullable().defaultTo(0);
    t.integer('subtotal_cents').notNullable();
    t.integer('discount_cents').notNullable();
    t.integer('shipping_cents').notNullable();
    t.integer('tax_cents').notNullable();
    t.integer('total_cents').notNullable();
    t.integer('refunded_cents').notNullable().defaultTo(0);
    t.integer('payment_attempts').notNullable().defaultTo(0);
    t.string('charge_id', 64);
    t.boolean('paid_outside_processor').notNullable().defaultTo(false);
    t.text('payment_message');
    t.string('carrier', 60);
    t.string('tracking_number', 80);
    t.timestamp('paid_at', { useTz: true });
    t.timestamp('packed_at', { useTz: true });
    t.timestamp('shipped_at', { useTz: true });
    t.timestamp('disputed_at', { useTz: true });
    t.string('dispute_reason', 80);
    t.timestamp('last_attempt_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['status', 'created_at']);
    t.index(['user_id']);
    t.index(['email']);
    t.index(['charge_id']);
  });
  await knex.raw("ALTER TABLE shop_orders ADD CONSTRAINT shop_orders_status CHECK (status IN ('pending','paid','failed','packed','shipped'))");
  await knex.raw('ALTER TABLE shop_orders ADD CONSTRAINT shop_orders_refunds CHECK (refunded_cents >= 0 AND refunded_cents <= total_cents)');

  await knex.schema.createTable('shop_order_items', (t) => {
    t.bigIncrements('id');
    t.bigInteger('order_id').notNullable().references('shop_orders.id').onDelete('CASCADE');
    t.bigInteger('variant_id').notNullable().references('shop_variants.id');
    t.bigInteger('run_id').references('shop_runs.id');
    t.string('product_name', 120).notNullable();
    t.string('variant_label', 60).notNullable();
    t.string('sku', 60).notNullable();
    t.integer('unit_price_cents').notNullable();
    t.integer('quantity').notNullable();
    t.integer('restocked_quantity').notNullable().defaultTo(0);
    t.index(['order_id']);
    t.index(['run_id']);
  });
  await knex.raw('ALTER TABLE shop_order_items ADD CONSTRAINT shop_order_items_qty CHECK (quantity > 0 AND restocked_quantity >= 0 AND restocked_quantity <= quantity)');

  await knex.schema.createTable('shop_order_taxes', (t) => {
    t.bigInteger('order_id').notNullable().references('shop_orders.id').onDelete('CASCADE');
    t.string('code', 4).notNullable();
    t.string('jurisdiction', 2).notNullable();
    t.decimal('rate_percent', 7, 4).notNullable();
    t.integer('taxable_cents').notNullable();
    t.integer('amount_cents').notNullable();
    t.primary(['order_id', 'code']);
  });

  await knex.schema.createTable('shop_refunds', (t) => {
    t.bigIncrements('id');
    t.bigInteger('order_id').notNullable().references('shop_orders.id').onDelete('CASCADE');
    t.integer('amount_cents').notNullable();
    t.boolean('restocked').notNullable().defaultTo(false);
    t.string('processor_refund_id', 64);
    t.string('origin', 16).notNullable();
    t.bigInteger('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['order_id']);
  });
  await knex.raw("ALTER TABLE shop_refunds ADD CONSTRAINT shop_refunds_origin CHECK (origin IN ('staff','processor') AND amount_cents > 0)");

  await knex.schema.createTable('payment_events', (t) => {
    t.string('id', 80).primary();
    t.string('type', 80).notNullable();
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex('shop_tax_rates').insert(TAX_RATES);
  // Starting prices, editable by staff in the shop settings (Padside's own guesses: common practice, no source).
  await knex('shop_shipping_methods').insert([
    { code: 'pickup', name: 'Pick up at a club launch', brackets: JSON.stringify([{ maxGrams: null, priceCents: 0 }]), position: 0 },
    { code: 'canada', name: 'Mail within Canada', brackets: JSON.stringify([{ maxGrams: 500, priceCents: 900 }, { maxGrams: 1500, priceCents: 1400 }, { maxGrams: 5000, priceCents: 2200 }]), position: 1 },
    { code: 'usa', name: 'Mail to the USA', brackets: JSON.stringify([{ maxGrams: 500, priceCents: 1500 }, { maxGrams: 1500, priceCents: 2400 }, { maxGrams: 5000, priceCents: 3800 }]), position: 2 },
    { code: 'international', name: 'Mail to other countries', brackets: JSON.stringify([{ maxGrams: 500, priceCents: 2600 }, { maxGrams: 1500, priceCents: 4200 }, { maxGrams: 5000, priceCents: 6900 }]), position: 3 },
  ]);
}

const CRA = 'Canada Revenue Agency, "Charge and collect the tax – Which rate to charge"';
/** Rates in force, each with its published source (copied from the sources named). */
const TAX_RATES = [
  ...['AB', 'NT', 'NU', 'YT', 'BC', 'MB', 'QC', 'SK'].map((p) => ({ jurisdiction: p, code: 'GST', rate_percent: '5.0000', effective_from: '2008-01-01', source: CRA })),
  { jurisdiction: 'ON', code: 'HST', rate_percent: '13.0000', effective_from: '2010-07-01', source: CRA },
  { jurisdiction: 'NB', code: 'HST', rate_percent: '15.0000', effective_from: '2016-07-01', source: CRA + ', previous rates' },
  { jurisdiction: 'NL', code: 'HST', rate_percent: '15.0000', effective_from: '2016-07-01', source: CRA + ', previous rates' },
  { jurisdiction: 'PE', code: 'HST', rate_percent: '15.0000', effective_from: '2016-10-01', source: CRA },
  { jurisdiction: 'NS', code: 'HST', rate_percent: '15.0000', effective_from: '2010-07-01', source: CRA + ', previous rates' },
  { jurisdiction: 'NS', code: 'HST', rate_percent: '14.0000', effective_from: '2025-04-01', source: 'Canada Gazette II, SOR/2025-77; CRA GST/HST Notice 342' },
  { jurisdiction: 'BC', code: 'PST', rate_percent: '7.0000', effective_from: '2013-04-01', source: 'Government of British Columbia, "B.C. provincial sales tax (PST)"' },
  { jurisdiction: 'MB', code: 'RST', rate_percent: '7.0000', effective_from: '2019-07-01', source: 'Manitoba Finance, "Retail Sales Tax"' },
  { jurisdiction: 'QC', code: 'QST', rate_percent: '9.9750', effective_from: '2013-01-01', source: 'Revenu Québec, "Basic Rules for Applying the GST/HST and QST"' },
  { jurisdiction: 'SK', code: 'PST', rate_percent: '6.0000', effective_from: '2017-03-23', source: 'Government of Saskatchewan, "Provincial Sales Tax"' },
];

export async function down(knex: Knex): Promise<void> {
  for (const table of ['payment_events', 'shop_refunds', 'shop_order_taxes', 'shop_order_items', 'shop_orders', 'shop_tax_rates', 'shop_shipping_methods', 'shop_run_variant_caps', 'shop_runs', 'shop_variants', 'shop_products']) {
    await knex.schema.dropTableIfExists(table);
  }
  await knex.raw('DROP SEQUENCE IF EXISTS shop_order_numbers');
}
