import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';
import type { Product } from '@contracts/shop/shop-answers';
import type { RefundPreview, StaffOrder, StaffOrderPage, StaffRefund } from '@contracts/shop/staff-order-answers';
import type { OrderListQuery, RefundInput, ShipInput } from '@contracts/shop/staff-order-schemas';
import type { ShopSettings, ShopSettingsInput } from '@contracts/shop/shop-settings-schemas';
import type { PrintSheet, RunMove, StaffRun, StaffShippingMethod } from '@contracts/shop/staff-shop-answers';
import type { NewProduct, NewRun, ProductChanges, ShippingMethodInput } from '@contracts/shop/staff-shop-schemas';

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** The console's shop calls: orders, runs, print sheets, settings. */
@Injectable({ providedIn: 'root' })
export class ShopAdminApi {
  private readonly http = inject(HttpClient);

  /** Query parameters from the set filters only, so a blank filter is left out rather than sent empty. */
  static params(q: Partial<OrderListQuery>): HttpParams {
    let p = new HttpParams();
    for (const [k, v] of Object.entries(q)) if (v !== undefined && v !== '' && v !== null) p = p.set(k, String(v));
    return p;
  }
  /** One page of staff orders for the filters and sort. */
  orders(q: OrderListQuery): Observable<StaffOrderPage> {
    return this.http.get<StaffOrderPage>('/api/admin/orders', { params: ShopAdminApi.params(q) });
  }
  /** One order with its lines, payments, refunds and shipping. */
  order(id: number): Observable<StaffOrder> {
    return this.http.get<{ order: StaffOrder }>(`/api/admin/orders/${id}`).pipe(map((r) => r.order));
  }
  /** Marks a paid order packed. */
  pack(id: number): Observable<StaffOrder> {
    return this.http.post<{ order: StaffOrder }>(`/api/admin/orders/${id}/pack`, {}).pipe(map((r) => r.order));
  }
  /** Marks a packed order shipped with its carrier and tracking number; the buyer is e-mailed. */
  ship(id: number, body: ShipInput): Observable<StaffOrder> {
    return this.http
      .post<{ order: StaffOrder }>(`/api/admin/orders/${id}/ship`, body, quiet())
      .pipe(map((r) => r.order));
  }
  /** What the refund would come to; nothing moves. */
  refundPreview(id: number, body: RefundInput): Observable<RefundPreview> {
    return this.http
      .post<{ refund: RefundPreview }>(`/api/admin/orders/${id}/refund-preview`, body, quiet())
      .pipe(map((r) => r.refund));
  }
  /** Refunds; `key` is the Idempotency-Key of this one refund, so a retried click never refunds twice. */
  refund(id: number, body: RefundInput, key: string): Observable<{ order: StaffOrder; refund: StaffRefund }> {
    return this.http.post<{ order: StaffOrder; refund: StaffRefund }>(`/api/admin/orders/${id}/refund`, body, {
      ...quiet(),
      headers: { 'Idempotency-Key': key },
    });
  }
  /** Every product, inactive ones included, and the club time zone its windows are typed in. */
  products(): Observable<{ items: (Product & { active: boolean })[]; timeZone: string }> {
    return this.http.get<{ items: (Product & { active: boolean })[]; timeZone: string }>('/api/admin/products');
  }
  /** Adds a product with its first run; refusals come back for the fields. */
  createProduct(body: NewProduct): Observable<unknown> {
    return this.http.post('/api/admin/products', body, quiet());
  }
  /** Changes the product fields sent. */
  editProduct(id: number, patch: ProductChanges): Observable<unknown> {
    return this.http.patch(`/api/admin/products/${id}`, patch);
  }
  /** The staff upload endpoint: the server sniffs the bytes and makes the thumbnail. */
  uploadImage(file: File): Observable<{ url: string; thumbnailUrl: string }> {
    const data = new FormData();
    data.append('file', file);
    return this.http.post<{ url: string; thumbnailUrl: string }>('/api/admin/uploads', data);
  }
  /** Every print run with its cap and units sold. */
  runs(): Observable<StaffRun[]> {
    return this.http.get<{ items: StaffRun[] }>('/api/admin/runs').pipe(map((r) => r.items));
  }
  /** Adds the next run of a product once the last one is over. */
  addRun(body: NewRun): Observable<StaffRun> {
    return this.http.post<{ run: StaffRun }>('/api/admin/runs', body, quiet()).pipe(map((r) => r.run));
  }
  /** Moves a run to its next state (closed, in production, shipped). */
  moveRun(id: number, state: RunMove): Observable<StaffRun> {
    return this.http.post<{ run: StaffRun }>(`/api/admin/runs/${id}/state`, { state }).pipe(map((r) => r.run));
  }
  /** The print-run sheet: units per size and the orders behind them. */
  printSheet(id: number): Observable<PrintSheet> {
    return this.http.get<PrintSheet>(`/api/admin/runs/${id}/print-sheet`);
  }
  /** The shop settings (seller details, tax numbers, limits, carrier). */
  settings(): Observable<ShopSettings> {
    return this.http.get<{ settings: ShopSettings }>('/api/admin/shop/settings').pipe(map((r) => r.settings));
  }
  /** Saves the shop settings; refusals come back for the fields. */
  saveSettings(s: ShopSettingsInput): Observable<ShopSettings> {
    return this.http
      .put<{ settings: ShopSettings }>('/api/admin/shop/settings', s, quiet())
      .pipe(map((r) => r.settings));
  }
  /** Every shipping method with its weight brackets. */
  shippingMethods(): Observable<StaffShippingMethod[]> {
    return this.http
      .get<{ items: StaffShippingMethod[] }>('/api/admin/shop/shipping-methods')
      .pipe(map((r) => r.items));
  }
  /** Saves a shipping method's name, brackets and on/off switch. */
  saveShippingMethod(m: ShippingMethodInput & Pick<StaffShippingMethod, 'id'>): Observable<unknown> {
    const body: ShippingMethodInput = { name: m.name, brackets: m.brackets, active: m.active };
    return this.http.put(`/api/admin/shop/shipping-methods/${m.id}`, body, quiet());
  }
}
