import { ChangeDetectionStrategy, Component, inject, input, numberAttribute, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { JsonPipe, NgTemplateOutlet } from '@angular/common';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { applyServerErrors } from '../../core/api-error';
import {
  DUES_ENTRY_LABELS,
  DUES_PAYMENT_STATUS_LABELS,
  MEMBERSHIP_AUDIT_LABELS,
  MEMBERSHIP_STATUS_LABELS,
} from '@contracts/labels/membership-statuses';
import { PAYMENT_METHOD_LABELS } from '@contracts/labels/payment-methods';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { LabelPipe } from '../../shared/label-pipe';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { newRequestKey } from '../../shared/request-key';
import { MembersApi } from './members-api';
import type { MemberDetail as MemberDetailView, PaymentLine } from '@contracts/membership/staff-member-answers';
import type { ManualPaymentRequest, VerifiedPart } from '@contracts/membership/staff-member-schemas';
import { centsToDollars, dollarsToCents } from '../../shared/dollars';

/** Server errors on `amountCents` belong beside the dollars field. */
const AMOUNT_FIELD = { amountCents: 'amount' };

/** One member: record (with staff checks of the flying claims), family, payments with refunds, manual payment entry and the audit of changes. */
@Component({
  selector: 'ps-member-detail',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    ClubDatePipe,
    LabelPipe,
    JsonPipe,
    NgTemplateOutlet,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    EmptyState,
    FieldErrorPipe,
    MoneyPipe,
  ],
  templateUrl: './member-detail.html',
  styleUrl: './members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MemberDetail {
  private readonly api = inject(MembersApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly labels = {
    status: MEMBERSHIP_STATUS_LABELS,
    payment: DUES_PAYMENT_STATUS_LABELS,
    entry: DUES_ENTRY_LABELS,
    method: PAYMENT_METHOD_LABELS,
    audit: MEMBERSHIP_AUDIT_LABELS,
  };

  /** Route parameter. */
  readonly id = input.required({ transform: numberAttribute });

  protected readonly detail = rxResource({ params: () => this.id(), stream: ({ params }) => this.api.detail(params) });
  protected readonly paymentForm = this.fb.group({
    amount: ['', [Validators.required, Validators.pattern(/^\d+(\.\d{1,2})?$/)]],
    method: ['cash' as ManualPaymentRequest['method'], Validators.required],
    receiptNumber: ['', [Validators.required, Validators.maxLength(40)]],
    note: [''],
  });
  protected readonly refundForm = this.fb.group({
    amount: ['', [Validators.required, Validators.pattern(/^\d+(\.\d{1,2})?$/)]],
    reason: ['', Validators.required],
  });
  protected readonly verifyForm = this.fb.group({
    against: ['', [Validators.required, Validators.minLength(3), Validators.maxLength(200)]],
  });
  protected readonly verifying = signal<VerifiedPart | null>(null);
  protected readonly refunding = signal<PaymentLine | null>(null);
  // One key per refund form opened: submitting it twice (or retrying) refunds once.
  private refundKey = '';
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);

  protected async recordPayment(formDir: FormGroupDirective): Promise<void> {
    this.paymentForm.markAllAsTouched();
    if (this.paymentForm.invalid) return;
    this.problem.set(null);
    const v = this.paymentForm.getRawValue();
    try {
      await firstValueFrom(
        this.api.recordPayment(this.id(), {
          amountCents: dollarsToCents(v.amount),
          method: v.method,
          receiptNumber: v.receiptNumber,
          ...(v.note ? { note: v.note } : {}),
        }),
      );
      this.notice.set(`Payment ${v.receiptNumber} recorded; a receipt is on its way to the member.`);
      formDir.resetForm({ amount: '', method: 'cash', receiptNumber: '', note: '' });
      this.detail.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.paymentForm, err, AMOUNT_FIELD));
    }
  }

  protected startVerify(what: VerifiedPart): void {
    this.verifying.set(what);
    this.verifyForm.reset({ against: '' });
  }

  /** Sends the values on screen with the check, so a value the member changed meanwhile is not marked checked. */
  protected async verify(d: MemberDetailView): Promise<void> {
    const what = this.verifying();
    this.verifyForm.markAllAsTouched();
    if (!what || this.verifyForm.invalid) return;
    this.problem.set(null);
    const m = d.member;
    const seen =
      what === 'association'
        ? { associationNumber: m.associationNumber, associationExpires: m.associationExpires }
        : { certificationLevel: m.certificationLevel };
    try {
      await firstValueFrom(
        this.api.verify(this.id(), { what, against: this.verifyForm.getRawValue().against, ...seen }),
      );
      this.notice.set(
        what === 'association' ? 'Association membership marked checked.' : 'Certification marked checked.',
      );
      this.verifying.set(null);
      this.detail.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.verifyForm, err));
    }
  }

  protected async withdraw(what: VerifiedPart): Promise<void> {
    this.problem.set(null);
    try {
      await firstValueFrom(this.api.withdrawVerification(this.id(), what));
      this.notice.set('The check was taken back; the value is a claim again.');
      this.detail.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.verifyForm, err));
    }
  }

  protected startRefund(p: PaymentLine): void {
    this.refunding.set(p);
    this.refundKey = newRequestKey();
    this.refundForm.reset({ amount: centsToDollars(p.amountCents), reason: '' });
  }

  protected async refund(): Promise<void> {
    const p = this.refunding();
    this.refundForm.markAllAsTouched();
    if (!p || this.refundForm.invalid) return;
    this.problem.set(null);
    try {
      const v = this.refundForm.getRawValue();
      await firstValueFrom(
        this.api.refund(
          this.id(),
          { paymentId: p.id, amountCents: dollarsToCents(v.amount), reason: v.reason },
          this.refundKey,
        ),
      );
      this.notice.set('Refund recorded.');
      this.refunding.set(null);
      this.detail.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.refundForm, err, AMOUNT_FIELD));
    }
  }
}
