import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { applyServerErrors } from '../../core/api-error';
import { SHIPPING_METHOD_LABELS } from '@contracts/labels/shipping-methods';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { LabelPipe } from '../../shared/label-pipe';
import { PROVINCES, type Province } from '@contracts/shop/provinces';
import type { StaffShippingMethod } from '@contracts/shop/staff-shop-answers';
import { ShopAdminApi } from '../orders/shop-admin-api';
import { formatBrackets, parseBrackets } from './brackets';
import { OWN_TAX, TAX_NUMBER_FIELDS, taxNumbersFromForm } from './tax-numbers';

/** Shop settings: tax position, member discount, printer rules, shipping methods and their weight brackets. */
@Component({
  selector: 'ps-shop-settings',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    FieldErrorPipe,
    LabelPipe,
  ],
  templateUrl: './shop-settings.html',
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(220px, 1fr));
      gap: 0 16px;
    }
    fieldset {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      margin: 0 0 20px;
      padding: 12px 16px;
    }
    legend {
      font-weight: 600;
      padding: 0 6px;
    }
    .method {
      display: grid;
      grid-template-columns: 1fr 2fr auto auto;
      gap: 12px;
      align-items: center;
    }
    @media (max-width: 800px) {
      .method {
        grid-template-columns: 1fr;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShopSettingsPage {
  protected readonly methodLabels = SHIPPING_METHOD_LABELS;
  private readonly api = inject(ShopAdminApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly provinces = PROVINCES;
  protected readonly ownTax = OWN_TAX;

  protected readonly form = this.fb.group({
    sellerProvince: ['MB' as Province, Validators.required],
    gstHstRegistered: [true],
    sellerName: [''],
    gstHstNumber: [''],
    taxNumberBC: [''],
    taxNumberMB: [''],
    taxNumberQC: [''],
    taxNumberSK: [''],
    provincialRegistrations: [[] as Province[]],
    shippingBC: [false],
    shippingMB: [false],
    shippingQC: [false],
    shippingSK: [false],
    memberDiscountPercent: [10, [Validators.required, Validators.min(0), Validators.max(90)]],
    sparesPercent: [5, [Validators.required, Validators.min(0), Validators.max(100)]],
    packMultiple: [6, [Validators.required, Validators.min(1)]],
    minimumPerDesign: [12, [Validators.required, Validators.min(0)]],
    staffEmail: ['', [Validators.required, Validators.email]],
    carrier: ['', Validators.maxLength(60)],
  });
  protected readonly methods = signal<(StaffShippingMethod & { text: string; problem: string | null })[]>([]);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    void this.load();
  }

  private async load(): Promise<void> {
    const s = await firstValueFrom(this.api.settings());
    const n = s.provincialTaxNumbers ?? {};
    this.form.patchValue({
      ...s,
      taxNumberBC: n['BC'] ?? '',
      taxNumberMB: n['MB'] ?? '',
      taxNumberQC: n['QC'] ?? '',
      taxNumberSK: n['SK'] ?? '',
      shippingBC: !!s.provincialTaxOnShipping['BC'],
      shippingMB: !!s.provincialTaxOnShipping['MB'],
      shippingQC: !!s.provincialTaxOnShipping['QC'],
      shippingSK: !!s.provincialTaxOnShipping['SK'],
    });
    this.methods.set(
      (await firstValueFrom(this.api.shippingMethods())).map((m) => ({
        ...m,
        text: formatBrackets(m.brackets),
        problem: null,
      })),
    );
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const v = this.form.getRawValue();
    this.problem.set(null);
    try {
      await firstValueFrom(
        this.api.saveSettings({
          sellerProvince: v.sellerProvince,
          sellerName: v.sellerName,
          gstHstRegistered: v.gstHstRegistered,
          gstHstNumber: v.gstHstNumber,
          provincialRegistrations: v.provincialRegistrations,
          provincialTaxNumbers: taxNumbersFromForm({
            BC: v.taxNumberBC,
            MB: v.taxNumberMB,
            QC: v.taxNumberQC,
            SK: v.taxNumberSK,
          }),
          provincialTaxOnShipping: { BC: v.shippingBC, MB: v.shippingMB, QC: v.shippingQC, SK: v.shippingSK },
          memberDiscountPercent: Number(v.memberDiscountPercent),
          sparesPercent: Number(v.sparesPercent),
          packMultiple: Number(v.packMultiple),
          minimumPerDesign: Number(v.minimumPerDesign),
          staffEmail: v.staffEmail,
          carrier: v.carrier,
        }),
      );
      this.snackBar.open('Shop settings saved.', undefined, { duration: 3000 });
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err, TAX_NUMBER_FIELDS));
    }
  }

  protected editMethod(id: number, patch: Partial<{ name: string; text: string; active: boolean }>): void {
    this.methods.update((list) => list.map((m) => (m.id === id ? { ...m, ...patch } : m)));
  }

  protected async saveMethod(id: number): Promise<void> {
    const m = this.methods().find((x) => x.id === id)!;
    const brackets = parseBrackets(m.text);
    if (!brackets) {
      this.methods.update((l) =>
        l.map((x) =>
          x.id === id ? { ...x, problem: 'Write brackets like "500 g: 9.00, 1500 g: 14.00, any: 22.00".' } : x,
        ),
      );
      return;
    }
    try {
      await firstValueFrom(this.api.saveShippingMethod({ ...m, brackets }));
      this.methods.update((l) => l.map((x) => (x.id === id ? { ...x, brackets, problem: null } : x)));
      this.snackBar.open(`${m.name} saved.`, undefined, { duration: 3000 });
    } catch {
      this.methods.update((l) =>
        l.map((x) => (x.id === id ? { ...x, problem: 'Not saved: check the name and brackets.' } : x)),
      );
    }
  }
}
