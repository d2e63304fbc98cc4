import type { Knex } from 'knex';
import { recordMovement } from '../server/books/ledger-writer';
import { percentOf } from '../server/shop/pricing';
import { SHOP_SETTINGS } from '../server/shop/shop-settings';
import { computeTaxes, type TaxRate } from '../server/shop/tax';
import { SettingsService } from '../server/settings/settings-service';

/**
 * Receipt details of the invented seller. The numbers only look like a business number and a provincial account
 * (nine zeros, RT0001): they are demo values that belong to no one.
 */
export const DEMO_SELLER = {
  sellerName: 'Thrust & Filament Rocketry Team (demo)',
  gstHstNumber: '000000000 RT0001',
  provincialTaxNumbers: { MB: '000000-0' },
};

/** Demo merch of the invented Thrust & Filament team: an open shirt run, an earlier closed run, stickers and a pin. */
export async function seed(knex: Knex): Promise<void> {
  if (await knex('shop_products').where('slug', 'season-3-shirt').first()) return;
  const settings = new SettingsService(knex);
  const shop = await settings.get(SHOP_SETTINGS);
  if (!shop.gstHstNumber) await settings.put(SHOP_SETTINGS, { ...shop, ...DEMO_SELLER });
  const day = 86400_000;
  const now = Date.now();
  const sizes = ['XS', 'S', 'M', 'L', 'XL', '2XL', '3XL'];
  const chart = {
    columns: ['Size', 'Chest (cm)', 'Length (cm)'],
    rows: sizes.map((s, i) => [s, String(84 + i * 8), String(66 + i * 2)]),
  };

  const shirt = await product(
    knex,
    {
      slug: 'season-3-shirt',
      name: 'Thrust & Filament Season 3 shirt',
      description_md:
        'Our Season 3 mission patch, screen printed by **Inkwobble Screenworks** on a heavy cotton tee.\n\n- One print run, then it is gone\n- Printed after the window closes, shipped or handed out at the next Gopher Flats launch',
      price_cents: 3200,
      weight_grams: 190,
      size_chart: JSON.stringify(chart),
    },
    sizes.map((s, i) => ({
      label: s,
      sku: `TF-S3-${s}`,
      weight_grams: 170 + i * 15,
      price_cents: i >= 5 ? 3600 : null,
      stock_on_hand: null,
    })),
  );
  const [run3] = await knex('shop_runs')
    .insert({
      product_id: shirt.id,
      name: 'Season 3 shirt run',
      cap: 150,
      opens_at: new Date(now - 5 * day),
      closes_at: new Date(now + 21 * day),
      state: 'open',
      unit_cost_cents: 1150,
    })
    .returning('id');

  const old = await product(
    knex,
    {
      slug: 'season-2-shirt',
      name: 'Thrust & Filament Season 2 shirt',
      description_md: 'The Season 2 design. This run has closed and shipped.',
      price_cents: 3000,
      weight_grams: 190,
    },
    ['S', 'M', 'L', 'XL'].map((s) => ({
      label: s,
      sku: `TF-S2-${s}`,
      weight_grams: null,
      price_cents: null,
      stock_on_hand: null,
    })),
  );
  const [run2] = await knex('shop_runs')
    .insert({
      product_id: old.id,
      name: 'Season 2 shirt run',
      cap: 80,
      reserved: 80,
      opens_at: new Date(now - 200 * day),
      closes_at: new Date(now - 170 * day),
      state: 'shipped',
      unit_cost_cents: 1100,
    })
    .returning('id');

  await product(
    knex,
    {
      slug: 'sticker-sheet',
      name: 'Launch-rail sticker sheet',
      description_md: 'Six vinyl stickers: the team logo, a fin can and a Spoolgoblin spool.',
      price_cents: 600,
      weight_grams: 15,
    },
    [{ label: 'One sheet', sku: 'TF-STK-1', weight_grams: null, price_cents: null, stock_on_hand: 240 }],
  );
  await product(
    knex,
    {
      slug: 'nose-cone-pin',
      name: 'Nose-cone enamel pin',
      description_md: 'Hard enamel, 30 mm, with a rubber clutch.',
      price_cents: 1200,
      weight_grams: 20,
    },
    [
      { label: 'Gold', sku: 'TF-PIN-G', weight_grams: null, price_cents: null, stock_on_hand: 60 },
      { label: 'Silver', sku: 'TF-PIN-S', weight_grams: null, price_cents: null, stock_on_hand: 0 },
    ],
  );

  const rates: TaxRate[] = (
    await knex('shop_tax_rates').select(
      'jurisdiction',
      'code',
      'rate_percent',
      knex.raw("to_char(effective_from, 'YYYY-MM-DD') as effective_from"),
    )
  ).map((r) => ({
    jurisdiction: r.jurisdiction,
    code: r.code,
    ratePercent: String(r.rate_percent),
    effectiveFrom: r.effective_from,
  }));
  const pickup = await knex('shop_shipping_methods').where('code', 'pickup').first();
  const fan = await knex('users').where('email', 'fan@padside.test').first();
  const member = await knex('users').where('email', 'member@padside.test').first();
  const variant = (sku: string) => knex('shop_variants').where('sku', sku).first();
  const demo = [
    { user: fan, sku: 'TF-S3-M', runId: run3.id, qty: 1, status: 'paid', days: 3, member: false },
    { user: member, sku: 'TF-S3-L', runId: run3.id, qty: 2, status: 'paid', days: 2, member: true },
    { user: fan, sku: 'TF-S2-S', runId: run2.id, qty: 1, status: 'shipped', days: 180, member: false },
    { user: member, sku: 'TF-STK-1', runId: null, qty: 3, status: 'packed', days: 1, member: true },
  ];
  for (const d of demo) {
    if (!d.user) continue;
    const v = await variant(d.sku);
    const p = await knex('shop_products').where('id', v.product_id).first();
    const unit = v.price_cents ?? p.price_cents;
    const subtotal = unit * d.qty;
    const discount = d.member ? percentOf(subtotal, 10) : 0;
    const created = new Date(now - d.days * day);
    const taxes = computeTaxes(
      { goodsCents: subtotal - discount, shippingCents: 0, province: 'MB', date: created.toISOString().slice(0, 10) },
      rates,
      { gstHstRegistered: true, provincialRegistrations: ['MB'], provincialTaxOnShipping: { MB: true } },
    );
    const tax = taxes.reduce((s, t) => s + t.amountCents, 0);
    const [o] = await knex('shop_orders')
      .insert({
        user_id: d.user.id,
        email: d.user.email,
        status: d.status,
        ship_name: d.user.display_name,
        ship_country: 'CA',
        ship_province: 'MB',
        shipping_method_id: pickup.id,
        shipping_code: 'pickup',
        shipping_name: pickup.name,
        tax_jurisdiction: 'MB',
        priced_on: created.toISOString().slice(0, 10),
        weight_grams: (v.weight_grams ?? p.weight_grams) * d.qty,
        discount_percent: d.member ? 10 : 0,
        subtotal_cents: subtotal,
        discount_cents: discount,
        shipping_cents: 0,
        tax_cents: tax,
        total_cents: subtotal - discount + tax,
        // Paid at a launch table, not through the card processor (the local fake forgets its charges on restart).
        paid_outside_processor: true,
        paid_at: created,
        created_at: created,
        ...(d.status === 'shipped'
          ? { carrier: 'Hand delivered', tracking_number: 'LAUNCH-DAY', shipped_at: created, packed_at: created }
          : {}),
        ...(d.status === 'packed' ? { packed_at: created } : {}),
      })
      .returning('id');
    await knex('shop_order_items').insert({
      order_id: o.id,
      variant_id: v.id,
      run_id: d.runId,
      product_name: p.name,
      variant_label: v.label,
      sku: v.sku,
      unit_price_cents: unit,
      quantity: d.qty,
    });
    if (taxes.length)
      await knex('shop_order_taxes').insert(
        taxes.map((t) => ({
          order_id: o.id,
          code: t.code,
          jurisdiction: t.jurisdiction,
          rate_percent: t.ratePercent,
          taxable_cents: t.taxableCents,
          amount_cents: t.amountCents,
        })),
      );
    // The books see the launch-table payment like any other, with its tax lines and no processor fee.
    const number = (await knex('shop_orders').where('id', o.id).first('number')).number;
    await knex.transaction((trx) =>
      recordMovement(trx, {
        occurredAt: created,
        kind: 'order_payment',
        source: 'merch',
        reference: number,
        counterparty: d.user.email,
        grossCents: subtotal - discount + tax,
        method: 'other',
        idempotencyKey: `shop-payment-${o.id}`,
        taxes: taxes.map((t) => ({
          code: t.code,
          jurisdiction: t.jurisdiction,
          ratePercent: t.ratePercent,
          taxableCents: t.taxableCents,
          taxCents: t.amountCents,
        })),
      }),
    );
    if (d.runId === run3.id) await knex('shop_runs').where('id', run3.id).increment('reserved', d.qty);
    if (!d.runId) await knex('shop_variants').where('id', v.id).decrement('stock_on_hand', d.qty);
  }
}

async function product(
  knex: Knex,
  row: Record<string, unknown>,
  variants: {
    label: string;
    sku: string;
    weight_grams: number | null;
    price_cents: number | null;
    stock_on_hand: number | null;
  }[],
): Promise<{ id: number }> {
  const [p] = await knex('shop_products').insert(row).returning('id');
  await knex('shop_variants').insert(variants.map((v, i) => ({ ...v, product_id: p.id, position: i })));
  return { id: Number(p.id) };
}
