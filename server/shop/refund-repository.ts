import type { Knex } from 'knex';
import type { RefundBreakdown } from './refund-arithmetic';
import { taxKey } from './refund-arithmetic';

export type RefundState = 'requested' | 'succeeded' | 'failed';

/** One shop refund with its parts. */
export interface ShopRefundRow {
  id: number;
  order_id: number;
  state: RefundState;
  origin: 'staff' | 'processor';
  amount_cents: number;
  goods_cents: number;
  shipping_cents: number;
  tax_cents: number;
  restocked: boolean;
  idempotency_key: string;
  request_key: string | null;
  request_hash: string | null;
  processor_refund_id: string | null;
  reason: string | null;
  failure_message: string | null;
  created_by: number | null;
  created_at: Date;
  settled_at: Date | null;
}

export interface RefundLineRow {
  refund_id: number;
  order_item_id: number;
  quantity: number;
  goods_cents: number;
}

export interface RefundTaxRow {
  refund_id: number;
  code: 'GST' | 'HST' | 'PST' | 'QST' | 'RST';
  jurisdiction: string;
  rate_percent: string;
  taxable_cents: number;
  tax_cents: number;
}

/** What refunds gave back (or hold as claimed) on one order, per part and per line. */
export interface RefundedSoFar {
  goodsCents: number;
  shippingCents: number;
  totalCents: number;
  taxCents: Record<string, number>;
  quantities: Map<number, number>;
}

const fixRefund = (r: Record<string, unknown>): ShopRefundRow => ({
  ...(r as unknown as ShopRefundRow),
});

/** Shop refunds: claims, outcomes, lines and tax lines. The caller holds the order's row lock when it writes. */
export class RefundRepository {
  constructor(private readonly db: Knex) {}

  /**
   * Records a refund claim with its lines and taxes; a staff refund is claimed before the processor is asked, so a
   * crash leaves a claim to settle rather than money moved unseen.
   */
  async insertClaim(
    trx: Knex.Transaction,
    r: {
      orderId: number;
      origin: 'staff' | 'processor';
      state: RefundState;
      idempotencyKey: string;
      requestKey: string | null;
      requestHash: string | null;
      processorRefundId: string | null;
      restock: boolean;
      reason: string | null;
      createdBy: number | null;
      now: Date;
    },
    b: RefundBreakdown,
  ): Promise<number> {
    const [row] = await trx('shop_refunds')
      .insert({
        order_id: r.orderId,
        origin: r.origin,
        state: r.state,
        amount_cents: b.totalCents,
        goods_cents: b.goodsCents,
        shipping_cents: b.shippingCents,
        tax_cents: b.taxCents,
        restocked: r.restock,
        idempotency_key: r.idempotencyKey,
        request_key: r.requestKey,
        request_hash: r.requestHash,
        processor_refund_id: r.processorRefundId,
        reason: r.reason,
        created_by: r.createdBy,
        created_at: r.now,
        settled_at: r.state === 'requested' ? null : r.now,
      })
      .returning('id');
    const id = row.id;
    if (b.lines.length)
      await trx('shop_refund_lines').insert(
        b.lines.map((l) => ({
          refund_id: id,
          order_item_id: l.orderItemId,
          quantity: l.quantity,
          goods_cents: l.goodsCents,
        })),
      );
    const taxes = b.taxes.filter((t) => t.taxCents !== 0 || t.taxableCents !== 0);
    if (taxes.length)
      await trx('shop_refund_taxes').insert(
        taxes.map((t) => ({
          refund_id: id,
          code: t.code,
          jurisdiction: t.jurisdiction,
          rate_percent: t.ratePercent,
          taxable_cents: t.taxableCents,
          tax_cents: t.taxCents,
        })),
      );
    return id;
  }

  /** Moves a claim out of `requested`; returns false when another request already settled it. */
  async settle(
    trx: Knex.Transaction,
    id: number,
    patch: { state: 'succeeded' | 'failed'; processor_refund_id?: string; failure_message?: string; settled_at: Date },
  ): Promise<boolean> {
    return (await trx('shop_refunds').where({ id, state: 'requested' }).update(patch)) === 1;
  }

  /** A refund recorded as failed that the processor in fact made (its answer was lost): true when it moved. */
  async settleFailedAsSucceeded(
    trx: Knex.Transaction,
    id: number,
    patch: { processor_refund_id: string; settled_at: Date },
  ): Promise<boolean> {
    return (
      (await trx('shop_refunds')
        .where({ id, state: 'failed' })
        .update({ ...patch, state: 'succeeded', failure_message: null })) === 1
    );
  }

  /** One refund by id. */
  async byId(id: number, db: Knex = this.db): Promise<ShopRefundRow | null> {
    const row = await db('shop_refunds').where('id', id).first();
    return row ? fixRefund(row) : null;
  }

  /** The refund a client's Idempotency-Key already asked for on this order, so a retry answers the first refund. */
  async byRequestKey(orderId: number, requestKey: string, db: Knex = this.db): Promise<ShopRefundRow | null> {
    const row = await db('shop_refunds').where({ order_id: orderId, request_key: requestKey }).first();
    return row ? fixRefund(row) : null;
  }

  /** Every refund of one order, oldest first. */
  async forOrder(orderId: number, db: Knex = this.db): Promise<ShopRefundRow[]> {
    return (await db('shop_refunds').where('order_id', orderId).orderBy('id')).map(fixRefund);
  }

  /** The refunded units of these refunds, by refund and order line. */
  async lines(refundIds: number[], db: Knex = this.db): Promise<RefundLineRow[]> {
    if (!refundIds.length) return [];
    return await db('shop_refund_lines').whereIn('refund_id', refundIds).orderBy(['refund_id', 'order_item_id']);
  }

  /** The refunded tax of these refunds, by refund and tax code. */
  async taxes(refundIds: number[], db: Knex = this.db): Promise<RefundTaxRow[]> {
    if (!refundIds.length) return [];
    return (await db('shop_refund_taxes').whereIn('refund_id', refundIds).orderBy(['refund_id', 'code'])).map((t) => ({
      ...t,
      rate_percent: String(t.rate_percent),
    }));
  }

  /** What refunds in the given states gave back (or claim) on one order. */
  async soFar(orderId: number, states: RefundState[], db: Knex = this.db): Promise<RefundedSoFar> {
    const refunds = (await this.forOrder(orderId, db)).filter((r) => states.includes(r.state));
    const ids = refunds.map((r) => r.id);
    const taxCents: Record<string, number> = {};
    for (const t of await this.taxes(ids, db)) taxCents[taxKey(t)] = (taxCents[taxKey(t)] ?? 0) + t.tax_cents;
    const quantities = new Map<number, number>();
    for (const l of await this.lines(ids, db))
      quantities.set(l.order_item_id, (quantities.get(l.order_item_id) ?? 0) + l.quantity);
    const add = (k: 'goods_cents' | 'shipping_cents' | 'amount_cents') => refunds.reduce((s, r) => s + r[k], 0);
    return {
      goodsCents: add('goods_cents'),
      shippingCents: add('shipping_cents'),
      totalCents: add('amount_cents'),
      taxCents,
      quantities,
    };
  }

  /** Claims still waiting for the processor's answer since before `before`. */
  async staleClaims(before: Date): Promise<ShopRefundRow[]> {
    return (
      await this.db('shop_refunds')
        .where('state', 'requested')
        .where('created_at', '<', before)
        .orderBy('id')
        .limit(100)
    ).map(fixRefund);
  }

  /**
   * Marks `quantity` units of each line restocked (never more than the line had left); returns the units to give back
   * to their run or stock.
   */
  async markLinesRestocked(
    trx: Knex.Transaction,
    lines: { orderItemId: number; quantity: number }[],
  ): Promise<{ variantId: number; runId: number | null; quantity: number }[]> {
    const back: { variantId: number; runId: number | null; quantity: number }[] = [];
    for (const l of [...lines].sort((a, b) => a.orderItemId - b.orderItemId)) {
      const item = await trx('shop_order_items')
        .where('id', l.orderItemId)
        .first('quantity', 'restocked_quantity', 'variant_id', 'run_id');
      const add = Math.min(l.quantity, item.quantity - item.restocked_quantity);
      if (add <= 0) continue;
      await trx('shop_order_items').where('id', l.orderItemId).increment('restocked_quantity', add);
      back.push({
        variantId: item.variant_id,
        runId: item.run_id,
        quantity: add,
      });
    }
    return back;
  }
}
