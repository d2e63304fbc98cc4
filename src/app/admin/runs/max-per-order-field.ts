import { ChangeDetectionStrategy, Component, effect, inject, input, output } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { applyServerErrors } from '../../core/api-error';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { ShopAdminApi } from '../orders/shop-admin-api';

/** The most units of a product one order may hold; the server's bounds, checked here first. */
export const MAX_PER_ORDER_VALIDATORS = [
  Validators.required,
  Validators.min(1),
  Validators.max(100),
  Validators.pattern(/^\d+$/),
];

/** One product's per-order limit in the products table: saved when the field is left or Enter is pressed. */
@Component({
  selector: 'ps-max-per-order-field',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, FieldErrorPipe],
  template: `
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-form-field subscriptSizing="dynamic" class="limit">
        <mat-label>Per order</mat-label>
        <input
          matInput
          type="number"
          min="1"
          max="100"
          step="1"
          formControlName="maxPerOrder"
          (blur)="save()"
          [attr.aria-label]="'Most units per order: ' + productName()"
        />
        <mat-error>{{ form.controls.maxPerOrder | fieldError: 'Per-order limit' }}</mat-error>
      </mat-form-field>
    </form>
  `,
  styles: `
    .limit {
      width: 120px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaxPerOrderField {
  private readonly api = inject(ShopAdminApi);
  readonly productId = input.required<number>();
  readonly productName = input.required<string>();
  readonly value = input.required<number>();
  /** The limit the server stored. */
  readonly saved = output<number>();

  protected readonly form = inject(NonNullableFormBuilder).group({ maxPerOrder: [20, MAX_PER_ORDER_VALIDATORS] });

  constructor() {
    effect(() => this.form.controls.maxPerOrder.setValue(this.value()));
  }

  protected async save(): Promise<void> {
    const control = this.form.controls.maxPerOrder;
    control.markAsTouched();
    if (control.invalid || Number(control.value) === this.value()) return;
    try {
      await firstValueFrom(this.api.editProduct(this.productId(), { maxPerOrder: Number(control.value) }));
      this.saved.emit(Number(control.value));
    } catch (err) {
      applyServerErrors(this.form, err);
    }
  }
}
