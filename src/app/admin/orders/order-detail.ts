import { ChangeDetectionStrategy, Component, computed, inject, input, numberAttribute, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { applyServerErrors } from '../../core/api-error';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { STATUS_LABELS } from '../../shop/shop-types';
import { ShopAdminApi } from './shop-admin-api';
import { dollarsToCents } from '../../shared/dollars';

/** One order for staff: items, money, packing list to print, pack, ship with tracking, refund. */
@Component({
  selector: 'ps-order-detail',
  imports: [DatePipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, FieldErrorPipe, MoneyPipe],
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
  protected readonly shipForm = this.fb.group({ carrier: ['Canada Post', Validators.required], trackingNumber: ['', Validators.required] });
  protected readonly refundForm = this.fb.group({ amount: ['', [Validators.required, Validators.pattern(/^\d+(\.\d{1,2})?$/)]], restock: [false] });
  protected readonly shipProblem = signal<string | null>(null);
  protected readonly refundProblem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly refundable = computed(() => {
    const o = this.order.value();
    return o ? o.totalCents - o.refundedCents : 0;
  });

  protected async pack(): Promise<void> {
    await this.run(() => firstValueFrom(this.api.pack(this.id())), 'Marked packed.');
  }

  protected async ship(): Promise<void> {
    this.shipForm.markAllAsTouched();
    if (this.shipForm.invalid) return;
    this.shipProblem.set(null);
    try {
      await this.run(() => firstValueFrom(this.api.ship(this.id(), this.shipForm.getRawValue())), 'Marked shipped; the buyer is told.');
    } catch (err) {
      this.shipProblem.set(applyServerErrors(this.shipForm, err));
    }
  }

  protected async refund(): Promise<void> {
    this.refundForm.markAllAsTouched();
    if (this.refundForm.invalid) return;
    this.refundProblem.set(null);
    const { amount, restock } = this.refundForm.getRawValue();
    const amountCents = dollarsToCents(amount);
    try {
      await this.run(() => firstValueFrom(this.api.refund(this.id(), { amountCents, restock })), 'Refund sent.');
      this.refundForm.reset();
    } catch (err) {
      this.refundProblem.set(applyServerErrors(this.refundForm, err, { amountCents: 'amount' }));
    }
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
