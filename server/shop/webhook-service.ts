import type { Knex } from 'knex';
import Stripe from 'stripe';
import { enqueueEmail } from '../mail/outbox';
import type { PaymentGateway } from '../payments/payment-gateway';
import type { Clock } from '../platform/clock';
import type { SettingsService } from '../settings/settings-service';
import { AppError, badRequest } from '../platform/app-error';
import type { OrderRepository } from './order-repository';
import type { PaymentEventRepository } from './payment-event-repository';
import type { RefundService } from './refund-service';
import { disputeEmail } from './shop-emails';
import { SHOP_SETTINGS } from './shop-settings';

const REFUSALS = {
  unsigned: 'Missing or unsigned event.',
  future: 'The event signature timestamp is in the future.',
  mismatch: 'The event signature does not match.',
} as const;

/** The processor's events: each handled once, in the same transaction that records it as seen. */
export class WebhookService {
  constructor(
    private readonly db: Knex,
    /** Who checks an event's signature, and the secret it was signed with. */
    private readonly processor: { gateway: PaymentGateway; secret: string },
    private readonly events: PaymentEventRepository,
    private readonly orders: OrderRepository,
    private readonly refunds: RefundService,
    private readonly settings: SettingsService,
    private readonly clock: Clock,
    /** Charges of other features (dues): returns true when it knew the charge. */
    private readonly otherCharges: (chargeId: string) => Promise<boolean> = async () => false,
  ) {}

  /**
   * Takes an event as the processor sent it: refuses it unless its signature holds, and returns false for a replay.
   * The system clock judges the timestamp, as the SDK's own check of old timestamps does: both bounds then agree.
   */
  async receive(payload: unknown, signature: string | undefined): Promise<boolean> {
    if (!Buffer.isBuffer(payload)) throw badRequest(REFUSALS.unsigned);
    const verified = this.processor.gateway.signedEvent(
      payload,
      signature,
      this.processor.secret,
      Math.floor(Date.now() / 1000),
    );
    if ('refused' in verified) throw badRequest(REFUSALS[verified.refused]);
    return this.handle(verified.event);
  }

  /**
   * Returns false for a replay (already handled). A refund event is answered from the processor's own list of the
   * charge's refunds (read before the transaction, never inside it), so a refund is recorded once whichever of the
   * staff request, this event or reconciliation sees it first.
   */
  private async handle(event: Stripe.Event): Promise<boolean> {
    if (await this.events.seen(event.id)) return false;
    if (event.type === 'charge.refunded') await this.chargeRefunded(event.data.object);
    return this.db.transaction(async (trx) => {
      if (!(await this.events.record(trx, event, this.clock.now()))) return false;
      if (event.type === 'charge.dispute.created') await this.disputeCreated(trx, event.data.object);
      return true;
    });
  }

  /** A refund made outside Padside (the processor dashboard): record whatever the processor holds that Padside does not. */
  private async chargeRefunded(charge: Stripe.Charge): Promise<void> {
    try {
      if (!(await this.refunds.syncCharge(charge.id))) await this.otherCharges(charge.id);
    } catch (err) {
      // Not recorded as seen: the processor sends the event again later.
      if (err instanceof Stripe.errors.StripeError)
        throw new AppError(
          503,
          'processor_unreachable',
          'The payment processor could not be asked for the refunds; send the event again later.',
        );
      throw err;
    }
  }

  private async disputeCreated(trx: Knex.Transaction, dispute: Stripe.Dispute): Promise<void> {
    const chargeId = typeof dispute.charge === 'string' ? dispute.charge : dispute.charge.id;
    const id = await this.orders.byChargeId(chargeId, trx);
    if (!id) return;
    await this.orders.update(trx, id, {
      disputed_at: this.clock.now(),
      dispute_reason: String(dispute.reason ?? 'unknown').slice(0, 80),
    });
    const shop = await this.settings.get(SHOP_SETTINGS, trx);
    await enqueueEmail(
      trx,
      disputeEmail((await this.orders.find(id, trx))!, shop.staffEmail, String(dispute.reason ?? 'unknown')),
    );
  }
}
