import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type Stripe from 'stripe';
import { recordMovement } from '../books/ledger-writer';
import { enqueueEmail } from '../mail/outbox';
import type { Clock } from '../platform/clock';
import type { OrderRepository } from './order-repository';
import type { OrderBundle } from './order-rows';
import { shareProcessorRefund } from './refund-arithmetic';
import type { RefundRepository, ShopRefundRow } from './refund-repository';
import { refundableOrder } from './refund-request';
import { refundEmail } from './shop-emails';
import type { StockRepository } from './stock-repository';

/**
 * What a refund's outcome moves, always in a transaction holding the order's row lock: the claim's state, the order's
 * running total, the restock of exactly the refunded lines, the negative money movement with each tax, and the notice.
 */
export class RefundSettlement {
  constructor(
    private readonly db: Knex,
    private readonly orders: OrderRepository,
    private readonly stock: StockRepository,
    private readonly refunds: RefundRepository,
    private readonly clock: Clock,
    private readonly log: Logger,
    private readonly teamName: string,
  ) {}

  /** Settles a claim as failed under its order's lock (the processor refused, or never got the request). */
  async settleFailed(refundId: number, message: string): Promise<void> {
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

  /** Settles a claim as made under its order's lock, with everything a made refund moves. */
  async settleSucceeded(refundId: number, processorRefundId: string): Promise<void> {
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

  /** Settles a claim the processor shows as refunded (correcting one marked failed) and moves what a made refund moves. */
  async recordRefundedByProcessor(trx: Knex.Transaction, refundId: number, processorRefundId: string): Promise<void> {
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

  /** Records a refund made at the processor that Padside never claimed, capped at what the order has left. */
  async recordProcessorOrigin(trx: Knex.Transaction, b: OrderBundle, pr: Stripe.Refund): Promise<void> {
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
}
