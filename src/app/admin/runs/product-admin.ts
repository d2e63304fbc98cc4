import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { applyServerErrors } from '../../core/api-error';
import { SiteNames } from '../../core/site-names';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { wallTimeToIso } from '../../shared/zoned-time';
import { RUN_STATE_LABELS } from '../../shop/countdown';
import type { Product } from '@contracts/shop/shop-answers';
import { ShopAdminApi } from '../orders/shop-admin-api';
import { dollarsToCents } from '../../shared/dollars';
import { MAX_PER_ORDER_VALIDATORS, MaxPerOrderField } from './max-per-order-field';

/** Products for staff: the list, on/off sale, and a form for a new product with its sizes and optional limited run. */
@Component({
  selector: 'ps-product-admin',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    FieldErrorPipe,
    MoneyPipe,
    MaxPerOrderField,
  ],
  templateUrl: './product-admin.html',
  styles: `
    .ps-page {
      max-width: none;
    }
    .table-scroll {
      overflow-x: auto;
      max-width: 100%;
    }
    table {
      width: 100%;
      border-collapse: collapse;
    }
    th,
    td {
      text-align: left;
      padding: 6px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(200px, 1fr));
      gap: 0 16px;
    }
    label.upload {
      margin-left: 8px;
      cursor: pointer;
      text-decoration: underline;
    }
    label.upload input {
      position: absolute;
      width: 1px;
      height: 1px;
      opacity: 0;
    }
    label.upload:focus-within {
      outline: 2px solid var(--ps-igniter);
    }
    fieldset {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      padding: 12px 16px;
      margin: 0 0 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductAdmin {
  private readonly api = inject(ShopAdminApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly site = inject(SiteNames);
  protected readonly stateLabels = RUN_STATE_LABELS;
  protected readonly products = rxResource({ stream: () => this.api.products() });
  protected readonly problem = signal<string | null>(null);

  protected readonly form = this.fb.group({
    name: ['', [Validators.required, Validators.minLength(2)]],
    description: [''],
    price: ['', [Validators.required, Validators.pattern(/^\d+(\.\d{1,2})?$/)]],
    weightGrams: [200, [Validators.required, Validators.min(1)]],
    maxPerOrder: [20, MAX_PER_ORDER_VALIDATORS],
    sizes: ['S, M, L, XL', Validators.required],
    limited: [true],
    cap: [100, Validators.min(1)],
    opensAt: [''],
    closesAt: [''],
  });

  protected limitSaved(name: string, limit: number): void {
    this.snackBar.open(`${name}: at most ${limit} per order.`, undefined, { duration: 3000 });
    this.products.reload();
  }

  protected async setActive(p: Product & { active: boolean }, active: boolean): Promise<void> {
    await firstValueFrom(this.api.editProduct(p.id, { active }));
    this.products.reload();
  }

  /** Uploads an image (the server checks its bytes and makes the thumbnail) and adds it to the product. */
  protected async addImage(p: Product, input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    if (!file) return;
    try {
      const stored = await firstValueFrom(this.api.uploadImage(file));
      await firstValueFrom(
        this.api.editProduct(p.id, {
          images: [...p.images, { url: stored.url, thumbnailUrl: stored.thumbnailUrl, alt: p.name }],
        }),
      );
      this.snackBar.open(`Image added to ${p.name}.`, undefined, { duration: 3000 });
      this.products.reload();
    } finally {
      input.value = '';
    }
  }

  protected async create(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const v = this.form.getRawValue();
    const zone = this.products.value()?.timeZone ?? 'UTC';
    this.problem.set(null);
    const body = {
      name: v.name,
      description: v.description,
      priceCents: dollarsToCents(v.price),
      weightGrams: Number(v.weightGrams),
      maxPerOrder: Number(v.maxPerOrder),
      variants: v.sizes
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean)
        .map((label) => ({ label, ...(v.limited ? {} : { stock: 0 }) })),
      ...(v.limited
        ? {
            run: {
              cap: Number(v.cap),
              opensAt: wallTimeToIso(v.opensAt, zone),
              closesAt: wallTimeToIso(v.closesAt, zone),
            },
          }
        : {}),
    };
    try {
      await firstValueFrom(this.api.createProduct(body));
      this.snackBar.open(`${v.name} created.`, undefined, { duration: 3000 });
      this.form.reset();
      this.products.reload();
    } catch (err) {
      this.problem.set(
        applyServerErrors(this.form, err, {
          priceCents: 'price',
          variants: 'sizes',
          'run.cap': 'cap',
          'run.opensAt': 'opensAt',
          'run.closesAt': 'closesAt',
        }),
      );
    }
  }
}
