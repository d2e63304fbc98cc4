import type { Knex } from 'knex';
import type { OrderFilter, OrderSortKey } from '../../contracts/shop/staff-order-schemas';
import { orderOf, type OrderRow } from './order-rows';

/** The staff table's filters, and the club's time zone their days are in. */
export type ZonedOrderFilter = OrderFilter & { timeZone: string };

/** The column behind each sort key the staff table offers. */
const ORDER_SORTS: Record<OrderSortKey, string> = {
  created: 'o.created_at',
  number: 'o.number',
  email: 'o.email',
  total: 'o.total_cents',
  status: 'o.status',
};

const withUnits = (r: Record<string, unknown>) => ({ ...orderOf(r), units: r.units as number });

/** The staff order table: orders filtered, sorted and paged on the server, with their unit counts. */
export class OrderTableRepository {
  constructor(private readonly db: Knex) {}

  private filtered(f: ZonedOrderFilter) {
    const q = this.db('shop_orders as o');
    if (f.status === 'placed') q.whereNot('o.status', 'failed');
    else if (f.status) q.where('o.status', f.status);
    if (f.runId)
      q.whereExists(this.db('shop_order_items as i').whereRaw('i.order_id = o.id').where('i.run_id', f.runId));
    if (f.from) q.whereRaw('(o.created_at AT TIME ZONE ?)::date >= ?', [f.timeZone, f.from]);
    if (f.to) q.whereRaw('(o.created_at AT TIME ZONE ?)::date <= ?', [f.timeZone, f.to]);
    if (f.q) {
      const like = `%${f.q.replace(/[\\%_]/g, (c) => '\\' + c)}%`;
      q.where((w) => w.whereILike('o.email', like).orWhereILike('o.number', like));
    }
    return q;
  }

  /** One page of orders, sorted on the server. */
  async page(
    f: ZonedOrderFilter,
    sort: OrderSortKey,
    dir: 'asc' | 'desc',
    page: number,
    pageSize: number,
  ): Promise<{ items: (OrderRow & { units: number })[]; total: number }> {
    const [{ count }] = await this.filtered(f).count<{ count: number }[]>('* as count');
    const rows = await this.rowsFor(f, sort, dir)
      .limit(pageSize)
      .offset((page - 1) * pageSize);
    return { items: rows.map(withUnits), total: count };
  }

  /** Every matching order (CSV export), at most 10,000. */
  async all(f: ZonedOrderFilter, sort: OrderSortKey, dir: 'asc' | 'desc'): Promise<(OrderRow & { units: number })[]> {
    return (await this.rowsFor(f, sort, dir).limit(10000)).map(withUnits);
  }

  private rowsFor(f: ZonedOrderFilter, sort: OrderSortKey, dir: 'asc' | 'desc') {
    return this.filtered(f)
      .select(
        'o.*',
        this.db.raw("to_char(o.priced_on, 'YYYY-MM-DD') as priced_on_text"),
        this.db.raw('(SELECT coalesce(sum(quantity), 0)::int FROM shop_order_items WHERE order_id = o.id) as units'),
      )
      .orderBy(ORDER_SORTS[sort], dir)
      .orderBy('o.id', dir);
  }
}
