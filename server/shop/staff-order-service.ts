import { labelOf } from '../../contracts/labels/label-of';
import { ORDER_STATUS_LABELS } from '../../contracts/labels/order-statuses';
import type { StaffOrder, StaffOrderPage, StaffRefund } from '../../contracts/shop/staff-order-answers';
import type { OrderListQuery } from '../../contracts/shop/staff-order-schemas';
import { centsToDecimal, csvInstant, toCsv, zonedHeader } from '../platform/csv';
import { notFound } from '../platform/app-error';
import type { OrderRepository } from './order-repository';
import type { OrderTableRepository, ZonedOrderFilter } from './order-table-repository';
import type { OrderBundle } from './order-rows';
import type { RefundRepository, ShopRefundRow } from './refund-repository';
import { refundJson, staffOrderJson } from './refund-view';

const CSV_HEADER = (timeZone: string) => [
  'Order number',
  zonedHeader('Placed at', timeZone),
  'Status',
  'E-mail',
  'Ship to',
  'Country',
  'Shipping method',
  'Units',
  'Subtotal (CAD)',
  'Discount (CAD)',
  'Shipping (CAD)',
  'Tax (CAD)',
  'Total (CAD)',
  'Refunded (CAD)',
  'Carrier',
  'Tracking number',
];

/** The console's side of orders: the table, its CSV export and the staff view of one order and its refunds. */
export class StaffOrderService {
  constructor(
    private readonly orders: OrderRepository,
    private readonly table: OrderTableRepository,
    private readonly refunds: RefundRepository,
    private readonly timeZone: string,
  ) {}

  private filterOf(q: OrderListQuery): ZonedOrderFilter {
    return { status: q.status, runId: q.runId, from: q.from, to: q.to, q: q.q, timeZone: this.timeZone };
  }

  /** One page of the staff order table, filtered and sorted on the server, its days in the club's time zone. */
  async page(q: OrderListQuery): Promise<StaffOrderPage> {
    const { items, total } = await this.table.page(this.filterOf(q), q.sort, q.dir, q.page, q.pageSize);
    return {
      items: items.map((o) => ({
        id: o.id,
        number: o.number,
        status: o.status,
        email: o.email,
        shipName: o.ship_name,
        units: o.units,
        totalCents: o.total_cents,
        refundedCents: o.refunded_cents,
        shippingName: o.shipping_name,
        createdAt: o.created_at.toISOString(),
        disputed: o.disputed_at !== null,
      })),
      total,
      page: q.page,
      pageSize: q.pageSize,
    };
  }

  /** The CSV of every order the filters choose, always oldest first whatever the table was sorted by, for the books. */
  async exportCsv(q: OrderListQuery): Promise<string> {
    const rows = await this.table.all(this.filterOf(q), 'created', 'asc');
    return toCsv(
      CSV_HEADER(this.timeZone),
      rows.map((o) => [
        o.number,
        csvInstant(o.created_at, this.timeZone),
        labelOf(ORDER_STATUS_LABELS, o.status),
        o.email,
        o.ship_name,
        o.ship_country,
        o.shipping_name,
        o.units,
        centsToDecimal(o.subtotal_cents),
        centsToDecimal(o.discount_cents),
        centsToDecimal(o.shipping_cents),
        centsToDecimal(o.tax_cents),
        centsToDecimal(o.total_cents),
        centsToDecimal(o.refunded_cents),
        o.carrier,
        o.tracking_number,
      ]),
    );
  }

  /** The staff view of one order (lines, refunded units, runs it waits for, refunds); 404 when there is none. */
  async detail(id: number): Promise<StaffOrder> {
    const b = await this.orders.find(id);
    if (!b) throw notFound('No such order.');
    return this.view(b);
  }

  /** The staff view of an order as a fulfilment or refund step left it. */
  view(b: OrderBundle): Promise<StaffOrder> {
    return staffOrderJson(b, this.refunds, this.orders);
  }

  /** What the console shows after a refund: the order as it now stands and the refund with its lines and taxes. */
  async refunded(b: OrderBundle, refund: ShopRefundRow): Promise<{ order: StaffOrder; refund: StaffRefund }> {
    const [lines, taxes] = [await this.refunds.lines([refund.id]), await this.refunds.taxes([refund.id])];
    return { order: await this.view(b), refund: refundJson(refund, lines, taxes) };
  }
}
