import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { applyServerErrors } from '../../core/api-error';
import { clubTimeInWords } from '@contracts/dates/club-dates';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { wallTimeToIso } from '../../shared/zoned-time';
import type { Product } from '@contracts/shop/shop-answers';
import { ShopAdminApi } from '../orders/shop-admin-api';
import { dollarsToCents } from '../../shared/dollars';

const CAP = [Validators.pattern(/^\d{0,6}$/)];

/** The next run of a product that sells in runs: cap, window in the club's time, unit cost and optional size caps. */
@Component({
  selector: 'ps-run-form',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, FieldErrorPipe],
  templateUrl: './run-form.html',
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(200px, 1fr));
      gap: 0 16px;
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
export class RunForm {
  private readonly api = inject(ShopAdminApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);

  /** Products sold in runs (the only ones that can take another). */
  readonly products = input.required<Product[]>();
  readonly timeZone = input.required<string>();
  protected readonly zoneInWords = computed(() => clubTimeInWords(this.timeZone()));
  readonly added = output<void>();

  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly form = this.fb.group({
    productId: [null as number | null, Validators.required],
    name: ['', Validators.maxLength(120)],
    cap: ['', [Validators.required, Validators.pattern(/^[1-9]\d{0,5}$/)]],
    opensAt: ['', Validators.required],
    closesAt: ['', Validators.required],
    unitCost: ['', Validators.pattern(/^\d+(\.\d{1,2})?$/)],
    variantCaps: this.fb.array<ReturnType<RunForm['capGroup']>>([]),
  });

  private readonly productId = toSignal(this.form.controls.productId.valueChanges, { initialValue: null });
  protected readonly product = computed(() => this.products().find((p) => p.id === this.productId()) ?? null);

  constructor() {
    // One optional cap field per size of the chosen product.
    this.form.controls.productId.valueChanges.subscribe((id) => {
      const p = this.products().find((x) => x.id === id);
      this.form.setControl('variantCaps', this.fb.array((p?.variants ?? []).map((v) => this.capGroup(v.id, v.label))));
    });
  }

  private capGroup(variantId: number, label: string) {
    return this.fb.group({ variantId: [variantId], label: [label], cap: ['', CAP] });
  }

  protected async submit(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.busy()) return;
    const v = this.form.getRawValue();
    this.busy.set(true);
    this.problem.set(null);
    try {
      const run = await firstValueFrom(
        this.api.addRun({
          productId: v.productId!,
          ...(v.name.trim() ? { name: v.name.trim() } : {}),
          cap: Number(v.cap),
          opensAt: wallTimeToIso(v.opensAt, this.timeZone()),
          closesAt: wallTimeToIso(v.closesAt, this.timeZone()),
          ...(v.unitCost ? { unitCostCents: dollarsToCents(v.unitCost) } : {}),
          variantCaps: v.variantCaps
            .filter((c) => c.cap !== '')
            .map((c) => ({ variantId: c.variantId, cap: Number(c.cap) })),
        }),
      );
      this.snackBar.open(`${run.name} added.`, undefined, { duration: 3000 });
      this.form.reset();
      this.added.emit();
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err, { unitCostCents: 'unitCost' }));
    } finally {
      this.busy.set(false);
    }
  }
}
