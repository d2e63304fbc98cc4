import type { Knex } from 'knex';
import type Stripe from 'stripe';
import { enqueueEmail } from '../mail/outbox';
import type { Clock } from '../platform/clock';
import type { SettingsService } from '../settings/settings-service';
import type { FulfilmentService } from './fulfilment-service';
import type { OrderRepository } from './order-repository';
import { disputeEmail } from './shop-emails';
import { SHOP_SETTINGS } from './shop-settings';

/** The processor's events: each handled once, in the same transaction that records it as seen. */
export class WebhookService {
  constructor(
    private readonly db: Knex,
    private readonly orders: OrderRepository,
    private readonly fulfilment: FulfilmentService,
    private readonly settings: SettingsService,
    private readonly clock: Clock,
  ) {}

  /** Returns false for a replay (already handled). */
  async handle(event: Stripe.Event): Promise<boolean> {
    return this.db.transaction(async (trx) => {
      const fresh = await trx('payment_events').insert({ id: event.id, type: event.type, received_at: this.clock.now() }).onConflict('id').ignore().returning('id');
      if (!fresh.length) return false;
      if (event.type === 'charge.refunded') await this.chargeRefunded(trx, event.data.object);
      if (event.type === 'charge.dispute.created') await this.disputeCreated(trx, event.data.object);
      return true;
    });
  }

  /** A refund made outside Padside (the processor dashboard): record whatever is not recorded yet. */
  private async chargeRefunded(trx: Knex.Transaction, charge: Stripe.Charge): Promise<void> {
    const id = await this.orders.byChargeId(charge.id, trx);
    if (!id) return;
    const b = (await this.orders.find(id, trx, true))!;
    const missing = Math.min(charge.amount_refunded, b.order.total_cents) - b.order.refunded_cents;
    if (missing > 0) await this.fulfilment.recordRefund(trx, b, missing, false, null, 'processor', null);
  }

  private async disputeCreated(trx: Knex.Transaction, dispute: Stripe.Dispute): Promise<void> {
    const chargeId = typeof dispute.charge === 'string' ? dispute.charge : dispute.charge.id;
    const id = await this.orders.byChargeId(chargeId, trx);
    if (!id) return;
    await this.orders.update(trx, id, { disputed_at: this.clock.now(), dispute_reason: String(dispute.reason ?? 'unknown').slice(0, 80) });
    const shop = await this.settings.get(SHOP_SETTINGS, trx);
    await enqueueEmail(trx, disputeEmail((await this.orders.find(id, trx))!, shop.staffEmail, String(dispute.reason ?? 'unknown')));
  }
}
