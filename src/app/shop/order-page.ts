import { ChangeDetectionStrategy, Component, inject, input, numberAttribute } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MoneyPipe } from '../shared/money-pipe';
import { ShopApi } from './shop-api';
import { ORDER_STATUS_LABELS as STATUS_LABELS } from '@contracts/labels/order-statuses';

/** /shop/orders/:id: the confirmation right after checkout, and the receipt any time after. */
@Component({
  selector: 'ps-order-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MoneyPipe],
  templateUrl: './order-page.html',
  styleUrl: './order-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrderPage {
  private readonly api = inject(ShopApi);
  readonly id = input.required({ transform: numberAttribute });
  /** Set by checkout, so the page thanks the buyer. */
  readonly placed = input<string>();
  /** From the e-mailed link: opens the order in a browser that has no account or session for it. */
  readonly key = input<string>();
  protected readonly order = rxResource({
    params: () => ({ id: this.id(), key: this.key() }),
    stream: ({ params }) => this.api.order(params.id, params.key),
  });
  protected readonly labels = STATUS_LABELS;

  protected print(): void {
    window.print();
  }
}
