import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { HttpErrorResponse } from '@angular/common/http';
import { catchError, firstValueFrom, of, throwError } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { applyServerErrors } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { MoneyPipe } from '../shared/money-pipe';
import { FlyingCaution } from './flying-caution';
import { JoinForm } from './join-form';
import { MembershipApi, type Membership } from './membership-api';
import { TEST_CARDS } from './test-cards';
import { SiteNames } from '../core/site-names';

const STATUS_TEXT: Record<Membership['status'], string> = {
  pending: 'Waiting for the first payment',
  active: 'Paid up',
  lapsing: 'In grace: renew soon',
  lapsed: 'Lapsed',
};

/** Club dues: join when new, otherwise the member's status, renewal and auto-renew. */
@Component({
  selector: 'ps-membership-home',
  imports: [ReactiveFormsModule, RouterLink, DatePipe, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatSlideToggleModule, FieldErrorPipe, MoneyPipe, FlyingCaution, JoinForm],
  templateUrl: './membership-home.html',
  styleUrl: './membership-forms.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MembershipHome {
  private readonly api = inject(MembershipApi);
  protected readonly session = inject(SessionStore);
  protected readonly site = inject(SiteNames);

  protected readonly cards = TEST_CARDS;
  protected readonly statusText = STATUS_TEXT;
  protected readonly policy = rxResource({ stream: () => this.api.policy() });
  /** null means "no membership yet"; other failures surface as errors. */
  protected readonly mine = rxResource({
    params: () => (this.session.signedIn() ? true : undefined),
    stream: () => this.api.me().pipe(catchError((err) => (err instanceof HttpErrorResponse && err.status === 404 ? of(null) : throwError(() => err)))),
  });
  protected readonly membership = computed(() => this.mine.value()?.membership ?? null);
  protected readonly quote = rxResource({ params: () => this.membership()?.planId, stream: ({ params }) => this.api.quote(params) });

  protected readonly renewForm = inject(NonNullableFormBuilder).group({
    paymentToken: [''],
    waiverAccepted: [false],
    waiverVersion: [''],
  });
  protected readonly autoRenewCard = inject(NonNullableFormBuilder).control('');
  protected readonly detailsForm = inject(NonNullableFormBuilder).group({ associationNumber: [''], associationExpires: [''], certificationLevel: ['none'], certificationDate: [''] });
  protected readonly editingDetails = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly busy = signal(false);

  protected joined(m: Membership): void {
    this.notice.set(`Welcome aboard. Your member number is ${m.memberNumber}; your dues run to ${m.termEnd}.`);
    this.mine.reload();
  }

  protected async renew(): Promise<void> {
    const m = this.membership();
    const policy = this.policy.value();
    if (!m || !policy) return;
    const v = this.renewForm.getRawValue();
    if (!m.waiverCurrent && !v.waiverAccepted) {
      this.renewForm.controls.waiverAccepted.setErrors({ required: true });
      this.renewForm.controls.waiverAccepted.markAsTouched();
      return;
    }
    if (!v.paymentToken && !m.hasSavedCard) {
      this.renewForm.controls.paymentToken.setErrors({ required: true });
      this.renewForm.controls.paymentToken.markAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    try {
      const res = await firstValueFrom(
        this.api.renew({ ...(v.paymentToken ? { paymentToken: v.paymentToken } : {}), ...(!m.waiverCurrent ? { waiverVersion: policy.waiverVersion, safetyCodeVersion: policy.safetyCodeVersion } : {}) }),
      );
      this.notice.set(`Renewed. Your dues now run to ${res.membership.termEnd}.`);
      this.renewForm.reset();
      this.mine.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.renewForm, err));
    } finally {
      this.busy.set(false);
    }
  }

  protected editDetails(m: Membership): void {
    this.detailsForm.reset({ associationNumber: m.associationNumber ?? '', associationExpires: m.associationExpires ?? '', certificationLevel: m.certificationLevel, certificationDate: m.certificationDate ?? '' });
    this.editingDetails.set(true);
  }

  protected async saveDetails(): Promise<void> {
    this.problem.set(null);
    const v = this.detailsForm.getRawValue();
    try {
      await firstValueFrom(this.api.updateProfile({ associationNumber: v.associationNumber || null, associationExpires: v.associationExpires || null, certificationLevel: v.certificationLevel, certificationDate: v.certificationDate || null }));
      this.notice.set('Association and certification details saved.');
      this.editingDetails.set(false);
      this.mine.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.detailsForm, err));
    }
  }

  protected async setAutoRenew(on: boolean): Promise<void> {
    this.problem.set(null);
    try {
      await firstValueFrom(this.api.setAutoRenew(on, this.autoRenewCard.value || undefined));
      this.notice.set(on ? 'Auto-renew is on.' : 'Auto-renew is off.');
      this.autoRenewCard.reset();
    } catch (err) {
      this.problem.set(applyServerErrors(this.renewForm, err));
    } finally {
      this.mine.reload();
    }
  }
}
