import { createHash, randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import Stripe from 'stripe';
import { recordMovement } from '../books/ledger-writer';
import { enqueueEmail } from '../mail/outbox';
import type { PaymentGateway } from '../payments/payment-gateway';
import { AppError, badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import { RECONCILE_AFTER_MS } from './checkout-service';
import type { OrderBundle, OrderRepository } from './order-repository';
import type { StockRepository } from './stock-repository';
import {
  computeRefund,
  shareProcessorRefund,
  type RefundableOrder,
  type RefundAsk,
  type RefundBreakdown,
} from './refund-arithmetic';
import type { RefundedSoFar, RefundRepository, ShopRefundRow } from './refund-repository';
import { refundEmail } from './shop-emails';

/** A staff refund request: what to give back, whether the units go back on sale, and why. */
export interface RefundRequest extends RefundAsk {
  restock: boolean;
  reason: string | null;
}

/** The order with the refund a request came to. */
export interface RefundOutcome {
  bundle: OrderBundle;
  refund: ShopRefundRow;
}

const REFUNDABLE = ['paid', 'packed', 'shipped'];
// A claim older than this has outlived any processor call that could still answer (common practice, no source).
const STALE_CLAIM_MS = RECONCILE_AFTER_MS;

/** The order's figures and what refunds in `soFar` took, for the pure refund arithmetic. */
export function refundableOrder(b: OrderBundle, soFar: RefundedSoFar): RefundableOrder {
  const o = b.order;
  const goods = o.subtotal_cents - o.discount_cents;
  return {
    discountPercent: o.discount_percent,
    goodsCents: goods,
    shippingCents: o.shipping_cents,
    items: b.items.map((i) => ({
      id: i.id,
      unitPriceCents: i.unit_price_cents,
      quantity: i.quantity,
      refundedQuantity: soFar.quantities.get(i.id) ?? 0,
    })),
    taxes: b.taxes.map((t) => ({
      code: t.code,
      jurisdiction: t.jurisdiction,
      ratePercent: t.rate_percent,
      taxableCents: t.taxable_cents,
      amountCents: t.amount_cents,
      onShipping: o.shipping_cents > 0 && t.taxable_cents > goods,
    })),
    refunded: soFar,
  };
}

const hashOf = (r: RefundRequest) =>
  createHash('sha256')
    .update(
      JSON.stringify({
        l: [...r.lines].sort((a, b) => a.orderItemId - b.orderItemId),
        s: r.shipping,
        a: r.amountCents ?? null,
        r: r.restock,
      }),
    )
    .digest('hex');

/**
 * Card refunds of shop orders, claimed before the processor is asked so Padside and the processor never disagree:
 * claim (order row locked, still-refundable amount checked, `requested` row with its own key), call, record.
 */
export class RefundService {
  constructor(
    private readonly db: Knex,
    private readonly orders: OrderRepository,
    private readonly stock: StockRepository,
    private readonly refunds: RefundRepository,
    private readonly payments: PaymentGateway,
    private readonly clock: Clock,
    private readonly log: Logger,
    private readonly teamName: string,
  ) {}

  /** What the request would refund now, moving nothing. */
  async preview(orderId: number, ask: RefundRequest): Promise<RefundBreakdown> {
    const b = await this.mustExist(orderId);
    return this.compute(b, await this.refunds.soFar(orderId, ['requested', 'succeeded']), ask);
  }

  /**
   * Refunds through the processor. `requestKey` (the client's Idempotency-Key) makes a repeated request answer with
   * the first one's result instead of refunding again.
   */
  async refund(
    orderId: number,
    ask: RefundRequest,
    requestKey: string | null,
    staffId: number,
  ): Promise<RefundOutcome> {
    const claim = await this.db.transaction(async (trx) => {
      const b = await this.orders.findLocked(trx, orderId);
      if (!b) throw notFound('No such order.');
      if (requestKey) {
        const earlier = await this.refunds.byRequestKey(orderId, requestKey, trx);
        if (earlier)
          return {
            refund: earlier,
            chargeId: b.order.charge_id!,
            replay: earlier.request_hash === hashOf(ask) ? true : null,
          };
      }
      if (!REFUNDABLE.includes(b.order.status)) throw conflict('wrong_status', 'Only a paid order can be refunded.');
      if (!b.order.charge_id)
        throw conflict(
          'not_processor_paid',
          'This order was not paid by card through the processor; refund it by hand and note it in the books.',
        );
      const breakdown = this.compute(b, await this.refunds.soFar(orderId, ['requested', 'succeeded'], trx), ask);
      const id = await this.refunds.insertClaim(
        trx,
        {
          orderId,
          origin: 'staff',
          state: 'requested',
          idempotencyKey: `padside-shop-refund-${randomUUID()}`,
          requestKey,
          requestHash: hashOf(ask),
          processorRefundId: null,
          restock: ask.restock,
          reason: ask.reason,
          createdBy: staffId,
          now: this.clock.now(),
        },
        breakdown,
      );
      return { refund: (await this.refunds.byId(id, trx))!, chargeId: b.order.charge_id, replay: false };
    });
    if (claim.replay === null)
      throw conflict('request_key_reused', 'That Idempotency-Key was used for a different refund on this order.');
    if (claim.replay) return this.answerReplay(orderId, claim.refund);
    const r = claim.refund;
    let processorRefund: Stripe.Refund;
    try {
      processorRefund = await this.payments.refund(claim.chargeId, r.amount_cents, r.idempotency_key);
    } catch (err) {
      if (err instanceof Stripe.errors.StripeInvalidRequestError) {
        await this.settleFailed(r.id, err.message);
        throw conflict('processor_refused', `The payment processor refused the refund: ${err.message}`);
      }
      // The processor may or may not have refunded: the claim stays, and reconciliation settles it from the processor.
      this.log.warn(
        { orderId, refundId: r.id, message: (err as Error).message },
        'refund outcome unknown; claim left requested',
      );
      throw new AppError(
        502,
        'processor_unreachable',
        'The payment processor did not answer. The refund is held and will be settled from the processor shortly; do not refund it again.',
      );
    }
    await this.settleSucceeded(r.id, processorRefund.id);
    return { bundle: (await this.orders.find(orderId))!, refund: (await this.refunds.byId(r.id))! };
  }

  /** Records every refund the processor holds for the charge that Padside does not know yet; true if the charge is an order's. */
  async syncCharge(chargeId: string): Promise<boolean> {
    const orderId = await this.orders.byChargeId(chargeId);
    if (!orderId) return false;
    const held = (await this.payments.refundsOf(chargeId)).filter(
      (r) => r.status === 'succeeded' || r.status === 'pending',
    );
    await this.db.transaction(async (trx) => {
      const b = (await this.orders.findLocked(trx, orderId))!;
      const known = await this.refunds.forOrder(orderId, trx);
      for (const pr of held) {
        if (known.some((k) => k.processor_refund_id === pr.id)) continue;
        const claim = known.find((k) => k.idempotency_key === pr.metadata?.padsideRefundKey);
        if (claim) {
          if (claim.state !== 'succeeded') await this.recordRefundedByProcessor(trx, claim.id, pr.id);
          continue;
        }
        await this.recordProcessorOrigin(trx, b, pr);
      }
    });
    return true;
  }

  /** The reconciliation pass: settle claims whose answer never came, and pick up refunds made at the processor. */
  async reconcile(
    extraCharges: (chargeId: string) => Promise<boolean> = async () => false,
  ): Promise<{ settled: number; charges: number }> {
    let settled = 0;
    for (const claim of await this.refunds.staleClaims(new Date(this.clock.now().getTime() - STALE_CLAIM_MS))) {
      const b = (await this.orders.find(claim.order_id))!;
      const found = (await this.payments.refundsOf(b.order.charge_id!)).find(
        (pr) => pr.metadata?.padsideRefundKey === claim.idempotency_key,
      );
      if (found) await this.settleSucceeded(claim.id, found.id);
      else await this.settleFailed(claim.id, 'No refund reached the processor; the claim was released.');
      settled++;
    }
    let charges = 0;
    for (const chargeId of await this.payments.recentlyRefundedCharges()) {
      if ((await this.syncCharge(chargeId)) || (await extraCharges(chargeId))) charges++;
    }
    return { settled, charges };
  }

  private compute(b: OrderBundle, soFar: RefundedSoFar, ask: RefundRequest): RefundBreakdown {
    const result = computeRefund(refundableOrder(b, soFar), ask);
    if ('code' in result) {
      if (result.code === 'invalid_request') throw badRequest(result.message, result.fields);
      throw conflict(result.code, result.message, result.fields);
    }
    if (ask.restock && !result.lines.length)
      throw badRequest('Only refunded lines can go back on sale.', {
        restock: 'Tick the lines going back on sale, or leave restock off.',
      });
    return result;
  }

  private async answerReplay(orderId: number, r: ShopRefundRow): Promise<RefundOutcome> {
    if (r.state === 'requested')
      throw conflict('refund_in_progress', 'This refund is already under way; reload the order in a moment.');
    if (r.state === 'failed')
      throw conflict(
        'processor_refused',
        `The payment processor refused the refund: ${r.failure_message ?? 'no reason given'}`,
      );
    return { bundle: (await this.orders.find(orderId))!, refund: r };
  }

  private async settleFailed(refundId: number, message: string): Promise<void> {
    await this.db.transaction(async (trx) => {
      const r = (await this.refunds.byId(refundId, trx))!;
      await this.orders.findLocked(trx, r.order_id);
      await this.refunds.settle(trx, refundId, {
        state: 'failed',
        failure_message: message.slice(0, 400),
        settled_at: this.clock.now(),
      });
    });
  }

  private async settleSucceeded(refundId: number, processorRefundId: string): Promise<void> {
    await this.db.transaction(async (trx) => {
      const r = (await this.refunds.byId(refundId, trx))!;
      await this.orders.findLocked(trx, r.order_id);
      await this.recordSucceeded(trx, refundId, processorRefundId);
    });
  }

  /**
   * The outcome of a claim, under the order's lock: the order's running total, the restock of exactly the refunded
   * lines, the negative money movement with each tax, and the notice. A claim already settled is left alone.
   */
  private async recordSucceeded(trx: Knex.Transaction, refundId: number, processorRefundId: string): Promise<void> {
    if (
      await this.refunds.settle(trx, refundId, {
        state: 'succeeded',
        processor_refund_id: processorRefundId,
        settled_at: this.clock.now(),
      })
    )
      await this.applySucceeded(trx, refundId);
  }

  /** As `recordSucceeded`, for the processor's own record: a claim marked failed that it shows as refunded is corrected to succeeded. */
  private async recordRefundedByProcessor(
    trx: Knex.Transaction,
    refundId: number,
    processorRefundId: string,
  ): Promise<void> {
    const now = this.clock.now();
    const moved =
      (await this.refunds.settle(trx, refundId, {
        state: 'succeeded',
        processor_refund_id: processorRefundId,
        settled_at: now,
      })) ||
      (await this.refunds.settleFailedAsSucceeded(trx, refundId, {
        processor_refund_id: processorRefundId,
        settled_at: now,
      }));
    if (moved) await this.applySucceeded(trx, refundId);
  }

  /** What a refund that just became succeeded moves: the restock of its lines, the books and the notice. */
  private async applySucceeded(trx: Knex.Transaction, refundId: number): Promise<void> {
    const r = (await this.refunds.byId(refundId, trx))!;
    if (r.restocked) {
      const lines = await this.refunds.lines([refundId], trx);
      await this.stock.release(
        trx,
        await this.refunds.markLinesRestocked(
          trx,
          lines.map((l) => ({ orderItemId: l.order_item_id, quantity: l.quantity })),
        ),
      );
    }
    await this.book(trx, r);
  }

  private async recordProcessorOrigin(trx: Knex.Transaction, b: OrderBundle, pr: Stripe.Refund): Promise<void> {
    const settled = await this.refunds.soFar(b.order.id, ['succeeded'], trx);
    const left = b.order.total_cents - settled.totalCents;
    if (pr.amount > left)
      this.log.warn(
        { orderId: b.order.id, refund: pr.id, amount: pr.amount, left },
        'processor refunded more than Padside shows left; recording what is left',
      );
    const amount = Math.min(pr.amount, left);
    if (amount < 1) return;
    const parts = shareProcessorRefund(refundableOrder(b, settled), amount);
    const id = await this.refunds.insertClaim(
      trx,
      {
        orderId: b.order.id,
        origin: 'processor',
        state: 'succeeded',
        idempotencyKey: `padside-shop-refund-processor-${pr.id}`,
        requestKey: null,
        requestHash: null,
        processorRefundId: pr.id,
        restock: false,
        reason: 'Refunded at the payment processor',
        createdBy: null,
        now: this.clock.now(),
      },
      parts,
    );
    await this.book(trx, (await this.refunds.byId(id, trx))!);
  }

  /** The order's total, the ledger movement (with each tax) and the notice for one succeeded refund. */
  private async book(trx: Knex.Transaction, r: ShopRefundRow): Promise<void> {
    const b = (await this.orders.find(r.order_id, trx))!;
    await this.orders.update(trx, b.order.id, { refunded_cents: b.order.refunded_cents + r.amount_cents });
    const taxes = await this.refunds.taxes([r.id], trx);
    await recordMovement(trx, {
      occurredAt: this.clock.now(),
      kind: 'refund',
      source: 'merch',
      reference: b.order.number,
      counterparty: b.order.email,
      grossCents: -r.amount_cents,
      processorChargeId: b.order.charge_id,
      method: 'card',
      idempotencyKey: `shop-refund-${r.id}`,
      taxes: taxes.map((t) => ({
        code: t.code,
        jurisdiction: t.jurisdiction,
        ratePercent: t.rate_percent,
        taxableCents: -t.taxable_cents,
        taxCents: -t.tax_cents,
      })),
    });
    await enqueueEmail(
      trx,
      refundEmail((await this.orders.find(b.order.id, trx))!, r.id, r.amount_cents, this.teamName),
    );
  }

  private async mustExist(id: number): Promise<OrderBundle> {
    const b = await this.orders.find(id);
    if (!b) throw notFound('No such order.');
    return b;
  }
}
