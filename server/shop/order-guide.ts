import type { Knex } from 'knex';
import type { Clock } from '../platform/clock';
import { nextSteps } from './next-steps';
import type { OrderRepository } from './order-repository';
import type { OrderBundle } from './order-rows';
import { effectiveRunState } from './run-state';

/** Works out an order's next steps for the confirmation page and the receipt, from its runs as they stand now. */
export class OrderGuide {
  constructor(
    private readonly orders: OrderRepository,
    private readonly clock: Clock,
    private readonly clubName: string,
    private readonly timeZone: string,
  ) {}

  /** The buyer's next steps for one order, in plain words. */
  async nextSteps(b: OrderBundle, trx?: Knex.Transaction): Promise<string[]> {
    const now = this.clock.now();
    const runs = await this.orders.runsOf(b.order.id, trx);
    return nextSteps({
      status: b.order.status,
      pickup: b.order.shipping_code === 'pickup',
      runs: runs.map((r) => ({
        name: r.name,
        closesAt: r.closes_at,
        state: effectiveRunState(
          { state: r.state, cap: r.cap, reserved: r.reserved, opensAt: r.opens_at, closesAt: r.closes_at },
          now,
        ),
      })),
      hasStockItems: b.items.some((i) => i.run_id === null),
      clubName: this.clubName,
      timeZone: this.timeZone,
    });
  }
}
