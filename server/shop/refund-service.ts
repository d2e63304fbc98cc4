import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import Stripe from 'stripe';
import type { PaymentGateway } from '../payments/payment-gateway';
import { AppError, badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import { RECONCILE_AFTER_MS } from './checkout-service';
import type { OrderRepository } from './order-repository';
import type { OrderBundle } from './order-rows';
import { computeRefund, type RefundBreakdown } from './refund-arithmetic';
import type { RefundedSoFar, RefundRepository, ShopRefundRow } from './refund-repository';
import { refundableOrder, requestHash, type RefundRequest } from './refund-request';
import { RefundSettlement } from './refund-settlement';
import type { StockRepository } from './stock-repository';

/** The order with the refund a request came to. */
export interface RefundOutcome {
  bundle: OrderBundle;
  refund: ShopRefundRow;
}

const REFUNDABLE = ['paid', 'packed', 'shipped'];
// A claim older than this has outlived any processor call that could still answer (common practice, no source).
const STALE_CLAIM_MS = RECONCILE_AFTER_MS;

/**
 * Card refunds of shop orders, claimed before the processor is asked so Padside and the processor never disagree:
 * claim (order row locked, still-refundable amount checked, `requested` row with its own key), call, record.
 */
export class RefundService {
  private readonly settlement: RefundSettlement;

  constructor(
    private readonly db: Knex,
    private readonly orders: OrderRepository,
    stock: StockRepository,
    private readonly refunds: RefundRepository,
    private readonly payments: PaymentGateway,
    private readonly clock: Clock,
    private readonly log: Logger,
    teamName: string,
  ) {
    this.settlement = new RefundSettlement(db, orders, stock, refunds, clock, log, teamName);
  }

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
            replay: earlier.request_hash === requestHash(ask) ? true : null,
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
          requestHash: requestHash(ask),
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
        await this.settlement.settleFailed(r.id, err.message);
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
    await this.settlement.settleSucceeded(r.id, processorRefund.id);
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
          if (claim.state !== 'succeeded') await this.settlement.recordRefundedByProcessor(trx, claim.id, pr.id);
          continue;
        }
        await this.settlement.recordProcessorOrigin(trx, b, pr);
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
      if (found) await this.settlement.settleSucceeded(claim.id, found.id);
      else await this.settlement.settleFailed(claim.id, 'No refund reached the processor; the claim was released.');
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

  private async mustExist(id: number): Promise<OrderBundle> {
    const b = await this.orders.find(id);
    if (!b) throw notFound('No such order.');
    return b;
  }
}
