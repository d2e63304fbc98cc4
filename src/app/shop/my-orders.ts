import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { EmptyState } from '../shared/empty-state';
import { MoneyPipe } from '../shared/money-pipe';
import { ShopApi } from './shop-api';
import { ORDER_STATUS_LABELS as STATUS_LABELS } from '@contracts/labels/order-statuses';

/** /shop/orders: the signed-in buyer's own orders, newest first. */
@Component({
  selector: 'ps-my-orders',
  imports: [DatePipe, RouterLink, MatButtonModule, MoneyPipe, EmptyState],
  template: `
    <section class="ps-narrow">
      <h1>My orders</h1>
      @if (orders.value(); as items) {
        @if (items.length) {
          <table>
            <caption class="ps-visually-hidden">
              Your orders
            </caption>
            <thead>
              <tr>
                <th scope="col">Order</th>
                <th scope="col">Placed</th>
                <th scope="col">Status</th>
                <th scope="col">Total</th>
              </tr>
            </thead>
            <tbody>
              @for (o of items; track o.id) {
                <tr>
                  <td>
                    <a [routerLink]="['/shop/orders', o.id]">{{ o.number }}</a>
                  </td>
                  <td>{{ o.createdAt | date: 'mediumDate' }}</td>
                  <td>
                    {{ labels[o.status] }}
                    @if (o.trackingNumber) {
                      · {{ o.carrier }} {{ o.trackingNumber }}
                    }
                  </td>
                  <td>
                    {{ o.totalCents | money }}
                    @if (o.refundedCents) {
                      (refunded {{ o.refundedCents | money }})
                    }
                  </td>
                </tr>
              }
            </tbody>
          </table>
        } @else {
          <ps-empty-state icon="receipt_long" message="No orders yet."
            ><a mat-stroked-button routerLink="/shop">See the merch</a></ps-empty-state
          >
        }
      }
    </section>
  `,
  styles: `
    table {
      width: 100%;
      border-collapse: collapse;
    }
    th,
    td {
      text-align: left;
      padding: 8px 4px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MyOrders {
  private readonly api = inject(ShopApi);
  protected readonly orders = rxResource({ stream: () => this.api.myOrders() });
  protected readonly labels = STATUS_LABELS;
}
