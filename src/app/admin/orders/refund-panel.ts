import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { FormArray, FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { applyServerErrors } from '../../core/api-error';
import { dollarsToCents } from '../../shared/dollars';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { newRequestKey } from '../../shared/request-key';
import { RefundConfirmDialog, type RefundConfirmData } from './refund-confirm-dialog';
import type { StaffOrder, StaffRefund } from '@contracts/shop/staff-order-answers';
import type { RefundInput } from '@contracts/shop/staff-order-schemas';
import { ShopAdminApi } from './shop-admin-api';

/**
 * The refund form of an order: tick lines and units, shipping, or type a goodwill amount; the server computes the
 * refund with its tax lines, the treasurer confirms it in a dialog, and only then does it go to the card.
 */
@Component({
  selector: 'ps-refund-panel',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    FieldErrorPipe,
    MoneyPipe,
  ],
  templateUrl: './refund-panel.html',
  styleUrl: './refund-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RefundPanel {
  private readonly api = inject(ShopAdminApi);
  private readonly dialog = inject(MatDialog);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly formDirective = viewChild(FormGroupDirective);
  readonly order = input.required<StaffOrder>();
  /** Emits the refund once the processor has it. */
  readonly refunded = output<StaffRefund>();

  protected readonly form = this.fb.group({
    lines: this.fb.array<ReturnType<RefundPanel['lineGroup']>>([]),
    shipping: [false],
    amount: ['', Validators.pattern(/^\d+(\.\d{1,2})?$/)],
    restock: [false],
    reason: ['', Validators.maxLength(400)],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly left = computed(() => this.order().totalCents - this.order().refundedCents);
  protected readonly shippingLeft = computed(() => this.order().shippingCents - this.order().shippingRefundedCents);
  protected readonly openUnits = computed(() => this.order().items.map((i) => i.quantity - i.refundedQuantity));

  constructor() {
    // A fresh order (first load, or after a refund) gets a fresh form: no stale ticks, values or errors.
    effect(() => this.rebuild(this.order()));
  }

  protected get lines(): FormArray<ReturnType<RefundPanel['lineGroup']>> {
    return this.form.controls.lines;
  }

  private lineGroup(open: number) {
    return this.fb.group({
      ticked: [{ value: false, disabled: open === 0 }],
      quantity: [Math.max(1, open), this.unitRules(open)],
    });
  }

  private unitRules(open: number) {
    return [Validators.required, Validators.min(1), Validators.max(Math.max(1, open))];
  }

  private rebuild(o: StaffOrder): void {
    const open = o.items.map((i) => i.quantity - i.refundedQuantity);
    // Same lines: keep the controls the rows are bound to and only reset them (replaced controls would leave the
    // rows showing the old ticks).
    if (this.lines.length === open.length) {
      this.lines.controls.forEach((g, n) => {
        g.controls.quantity.setValidators(this.unitRules(open[n]));
        if (open[n] === 0) g.controls.ticked.disable();
        else g.controls.ticked.enable();
      });
    } else {
      this.lines.clear();
      for (const n of open) this.lines.push(this.lineGroup(n));
    }
    const lines = open.map((n) => ({ ticked: false, quantity: Math.max(1, n) }));
    const fresh = { lines, shipping: false, amount: '', restock: false, reason: '' };
    // resetForm also clears the directive's "submitted" state, which would otherwise keep showing errors.
    const directive = this.formDirective();
    if (directive?.form) directive.resetForm(fresh);
    else this.form.reset(fresh);
    this.problem.set(null);
  }

  /** The request the form stands for, or null (with the reason shown) when it asks for nothing. */
  private ask(): { ask: RefundInput; formIndex: number[] } | null {
    const v = this.form.getRawValue();
    const ticked = v.lines.map((l, formIndex) => ({ ...l, formIndex })).filter((l) => l.ticked);
    const lines = ticked.map((l) => ({
      orderItemId: this.order().items[l.formIndex].id,
      quantity: Number(l.quantity),
    }));
    const byLines = lines.length > 0 || v.shipping;
    if (!byLines && !v.amount) {
      this.problem.set('Tick a line or the shipping, or enter an amount.');
      return null;
    }
    const ask: RefundInput = {
      lines,
      shipping: v.shipping,
      restock: byLines && v.restock,
      ...(v.reason.trim() ? { reason: v.reason.trim() } : {}),
      ...(!byLines ? { amountCents: dollarsToCents(v.amount) } : {}),
    };
    return { ask, formIndex: ticked.map((l) => l.formIndex) };
  }

  /** Server field names for the sent lines map back to the form's rows (only ticked rows are sent). */
  private renames(formIndex: number[]): Record<string, string> {
    return Object.fromEntries(
      formIndex
        .flatMap((f, sent) => [
          [`lines.${sent}.quantity`, `lines.${f}.quantity`],
          [`lines.${sent}.orderItemId`, `lines.${f}.quantity`],
        ])
        .concat([['amountCents', 'amount']]),
    );
  }

  protected async review(): Promise<void> {
    this.problem.set(null);
    this.form.markAllAsTouched();
    // Only ticked lines count: units typed on a line left unticked do not hold the refund up.
    const c = this.form.controls;
    if (
      c.amount.invalid ||
      c.reason.invalid ||
      this.lines.controls.some((l) => l.controls.ticked.value && l.controls.quantity.invalid)
    )
      return;
    const built = this.ask();
    if (!built) return;
    this.busy.set(true);
    try {
      const preview = await firstValueFrom(this.api.refundPreview(this.order().id, built.ask));
      const items = this.order().items;
      const data: RefundConfirmData = {
        orderNumber: this.order().number,
        preview,
        lines: preview.lines.map((l) => {
          const item = items.find((i) => i.id === l.orderItemId)!;
          return {
            label: `${item.productName} (${item.variantLabel})`,
            quantity: l.quantity,
            goodsCents: l.goodsCents,
          };
        }),
        unitsBackOnSale: built.ask.restock ? preview.lines.reduce((s, l) => s + l.quantity, 0) : 0,
      };
      // One key per confirmed refund: a second click or a retry of this request refunds once.
      const key = newRequestKey();
      const confirmed = await firstValueFrom(
        this.dialog.open(RefundConfirmDialog, { data, width: 'min(520px, 96vw)', autoFocus: 'dialog' }).afterClosed(),
      );
      if (!confirmed) return;
      const done = await firstValueFrom(
        this.api.refund(this.order().id, { ...built.ask, amountCents: preview.totalCents }, key),
      );
      this.refunded.emit(done.refund);
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err, this.renames(built.formIndex)));
    } finally {
      this.busy.set(false);
    }
  }
}
