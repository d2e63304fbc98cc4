import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { recordMovement } from '../books/ledger-writer';
import { estimateFeeCents, PROCESSOR_FEES } from '../books/processor-fees';
import { enqueueEmail } from '../mail/outbox';
import type { PaymentGateway } from '../payments/payment-gateway';
import { AppError, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { SessionUser } from '../platform/roles';
import type { SettingsService } from '../settings/settings-service';
import type { OrderGuide } from './order-guide';
import type { OrderLinks } from './order-links';
import type { OrderRepository } from './order-repository';
import type { OrderBundle } from './order-rows';
import type { OrderRequest } from '../../contracts/shop/shop-schemas';
import type { StockRepository } from './stock-repository';
import type { QuoteService } from './quote-service';
import type { ReceiptService } from './receipt-service';
import { confirmationEmail } from './shop-emails';

/** How long a payment attempt may stay unanswered before reconciliation settles it (common practice, no source). */
export const RECONCILE_AFTER_MS = 10 * 60_000;

/** What a payment attempt came to, for the buyer. */
export type PaymentOutcome = { status: 'paid' | 'pending'; bundle: OrderBundle; message?: string };

/** Reserve units, charge once, settle: the only way an order gets paid. */
export class CheckoutService {
  constructor(
    private readonly db: Knex,
    private readonly orders: OrderRepository,
    private readonly stock: StockRepository,
    private readonly quotes: QuoteService,
    private readonly payments: PaymentGateway,
    private readonly settings: SettingsService,
    private readonly clock: Clock,
    private readonly links: OrderLinks,
    private readonly teamName: string,
    private readonly log: Logger,
    private readonly receipts: ReceiptService,
    private readonly guide: OrderGuide,
  ) {}

  /**
   * Quotes, reserves the units and claims the first payment attempt in one transaction (409 sold_out when they no
   * longer fit), then charges, outside any transaction.
   */
  async placeOrder(req: OrderRequest, user: SessionUser | null): Promise<PaymentOutcome> {
    const now = this.clock.now();
    const quote = await this.quotes.quote(req, user?.roles ?? [], now);
    const { id, number } = await this.db.transaction(async (trx) => {
      const created = await this.orders.insert(trx, quote, req, user?.id ?? null, now);
      if (!(await this.stock.reserve(trx, quote.lines, now)))
        throw conflict('sold_out', 'Someone got there first: part of the cart just sold out.');
      return created;
    });
    return this.charge({ id, number, totalCents: quote.totalCents }, 1, req.paymentToken);
  }

  /**
   * One payment attempt on a pending order. A later attempt first looks for a charge an earlier one may have
   * made, so a retry never charges twice; each attempt has its own idempotency key tied to the order.
   */
  async pay(orderId: number, token: string): Promise<PaymentOutcome> {
    const before = await this.orders.find(orderId);
    if (!before) throw notFound('No such order.');
    if (before.order.status === 'paid' || before.order.status === 'packed' || before.order.status === 'shipped')
      return { status: 'paid', bundle: before };
    if (before.order.status !== 'pending')
      throw conflict('order_closed', 'This order was not paid and its units were released. Start a new order.');
    if (before.order.payment_attempts > 0) {
      const earlier = await this.payments.findCharge('orderId', String(orderId));
      if (earlier) return { status: 'paid', bundle: await this.settlePaid(orderId, earlier.id, earlier.amount, null) };
    }
    // Claiming the attempt number only from the value just read means two clicks at once cannot both charge.
    const claimed = await this.db.transaction((trx) =>
      this.orders.claimPaymentAttempt(trx, orderId, before.order.payment_attempts, this.clock.now()),
    );
    if (claimed === null)
      throw conflict(
        'payment_in_progress',
        'A payment for this order is already under way; reload the order in a moment.',
      );
    return this.charge(
      { id: orderId, number: before.order.number, totalCents: before.order.total_cents },
      claimed,
      token,
    );
  }

  /** Charges the attempt already claimed and settles what came of it. */
  private async charge(
    order: { id: number; number: string; totalCents: number },
    attempt: number,
    token: string,
  ): Promise<PaymentOutcome> {
    const result = await this.payments.charge({
      amountCents: order.totalCents,
      token,
      description: `Padside order ${order.number}`,
      idempotencyKey: `padside-order-${order.id}-attempt-${attempt}`,
      metadata: { orderId: String(order.id), orderNumber: order.number },
    });
    if (result.outcome === 'paid')
      return {
        status: 'paid',
        bundle: await this.settlePaid(order.id, result.chargeId, result.amountCents, result.cardCountry),
      };
    if (result.outcome === 'declined') {
      await this.settleFailed(order.id, result.message);
      throw new AppError(402, 'payment_declined', result.message, { paymentToken: result.message });
    }
    this.log.warn({ orderId: order.id, message: result.message }, 'payment outcome unknown; order left pending');
    await this.db.transaction((trx) => this.orders.update(trx, order.id, { payment_message: result.message }));
    return {
      status: 'pending',
      bundle: (await this.orders.find(order.id))!,
      message: 'We could not confirm the payment. Nothing is lost: try again, and you will never be charged twice.',
    };
  }

  /**
   * Marks the order paid once, records the money movement and queues the confirmation, in one transaction; returns
   * the order as that transaction left it (read once), or as it stands when another path settled it first.
   */
  async settlePaid(
    orderId: number,
    chargeId: string,
    amountCents: number,
    cardCountry: string | null,
  ): Promise<OrderBundle> {
    const [fees, seller] = await Promise.all([this.settings.get(PROCESSOR_FEES), this.receipts.seller()]);
    const now = this.clock.now();
    const settled = await this.db.transaction(async (trx) => {
      const b = await this.orders.transitionFromPending(trx, orderId, {
        status: 'paid',
        charge_id: chargeId,
        paid_at: now,
        payment_message: null,
      });
      if (!b) return null;
      await recordMovement(trx, {
        occurredAt: now,
        kind: 'order_payment',
        source: 'merch',
        reference: b.order.number,
        counterparty: b.order.email,
        grossCents: amountCents,
        feeCents: estimateFeeCents(amountCents, cardCountry !== null && cardCountry !== 'CA', fees),
        feeEstimated: true,
        processorChargeId: chargeId,
        method: 'card',
        idempotencyKey: `shop-payment-${orderId}`,
        taxes: b.taxes.map((t) => ({
          code: t.code,
          jurisdiction: t.jurisdiction,
          ratePercent: t.rate_percent,
          taxableCents: t.taxable_cents,
          taxCents: t.amount_cents,
        })),
      });
      await enqueueEmail(
        trx,
        confirmationEmail(
          b,
          this.links.urlFor(b.order.id, b.order.email),
          this.teamName,
          this.receipts.build(b, seller),
          await this.guide.nextSteps(b, trx),
        ),
      );
      return b;
    });
    return settled ?? (await this.orders.find(orderId))!;
  }

  /** Fails a pending order and gives its units back, once. */
  async settleFailed(orderId: number, message: string): Promise<void> {
    await this.db.transaction(async (trx) => {
      if (!(await this.orders.transition(trx, orderId, ['pending'], { status: 'failed', payment_message: message })))
        return;
      const b = (await this.orders.find(orderId, trx))!;
      await this.stock.release(
        trx,
        b.items.map((i) => ({ variantId: i.variant_id, runId: i.run_id, quantity: i.quantity })),
      );
    });
  }

  /** Settles pending orders whose last attempt went unanswered: paid if the processor has the charge, else released. */
  async reconcile(): Promise<{ paid: number; released: number }> {
    const ids = await this.orders.stalePending(new Date(this.clock.now().getTime() - RECONCILE_AFTER_MS));
    let paid = 0;
    let released = 0;
    for (const id of ids) {
      const charge = await this.payments.findCharge('orderId', String(id));
      if (charge) {
        await this.settlePaid(id, charge.id, charge.amount, null);
        paid++;
      } else {
        await this.settleFailed(id, 'No payment reached the processor; the units went back on sale.');
        released++;
      }
    }
    return { paid, released };
  }
}
