import { ChangeDetectionStrategy, Component, inject, input, numberAttribute, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { applyServerErrors } from '../../core/api-error';
import { codeInWords } from '@contracts/labels/label-of';
import { REFUND_ORIGIN_LABELS, REFUND_STATE_LABELS } from '@contracts/labels/refund-states';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { ORDER_STATUS_LABELS as STATUS_LABELS } from '@contracts/labels/order-statuses';
import { RefundPanel } from './refund-panel';
import type { StaffRefund } from '@contracts/shop/staff-order-answers';
import { ShopAdminApi } from './shop-admin-api';

/** One order for staff: items, money, packing list to print, pack, ship with tracking, refunds and their history. */
@Component({
  selector: 'ps-order-detail',
  imports: [
    ClubDatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    FieldErrorPipe,
    MoneyPipe,
    RefundPanel,
  ],
  templateUrl: './order-detail.html',
  styleUrl: './order-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrderDetail {
  private readonly api = inject(ShopAdminApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  readonly id = input.required({ transform: numberAttribute });

  protected readonly order = rxResource({ params: () => this.id(), stream: ({ params }) => this.api.order(params) });
  protected readonly labels = STATUS_LABELS;
  protected readonly refundStates = REFUND_STATE_LABELS;
  protected readonly refundOrigins = REFUND_ORIGIN_LABELS;
  /** The card processor's dispute reason code, as words. */
  protected readonly inWords = codeInWords;
  protected readonly shipForm = this.fb.group({
    carrier: ['', Validators.required],
    trackingNumber: ['', Validators.required],
  });
  protected readonly shipProblem = signal<string | null>(null);
  protected readonly busy = signal(false);

  constructor() {
    // The shop's usual carrier, when staff set one, fills the field unless someone already typed in it.
    void firstValueFrom(this.api.settings()).then((s) => {
      if (s.carrier && !this.shipForm.controls.carrier.dirty) this.shipForm.controls.carrier.setValue(s.carrier);
    });
  }

  protected async pack(): Promise<void> {
    await this.run(() => firstValueFrom(this.api.pack(this.id())), 'Marked packed.');
  }

  protected async ship(): Promise<void> {
    this.shipForm.markAllAsTouched();
    if (this.shipForm.invalid) return;
    this.shipProblem.set(null);
    try {
      await this.run(
        () => firstValueFrom(this.api.ship(this.id(), this.shipForm.getRawValue())),
        'Marked shipped; the buyer is told.',
      );
    } catch (err) {
      this.shipProblem.set(applyServerErrors(this.shipForm, err));
    }
  }

  protected refunded(r: StaffRefund): void {
    this.snackBar.open(
      r.unitsBackOnSale ? `Refund sent; ${r.unitsBackOnSale} back on sale.` : 'Refund sent.',
      undefined,
      { duration: 3000 },
    );
    this.order.reload();
  }

  protected print(): void {
    window.print();
  }

  private async run(action: () => Promise<unknown>, done: string): Promise<void> {
    this.busy.set(true);
    try {
      await action();
      this.snackBar.open(done, undefined, { duration: 3000 });
      this.order.reload();
    } finally {
      this.busy.set(false);
    }
  }
}
