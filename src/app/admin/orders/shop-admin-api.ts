import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';
import type { Order, Product } from '../../shop/shop-types';

export interface StaffOrderRow {
  id: number;
  number: string;
  status: Order['status'];
  email: string;
  shipName: string;
  units: number;
  totalCents: number;
  refundedCents: number;
  shippingName: string;
  createdAt: string;
  disputed: boolean;
}
/** One tax reversed by a refund. */
export interface RefundTaxLine {
  code: string;
  jurisdiction: string;
  label: string;
  ratePercent: string;
  taxableCents: number;
  taxCents: number;
}
/** What a refund comes to (the preview, before anything moves). */
export interface RefundPreview {
  lines: { orderItemId: number; quantity: number; goodsCents: number }[];
  goodsCents: number;
  shippingCents: number;
  taxLines: RefundTaxLine[];
  taxCents: number;
  totalCents: number;
  closesOrder: boolean;
}
/** A refund on record, from the console or from the processor. */
export interface StaffRefund extends Omit<RefundPreview, 'totalCents' | 'closesOrder'> {
  id: number;
  state: 'requested' | 'succeeded' | 'failed';
  origin: 'staff' | 'processor';
  amountCents: number;
  restocked: boolean;
  unitsBackOnSale: number;
  reason: string | null;
  failureMessage: string | null;
  createdAt: string;
}
/** What the treasurer asks to refund. */
export interface RefundAsk {
  lines: { orderItemId: number; quantity: number }[];
  shipping: boolean;
  amountCents?: number;
  restock: boolean;
  reason?: string;
}
export interface StaffOrder extends Omit<Order, 'items'> {
  items: (Order['items'][number] & { restockedQuantity: number; refundedQuantity: number; unitsToPack: number })[];
  weightGrams: number;
  chargeId: string | null;
  paidOutsideProcessor: boolean;
  paymentAttempts: number;
  disputedAt: string | null;
  disputeReason: string | null;
  /** Print runs this order waits for; it cannot ship before they are printed. */
  awaitingPrint: string[];
  shippingRefundedCents: number;
  refunds: StaffRefund[];
}
export interface OrderQuery {
  page: number;
  pageSize: number;
  sort: string;
  dir: 'asc' | 'desc';
  status?: string;
  runId?: number;
  from?: string;
  to?: string;
  q?: string;
}
export interface StaffRun {
  id: number;
  name: string;
  productName: string;
  productSlug: string;
  state: string;
  nextStates: string[];
  cap: number;
  reserved: number;
  remaining: number;
  opensAt: string;
  closesAt: string;
  unitCostCents: number | null;
}
export interface NewRun {
  productId: number;
  name?: string;
  cap: number;
  opensAt: string;
  closesAt: string;
  unitCostCents?: number;
  variantCaps: { variantId: number; cap: number }[];
}
export interface PrintSheet {
  run: { id: number; name: string; productName: string; state: string; cap: number; opensAt: string; closesAt: string };
  kind: 'preview' | 'final';
  rules: { sparesPercent: number; packMultiple: number; minimumPerDesign: number };
  lines: { variantId: number; label: string; sku: string; paid: number; spares: number; toPrint: number }[];
  totalPaid: number;
  totalToPrint: number;
  unitCostCents: number | null;
  estimatedCostCents: number | null;
}
export interface ShopSettings {
  sellerProvince: string;
  /** The legal or trading name on receipts; empty = the team's name. */
  sellerName: string;
  gstHstNumber: string;
  provincialTaxNumbers: Record<string, string>;
  gstHstRegistered: boolean;
  provincialRegistrations: string[];
  provincialTaxOnShipping: Record<string, boolean>;
  memberDiscountPercent: number;
  sparesPercent: number;
  packMultiple: number;
  minimumPerDesign: number;
  staffEmail: string;
  /** The carrier the ship form starts with; empty = none. */
  carrier: string;
}
export interface StaffShippingMethod {
  id: number;
  code: string;
  name: string;
  brackets: { maxGrams: number | null; priceCents: number }[];
  active: boolean;
}

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** The console's shop calls: orders, runs, print sheets, settings. */
@Injectable({ providedIn: 'root' })
export class ShopAdminApi {
  private readonly http = inject(HttpClient);

  static params(q: Partial<OrderQuery>): HttpParams {
    let p = new HttpParams();
    for (const [k, v] of Object.entries(q)) if (v !== undefined && v !== '' && v !== null) p = p.set(k, String(v));
    return p;
  }
  orders(q: OrderQuery): Observable<{ items: StaffOrderRow[]; total: number }> {
    return this.http.get<{ items: StaffOrderRow[]; total: number }>('/api/admin/orders', { params: ShopAdminApi.params(q) });
  }
  order(id: number): Observable<StaffOrder> {
    return this.http.get<{ order: StaffOrder }>(`/api/admin/orders/${id}`).pipe(map((r) => r.order));
  }
  pack(id: number): Observable<StaffOrder> {
    return this.http.post<{ order: StaffOrder }>(`/api/admin/orders/${id}/pack`, {}).pipe(map((r) => r.order));
  }
  ship(id: number, body: { carrier: string; trackingNumber: string }): Observable<StaffOrder> {
    return this.http.post<{ order: StaffOrder }>(`/api/admin/orders/${id}/ship`, body, quiet()).pipe(map((r) => r.order));
  }
  /** What the refund would come to; nothing moves. */
  refundPreview(id: number, body: RefundAsk): Observable<RefundPreview> {
    return this.http.post<{ refund: RefundPreview }>(`/api/admin/orders/${id}/refund-preview`, body, quiet()).pipe(map((r) => r.refund));
  }
  /** Refunds; `key` is the Idempotency-Key of this one refund, so a retried click never refunds twice. */
  refund(id: number, body: RefundAsk, key: string): Observable<{ order: StaffOrder; refund: StaffRefund }> {
    return this.http.post<{ order: StaffOrder; refund: StaffRefund }>(`/api/admin/orders/${id}/refund`, body, { ...quiet(), headers: { 'Idempotency-Key': key } });
  }
  products(): Observable<{ items: (Product & { active: boolean })[]; timeZone: string }> {
    return this.http.get<{ items: (Product & { active: boolean })[]; timeZone: string }>('/api/admin/products');
  }
  createProduct(body: object): Observable<unknown> {
    return this.http.post('/api/admin/products', body, quiet());
  }
  editProduct(id: number, patch: object): Observable<unknown> {
    return this.http.patch(`/api/admin/products/${id}`, patch);
  }
  /** The staff upload endpoint: the server sniffs the bytes and makes the thumbnail. */
  uploadImage(file: File): Observable<{ url: string; thumbnailUrl: string }> {
    const data = new FormData();
    data.append('file', file);
    return this.http.post<{ url: string; thumbnailUrl: string }>('/api/admin/uploads', data);
  }
  runs(): Observable<StaffRun[]> {
    return this.http.get<{ items: StaffRun[] }>('/api/admin/runs').pipe(map((r) => r.items));
  }
  addRun(body: NewRun): Observable<StaffRun> {
    return this.http.post<{ run: StaffRun }>('/api/admin/runs', body, quiet()).pipe(map((r) => r.run));
  }
  moveRun(id: number, state: string): Observable<StaffRun> {
    return this.http.post<{ run: StaffRun }>(`/api/admin/runs/${id}/state`, { state }).pipe(map((r) => r.run));
  }
  printSheet(id: number): Observable<PrintSheet> {
    return this.http.get<PrintSheet>(`/api/admin/runs/${id}/print-sheet`);
  }
  settings(): Observable<ShopSettings> {
    return this.http.get<{ settings: ShopSettings }>('/api/admin/shop/settings').pipe(map((r) => r.settings));
  }
  saveSettings(s: ShopSettings): Observable<ShopSettings> {
    return this.http.put<{ settings: ShopSettings }>('/api/admin/shop/settings', s, quiet()).pipe(map((r) => r.settings));
  }
  shippingMethods(): Observable<StaffShippingMethod[]> {
    return this.http.get<{ items: StaffShippingMethod[] }>('/api/admin/shop/shipping-methods').pipe(map((r) => r.items));
  }
  saveShippingMethod(m: StaffShippingMethod): Observable<unknown> {
    return this.http.put(`/api/admin/shop/shipping-methods/${m.id}`, { name: m.name, brackets: m.brackets, active: m.active }, quiet());
  }
}
