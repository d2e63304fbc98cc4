import type { Knex } from 'knex';
import Stripe from 'stripe';
import { recordMovement } from '../books/ledger-writer';
import { enqueueEmail } from '../mail/outbox';
import type { PaymentGateway } from '../payments/payment-gateway';
import { AppError, badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import { formatCad } from '../platform/money';
import type { OrderLinks } from './order-links';
import type { OrderBundle, OrderRepository } from './order-repository';
import { shareProportionally } from './pricing';
import { refundEmail, shippedEmail } from './shop-emails';

/** Packing, shipping and refunds: staff work on paid orders. */
export class FulfilmentService {
  constructor(
    private readonly db: Knex,
    private readonly orders: OrderRepository,
    private readonly payments: PaymentGateway,
    private readonly clock: Clock,
    private readonly links: OrderLinks,
  ) {}

  async pack(id: number): Promise<OrderBundle> {
    await this.mustExist(id);
    if (!(await this.orders.transition(this.db, id, ['paid'], { status: 'packed', packed_at: this.clock.now() }))) throw conflict('wrong_status', 'Only a paid order can be marked packed.');
    return (await this.orders.find(id))!;
  }

  /** Marks shipped with carrier and tracking and queues the shipped notice, together. */
  async ship(id: number, carrier: string, trackingNumber: string): Promise<OrderBundle> {
    await this.mustExist(id);
    await this.db.transaction(async (trx) => {
      if (!(await this.orders.transition(trx, id, ['paid', 'packed'], { status: 'shipped', shipped_at: this.clock.now(), carrier, tracking_number: trackingNumber }))) {
        throw conflict('wrong_status', 'Only a paid or packed order can be shipped.');
      }
      const shipped = (await this.orders.find(id, trx))!;
      await enqueueEmail(trx, shippedEmail(shipped, this.links.urlFor(shipped.order.id, shipped.order.email)));
    });
    return (await this.orders.find(id))!;
  }

  /**
   * Refunds part or all of a card payment through the processor, then records it (with the tax share) and queues
   * the notice in one transaction. The key ties a retried click to the same processor refund.
   */
  async refund(id: number, amountCents: number, restock: boolean, staffId: number): Promise<OrderBundle> {
    const b = await this.mustExist(id);
    const o = b.order;
    if (!['paid', 'packed', 'shipped'].includes(o.status)) throw conflict('wrong_status', 'Only a paid order can be refunded.');
    if (!o.charge_id) throw conflict('not_processor_paid', 'This order was not paid by card through the processor; refund it by hand and note it in the books.');
    const left = o.total_cents - o.refunded_cents;
    if (amountCents < 1 || amountCents > left) throw badRequest('That refund is larger than what is left to refund.', { amountCents: `Enter between ${formatCad(1)} and ${formatCad(left)}.` });
    let refund: Stripe.Refund;
    try {
      refund = await this.payments.refund(o.charge_id, amountCents, `padside-refund-${id}-${o.refunded_cents}-${amountCents}`);
    } catch (err) {
      if (err instanceof Stripe.errors.StripeInvalidRequestError) throw conflict('processor_refused', `The payment processor refused the refund: ${err.message}`);
      throw new AppError(502, 'processor_unreachable', 'The payment processor did not answer; nothing was refunded. Try again shortly.');
    }
    await this.db.transaction(async (trx) => {
      const fresh = (await this.orders.find(id, trx, true))!;
      if (fresh.order.refunded_cents !== o.refunded_cents) return; // a concurrent click already recorded this one
      await this.recordRefund(trx, fresh, amountCents, restock, refund.id, 'staff', staffId);
    });
    return (await this.orders.find(id))!;
  }

  /** Writes one refund: the order's running total, optional restock, the negative movement and the notice. */
  async recordRefund(trx: Knex.Transaction, b: OrderBundle, amountCents: number, restock: boolean, processorRefundId: string | null, origin: 'staff' | 'processor', staffId: number | null): Promise<void> {
    const now = this.clock.now();
    const refundId = await this.orders.insertRefund(trx, { orderId: b.order.id, amountCents, restocked: restock, processorRefundId, origin, createdBy: staffId, now });
    await this.orders.update(trx, b.order.id, { refunded_cents: b.order.refunded_cents + amountCents });
    if (restock) {
      await this.orders.release(trx, b.items.map((i) => ({ variantId: i.variant_id, runId: i.run_id, quantity: i.quantity - i.restocked_quantity })));
      await this.orders.markRestocked(trx, b.order.id);
    }
    // The refund carries tax in proportion to the order's total (each tax's share of the total, largest remainder).
    const taxShares = shareProportionally(amountCents, [...b.taxes.map((t) => t.amount_cents), b.order.total_cents - b.order.tax_cents]);
    await recordMovement(trx, {
      occurredAt: now,
      kind: 'refund',
      source: 'merch',
      reference: b.order.number,
      counterparty: b.order.email,
      grossCents: -amountCents,
      processorChargeId: b.order.charge_id,
      method: 'card',
      idempotencyKey: `shop-refund-${refundId}`,
      taxes: b.taxes.map((t, i) => ({ code: t.code, jurisdiction: t.jurisdiction, ratePercent: t.rate_percent, taxableCents: -shareProportionally(amountCents, [t.taxable_cents, Math.max(0, b.order.total_cents - t.taxable_cents)])[0], taxCents: -taxShares[i] })),
    });
    const after = (await this.orders.find(b.order.id, trx))!;
    await enqueueEmail(trx, refundEmail(after, refundId, amountCents));
  }

  private async mustExist(id: number): Promise<OrderBundle> {
    const b = await this.orders.find(id);
    if (!b) throw notFound('No such order.');
    return b;
  }
}
