import type { Knex } from 'knex';
import { deletedEmail, plainRecord, type DataSubject, type PersonalDataPart } from '../platform/personal-data';

/** The person's orders: their own, and guest orders placed with the account's e-mail once that e-mail is confirmed. */
function ordersOf(trx: Knex.Transaction, s: DataSubject): Knex.QueryBuilder {
  return trx('shop_orders').where((w) => {
    w.where('user_id', s.userId);
    if (s.emailVerified) w.orWhere('email', s.email);
  });
}

const ORDER_COLUMNS = [
  'id',
  'number',
  'email',
  'status',
  'ship_name',
  'ship_line1',
  'ship_line2',
  'ship_city',
  'ship_province',
  'ship_postal_code',
  'ship_country',
  'shipping_name',
  'subtotal_cents',
  'discount_cents',
  'shipping_cents',
  'tax_cents',
  'total_cents',
  'refunded_cents',
  'carrier',
  'tracking_number',
  'paid_at',
  'packed_at',
  'shipped_at',
  'created_at',
];

/**
 * Orders with their lines, taxes and refunds. On deletion an order keeps every amount (the books and the tax
 * authority need them) and its province and country (where the tax was owed); the name, e-mail, street address,
 * postal code and tracking number go. An order paid and not yet shipped holds the deletion: it still needs the address.
 */
export const shopPersonalData: PersonalDataPart = {
  async export(trx, subject) {
    const orders: (Record<string, unknown> & { id: string })[] = await ordersOf(trx, subject)
      .orderBy('created_at')
      .select(ORDER_COLUMNS);
    const ids = orders.map((o) => o.id);
    // One after another: queries on one transaction share its connection.
    const [items, taxes, refunds] = [
      await trx('shop_order_items')
        .whereIn('order_id', ids)
        .orderBy('id')
        .select('order_id', 'product_name', 'variant_label', 'sku', 'unit_price_cents', 'quantity'),
      await trx('shop_order_taxes')
        .whereIn('order_id', ids)
        .select('order_id', 'code', 'jurisdiction', 'rate_percent', 'taxable_cents', 'amount_cents'),
      await trx('shop_refunds')
        .whereIn('order_id', ids)
        .orderBy('id')
        .select(
          'order_id',
          'state',
          'amount_cents',
          'goods_cents',
          'shipping_cents',
          'tax_cents',
          'created_at',
          'settled_at',
        ),
    ];
    const of = <T extends { order_id: string }>(rows: T[], id: string) =>
      rows.filter((r) => r.order_id === id).map(({ order_id: _, ...rest }) => plainRecord(rest));
    return [
      {
        name: 'shop-orders',
        title: 'Orders',
        purpose: 'Merch you ordered: what, where it went, what you paid and any refund. Kept for the books.',
        records: orders.map((o) => ({
          ...plainRecord(o),
          lines: of(items, o.id),
          taxes: of(taxes, o.id),
          refunds: of(refunds, o.id),
        })),
      },
    ];
  },

  async holds(trx, subject) {
    const open: { number: string }[] = await ordersOf(trx, subject)
      .whereIn('status', ['paid', 'packed'])
      .orderBy('created_at')
      .select('number');
    const refunding: { number: string }[] = await ordersOf(trx, subject)
      .whereExists((q) =>
        q.from('shop_refunds as r').whereRaw('r.order_id = shop_orders.id').where('r.state', 'requested'),
      )
      .select('number');
    return [
      ...open.map((o) => `Order ${o.number} is still to be sent or handed over.`),
      ...refunding.map((o) => `A refund of order ${o.number} is still being processed.`),
    ];
  },

  async erase(trx, subject) {
    const numbers: string[] = (await ordersOf(trx, subject).select('number')).map((o: { number: string }) => o.number);
    if (!numbers.length) return;
    await trx('money_movements')
      .where('source', 'merch')
      .whereIn('reference', numbers)
      .update({ counterparty: subject.marker });
    await trx('shop_orders')
      .whereIn('number', numbers)
      .update({
        user_id: subject.userId,
        email: deletedEmail(subject.userId),
        ship_name: subject.marker,
        ship_line1: null,
        ship_line2: null,
        ship_city: null,
        ship_postal_code: null,
        tracking_number: null,
      });
  },
};
