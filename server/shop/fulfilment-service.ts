import type { Knex } from 'knex';
import { enqueueEmail } from '../mail/outbox';
import { conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { OrderLinks } from './order-links';
import type { OrderRepository } from './order-repository';
import type { OrderBundle } from './order-rows';
import { shippedEmail } from './shop-emails';

/** Packing and shipping: staff work on paid orders (refunds: RefundService). */
export class FulfilmentService {
  constructor(
    private readonly db: Knex,
    private readonly orders: OrderRepository,
    private readonly clock: Clock,
    private readonly links: OrderLinks,
    private readonly teamName: string,
  ) {}

  /** Marks a paid order packed; only paid orders move, so an unpaid one is never shipped by mistake. */
  async pack(id: number): Promise<OrderBundle> {
    await this.mustExist(id);
    const packed = await this.db.transaction((trx) =>
      this.orders.transition(trx, id, ['paid'], { status: 'packed', packed_at: this.clock.now() }),
    );
    if (!packed) throw conflict('wrong_status', 'Only a paid order can be marked packed.');
    return (await this.orders.find(id))!;
  }

  /** Marks shipped with carrier and tracking and queues the shipped notice, together. */
  async ship(id: number, carrier: string, trackingNumber: string): Promise<OrderBundle> {
    await this.mustExist(id);
    await this.db.transaction(async (trx) => {
      // A pre-order ships once its run is printed (the run marked shipped from the printer), never before.
      const waiting = await this.orders.unprintedRuns(id, trx);
      if (waiting.length)
        throw conflict(
          'run_not_printed',
          `This order waits for its print run (${waiting.join(', ')}); ship it once the run is printed.`,
        );
      if (
        !(await this.orders.transition(trx, id, ['paid', 'packed'], {
          status: 'shipped',
          shipped_at: this.clock.now(),
          carrier,
          tracking_number: trackingNumber,
        }))
      ) {
        throw conflict('wrong_status', 'Only a paid or packed order can be shipped.');
      }
      const shipped = (await this.orders.find(id, trx))!;
      await enqueueEmail(
        trx,
        shippedEmail(shipped, this.links.urlFor(shipped.order.id, shipped.order.email), this.teamName),
      );
    });
    return (await this.orders.find(id))!;
  }

  private async mustExist(id: number): Promise<OrderBundle> {
    const b = await this.orders.find(id);
    if (!b) throw notFound('No such order.');
    return b;
  }
}
