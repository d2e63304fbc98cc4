import type { AccountOrders, Order } from '../../contracts/shop/shop-answers';
import { notFound } from '../platform/app-error';
import type { Role } from '../platform/roles';
import type { OrderGuide } from './order-guide';
import type { OrderLinks } from './order-links';
import type { OrderRepository } from './order-repository';
import type { OrderBundle } from './order-rows';
import { orderJson } from './order-view';
import type { ReceiptService } from './receipt-service';

/** Besides the buyer, only these roles handle shop orders (an editor has no business with addresses or payments). */
export const ORDER_ROLES: readonly Role[] = ['treasurer', 'admin'];

/** Who asks to see an order: the signed-in account if any, the orders this browser placed or opened, the link's key. */
export interface OrderViewer {
  userId: number | null;
  roles: readonly Role[];
  sessionOrderIds: readonly number[];
  /** The e-mailed link's key, or '' when none came. */
  key: string;
}

/** The buyer's side of an order: who may open it, and what they see of it and of their own orders. */
export class BuyerOrderService {
  constructor(
    private readonly orders: OrderRepository,
    private readonly receipts: ReceiptService,
    private readonly links: OrderLinks,
    private readonly guide: OrderGuide,
  ) {}

  /**
   * The order, for its buyer (account, this browser, or the e-mailed link's key) or staff; anyone else gets the same
   * 404 as an id that does not exist, so order ids are not confirmed to strangers (ASVS 4.0.3 4.2.1). `byKey` says the
   * link's key opened it, so the caller can remember it like a guest's own order.
   */
  async open(id: number, viewer: OrderViewer): Promise<{ bundle: OrderBundle; byKey: boolean }> {
    const b = await this.orders.find(id);
    if (!b) throw notFound('No such order.');
    const mine = (viewer.userId !== null && b.order.user_id === viewer.userId) || viewer.sessionOrderIds.includes(id);
    const byKey = !mine && viewer.key !== '' && this.links.verify(b.order.id, b.order.email, viewer.key);
    if (!(mine || byKey || viewer.roles.some((r) => ORDER_ROLES.includes(r)))) throw notFound('No such order.');
    return { bundle: b, byKey };
  }

  /** The buyer's view of an order: the order and, once paid, its receipt. */
  async view(b: OrderBundle): Promise<Order> {
    return { ...orderJson(b), receipt: await this.receipts.forOrder(b) };
  }

  /** The buyer's view of an order with what happens next, for the order page. */
  async detail(b: OrderBundle): Promise<Order> {
    return { ...(await this.view(b)), nextSteps: await this.guide.nextSteps(b) };
  }

  /** The signed-in buyer's orders, and the address of the latest mailed one so checkout can offer it again. */
  async accountOrders(userId: number): Promise<AccountOrders> {
    const rows = await this.orders.forUser(userId);
    const last = await this.orders.lastShipTo(userId);
    const lastShipTo = last && {
      name: last.ship_name,
      line1: last.ship_line1 ?? '',
      line2: last.ship_line2 ?? '',
      city: last.ship_city ?? '',
      province: last.ship_province ?? '',
      postalCode: last.ship_postal_code ?? '',
      country: last.ship_country,
    };
    return {
      lastShipTo,
      items: rows.map((o) => ({
        id: o.id,
        number: o.number,
        status: o.status,
        createdAt: o.created_at.toISOString(),
        totalCents: o.total_cents,
        refundedCents: o.refunded_cents,
        shippingName: o.shipping_name,
        trackingNumber: o.tracking_number,
        carrier: o.carrier,
      })),
    };
  }
}
