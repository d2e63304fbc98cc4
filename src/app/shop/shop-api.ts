import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type {
  AccountOrders,
  Order,
  OrderAnswer,
  OrderSummary,
  Product,
  ProductDetail,
  Quote,
  ShippingMethod,
  ShipTo,
} from '@contracts/shop/shop-answers';
import type { OrderInput, QuoteInput } from '@contracts/shop/shop-schemas';

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** The storefront's calls: catalogue, quote, order, the buyer's orders. */
@Injectable({ providedIn: 'root' })
export class ShopApi {
  private readonly http = inject(HttpClient);

  /** The public catalogue with exact units left. */
  products(): Observable<Product[]> {
    return this.http.get<{ items: Product[] }>('/api/products').pipe(map((r) => r.items));
  }
  /** An unknown slug is the page's to say (its not-found message), not a snack bar's. */
  product(slug: string): Observable<ProductDetail> {
    return this.http.get<ProductDetail>(`/api/products/${encodeURIComponent(slug)}`, quiet());
  }
  /** The shipping methods a buyer can choose. */
  shippingMethods(): Observable<ShippingMethod[]> {
    return this.http.get<{ items: ShippingMethod[] }>('/api/shipping-methods').pipe(map((r) => r.items));
  }
  /** Errors are the caller's to show (beside the fields). */
  quote(body: QuoteInput): Observable<Quote> {
    return this.http.post<Quote>('/api/checkout/quote', body, quiet());
  }
  /** Places and pays an order in one step; errors are the checkout's to show beside the fields. */
  placeOrder(body: OrderInput): Observable<OrderAnswer> {
    return this.http.post<OrderAnswer>('/api/orders', body, quiet());
  }
  /** Pays for an order whose card was declined, with a new card. */
  payAgain(id: number, paymentToken: string): Observable<OrderAnswer> {
    return this.http.post<OrderAnswer>(`/api/orders/${id}/pay`, { paymentToken }, quiet());
  }
  /** `key` is the one from the e-mailed link, which opens the order without an account. */
  order(id: number, key?: string): Observable<Order> {
    // The page says "not found" itself; no snack bar on top of it.
    return this.http
      .get<OrderAnswer>(`/api/orders/${id}`, { ...quiet(), ...(key ? { params: { key } } : {}) })
      .pipe(map((r) => r.order));
  }
  /** The signed-in buyer's orders, newest first. */
  myOrders(): Observable<OrderSummary[]> {
    return this.http.get<AccountOrders>('/api/account/orders').pipe(map((r) => r.items));
  }
  /** Where the signed-in buyer's latest mailed order went, to offer it again at checkout; null if none. */
  lastShipTo(): Observable<ShipTo | null> {
    return this.http.get<AccountOrders>('/api/account/orders', quiet()).pipe(map((r) => r.lastShipTo));
  }
}
