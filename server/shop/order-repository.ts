import type { Knex } from 'knex';
import type { OrderStatus } from '../../contracts/labels/order-statuses';
import type { OrderRequest } from '../../contracts/shop/shop-schemas';
import type { RunRow } from './catalogue-repository';
import {
  orderOf,
  type OrderBundle,
  type OrderItemRow,
  type OrderRow,
  type OrderTaxRow,
  type RefundRow,
} from './order-rows';
import type { PricedQuote } from './priced-quote';

/** Orders as plain rows; stock and run counts move only through the conditional updates here. */
export class OrderRepository {
  constructor(private readonly db: Knex) {}

  /**
   * Inserts a pending order from a quote with its first payment attempt already claimed (the charge follows the
   * commit); returns its id and number.
   */
  async insert(
    trx: Knex.Transaction,
    q: PricedQuote,
    req: Omit<OrderRequest, 'paymentToken'>,
    userId: number | null,
    now: Date,
  ): Promise<{ id: number; number: string }> {
    const [row] = await trx('shop_orders')
      .insert({
        payment_attempts: 1,
        last_attempt_at: now,
        user_id: userId,
        email: req.email,
        status: 'pending',
        ship_name: req.shipTo.name,
        ship_line1: req.shipTo.line1 || null,
        ship_line2: req.shipTo.line2 || null,
        ship_city: req.shipTo.city || null,
        ship_province: req.shipTo.province || null,
        ship_postal_code: req.shipTo.postalCode || null,
        ship_country: req.shipTo.country,
        shipping_method_id: q.shippingMethod.id,
        shipping_code: q.shippingMethod.code,
        shipping_name: q.shippingMethod.name,
        tax_jurisdiction: q.province,
        priced_on: q.pricedOn,
        weight_grams: q.weightGrams,
        discount_percent: q.discountPercent,
        subtotal_cents: q.subtotalCents,
        discount_cents: q.discountCents,
        shipping_cents: q.shippingCents,
        tax_cents: q.taxCents,
        total_cents: q.totalCents,
        created_at: now,
      })
      .returning(['id', 'number']);
    const id = row.id;
    await trx('shop_order_items').insert(
      q.lines.map((l) => ({
        order_id: id,
        variant_id: l.variantId,
        run_id: l.runId,
        product_name: l.productName,
        variant_label: l.variantLabel,
        sku: l.sku,
        unit_price_cents: l.unitPriceCents,
        quantity: l.quantity,
      })),
    );
    if (q.taxLines.length) {
      await trx('shop_order_taxes').insert(
        q.taxLines.map((t) => ({
          order_id: id,
          code: t.code,
          jurisdiction: t.jurisdiction,
          rate_percent: t.ratePercent,
          taxable_cents: t.taxableCents,
          amount_cents: t.amountCents,
        })),
      );
    }
    return { id, number: row.number };
  }

  /** Moves an order between statuses only from the expected one; returns whether it moved. */
  async transition(
    trx: Knex.Transaction,
    id: number,
    from: OrderStatus[],
    patch: Partial<OrderRow> & { status?: OrderStatus },
  ): Promise<boolean> {
    return (await trx('shop_orders').where('id', id).whereIn('status', from).update(patch)) === 1;
  }

  /**
   * Like `transition`, returning the order as it now stands with its lines and taxes (two reads fewer than `find`);
   * null when it was not in a `from` state. An order leaving `pending` has no refunds yet.
   */
  async transitionFromPending(
    trx: Knex.Transaction,
    id: number,
    patch: Partial<OrderRow> & { status: OrderStatus },
  ): Promise<OrderBundle | null> {
    const [row] = await trx('shop_orders')
      .where({ id, status: 'pending' })
      .update(patch)
      .returning(['*', trx.raw("to_char(priced_on, 'YYYY-MM-DD') as priced_on_text")]);
    if (!row) return null;
    const [items, taxes] = [await this.items(trx, id), await this.taxes(trx, id)];
    return { order: orderOf(row), items, taxes, refunds: [] };
  }

  /**
   * Claims the next payment attempt of a pending order, only if its attempt count is still `seen` (so two clicks at
   * once cannot both charge); returns the new attempt number, or null when the order moved on or another claim won.
   */
  async claimPaymentAttempt(trx: Knex.Transaction, id: number, seen: number, now: Date): Promise<number | null> {
    const [claimed] = await trx('shop_orders')
      .where({ id, status: 'pending', payment_attempts: seen })
      .update({ payment_attempts: trx.raw('payment_attempts + 1'), last_attempt_at: now })
      .returning('payment_attempts');
    return claimed ? Number(claimed.payment_attempts) : null;
  }

  /** Writes the given order columns in the caller's transaction. */
  async update(trx: Knex.Transaction, id: number, patch: Record<string, unknown>): Promise<void> {
    await trx('shop_orders').where('id', id).update(patch);
  }

  /** The order with its lines, taxes and refunds, unlocked; use `findLocked` before changing money on it. */
  async find(id: number, trx: Knex = this.db): Promise<OrderBundle | null> {
    return this.bundle(trx, await this.orderRow(trx, id));
  }

  /** The order, its row locked until `trx` ends, so refunds and their settlement of one order take turns. */
  async findLocked(trx: Knex.Transaction, id: number): Promise<OrderBundle | null> {
    return this.bundle(trx, await this.orderRow(trx, id).forUpdate());
  }

  private orderRow(trx: Knex, id: number) {
    return trx('shop_orders')
      .select('*', trx.raw("to_char(priced_on, 'YYYY-MM-DD') as priced_on_text"))
      .where('id', id)
      .first();
  }

  private async bundle(trx: Knex, row: Record<string, unknown> | undefined): Promise<OrderBundle | null> {
    if (!row) return null;
    const id = row.id as number;
    const items = await this.items(trx, id);
    const taxes = await this.taxes(trx, id);
    const refunds = await trx<RefundRow>('shop_refunds').where('order_id', id).orderBy('id');
    return { order: orderOf(row), items, taxes, refunds };
  }

  private async items(trx: Knex, orderId: number): Promise<OrderItemRow[]> {
    return trx<OrderItemRow>('shop_order_items').where('order_id', orderId).orderBy('id');
  }

  private async taxes(trx: Knex, orderId: number): Promise<OrderTaxRow[]> {
    return (await trx('shop_order_taxes').where('order_id', orderId).orderBy('code')).map((t) => ({
      ...t,
      rate_percent: String(t.rate_percent),
    }));
  }

  /** The id of the order a processor charge paid, so webhooks and refunds find their order. */
  async byChargeId(chargeId: string, trx: Knex = this.db): Promise<number | null> {
    const row = await trx('shop_orders').where('charge_id', chargeId).first('id');
    return row ? (row.id as number) : null;
  }

  /** The buyer's own orders; attempts whose payment failed were never orders to them, so they are left out. */
  async forUser(userId: number): Promise<OrderRow[]> {
    const rows = await this.db('shop_orders')
      .select('*', this.db.raw("to_char(priced_on, 'YYYY-MM-DD') as priced_on_text"))
      .where('user_id', userId)
      .whereNot('status', 'failed')
      .orderBy('created_at', 'desc')
      .limit(200);
    return rows.map(orderOf);
  }

  /** The runs an order has units in, oldest closing first. */
  async runsOf(orderId: number, trx: Knex = this.db): Promise<RunRow[]> {
    const rows = await trx('shop_runs as r')
      .whereIn('r.id', trx('shop_order_items').where('order_id', orderId).whereNotNull('run_id').select('run_id'))
      .select('r.*')
      .orderBy('r.closes_at')
      .orderBy('r.id');
    return rows;
  }

  /** Where the buyer's latest mailed order went (not a pickup, not a failed attempt), to offer it again. */
  async lastShipTo(userId: number): Promise<OrderRow | null> {
    const row = await this.db('shop_orders')
      .select('*', this.db.raw("to_char(priced_on, 'YYYY-MM-DD') as priced_on_text"))
      .where('user_id', userId)
      .whereNot('status', 'failed')
      .whereNot('shipping_code', 'pickup')
      .whereNotNull('ship_line1')
      .orderBy('created_at', 'desc')
      .orderBy('id', 'desc')
      .first();
    return row ? orderOf(row) : null;
  }

  /** Pending orders whose last payment attempt is older than `before`. */
  async stalePending(before: Date): Promise<number[]> {
    return (
      await this.db('shop_orders')
        .where('status', 'pending')
        .where((q) => q.where('last_attempt_at', '<', before).orWhereNull('last_attempt_at'))
        .orderBy('id')
        .limit(100)
        .pluck('id')
    ).map(Number);
  }

  /** Names of the runs this order still waits for: pre-order lines (not given back) whose run has not been printed. */
  async unprintedRuns(orderId: number, db: Knex = this.db): Promise<string[]> {
    return db('shop_order_items as i')
      .join('shop_runs as r', 'r.id', 'i.run_id')
      .where('i.order_id', orderId)
      .whereRaw('i.quantity > i.restocked_quantity')
      .whereNot('r.state', 'shipped')
      .distinct('r.id', 'r.name')
      .orderBy('r.id')
      .pluck('r.name');
  }
}
