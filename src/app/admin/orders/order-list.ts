import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { MoneyPipe } from '../../shared/money-pipe';
import { ORDER_STATUS_LABELS as STATUS_LABELS } from '@contracts/labels/order-statuses';
import type { OrderListQuery, OrderSortKey } from '@contracts/shop/staff-order-schemas';
import { ShopAdminApi } from './shop-admin-api';

/** The orders table: server paging and sorting, filters by status, run and dates, search, CSV of the same filter. */
@Component({
  selector: 'ps-order-list',
  imports: [
    ClubDatePipe,
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    MoneyPipe,
    EmptyState,
  ],
  templateUrl: './order-list.html',
  styles: `
    .ps-page {
      max-width: none;
    }
    .filters .search {
      min-width: min(300px, 100%);
    }
    .table-card {
      overflow-x: auto;
      max-width: 100%;
      background: var(--mat-sys-surface);
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
    }
    .table-card table {
      min-width: 720px;
    }
    .filters {
      display: flex;
      gap: 12px;
      flex-wrap: wrap;
      align-items: center;
    }
    table {
      width: 100%;
    }
    .disputed {
      color: var(--mat-sys-error);
      font-weight: 600;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrderList {
  private readonly api = inject(ShopAdminApi);
  protected readonly columns = ['number', 'created', 'email', 'status', 'units', 'total'];
  protected readonly statuses = Object.entries(STATUS_LABELS);
  // Never-paid attempts (declined cards) are hidden by default; "Any status" or "Not paid" shows them.
  protected readonly query = signal<OrderListQuery>({
    page: 1,
    pageSize: 25,
    sort: 'created',
    dir: 'desc',
    status: 'placed',
  });
  protected readonly orders = rxResource({
    params: () => this.query(),
    stream: ({ params }) => this.api.orders(params),
  });
  protected readonly runs = rxResource({ stream: () => this.api.runs() });
  protected readonly csvHref = computed(() => {
    const { page: _p, pageSize: _s, ...filter } = this.query();
    return `/api/admin/orders/export?${ShopAdminApi.params(filter).toString()}`;
  });

  protected label(status: keyof typeof STATUS_LABELS): string {
    return STATUS_LABELS[status];
  }

  protected filter(patch: Partial<OrderListQuery>): void {
    this.query.update((q) => ({ ...q, ...patch, page: 1 }));
  }
  protected sortBy(s: Sort): void {
    this.query.update((q) => ({
      ...q,
      sort: s.direction ? (s.active as OrderSortKey) : 'created',
      dir: s.direction || 'desc',
      page: 1,
    }));
  }
  protected changePage(e: PageEvent): void {
    this.query.update((q) => ({ ...q, page: e.pageIndex + 1, pageSize: e.pageSize }));
  }
}
