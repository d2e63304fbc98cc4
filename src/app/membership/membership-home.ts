import { formatDay } from '@contracts/dates/club-dates';
import { ClubDatePipe } from '../shared/club-date-pipe';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, viewChild } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { HttpErrorResponse } from '@angular/common/http';
import { catchError, firstValueFrom, of, throwError } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDatepickerModule } from '@angular/material/datepicker';
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
import type { Membership } from '@contracts/membership/membership-answers';
import { MembershipApi } from './membership-api';
import { fromIsoDate, provideClubDates, toIsoDate } from '../shared/club-date-adapter';
import { CardChoice, savedCardText } from './card-choice';
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
  imports: [
    ReactiveFormsModule,
    RouterLink,
    ClubDatePipe,
    MatButtonModule,
    MatCheckboxModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatSlideToggleModule,
    FieldErrorPipe,
    MoneyPipe,
    FlyingCaution,
    JoinForm,
    CardChoice,
  ],
  providers: [provideClubDates()],
  templateUrl: './membership-home.html',
  styleUrl: './membership-forms.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MembershipHome {
  private readonly api = inject(MembershipApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly session = inject(SessionStore);
  protected readonly site = inject(SiteNames);

  protected readonly savedCardText = savedCardText;
  protected readonly statusText = STATUS_TEXT;
  protected readonly policy = rxResource({ stream: () => this.api.policy() });
  /** null means "no membership yet"; other failures surface as errors. */
  protected readonly mine = rxResource({
    params: () => (this.session.signedIn() ? true : undefined),
    stream: () =>
      this.api
        .me()
        .pipe(
          catchError((err) =>
            err instanceof HttpErrorResponse && err.status === 404 ? of(null) : throwError(() => err),
          ),
        ),
  });
  protected readonly membership = computed(() => this.mine.value()?.membership ?? null);
  protected readonly quote = rxResource({
    params: () => this.membership()?.planId,
    stream: ({ params }) => this.api.quote(params),
  });

  private readonly renewCard = viewChild('renewCard', { read: CardChoice });
  private readonly autoCard = viewChild('autoCard', { read: CardChoice });
  protected readonly renewForm = this.fb.group({
    paymentToken: [''],
    waiverAccepted: [false],
    waiverVersion: [''],
  });
  /** The auto-renew switch and the card to keep on file; the switch shows what the server last said. */
  protected readonly autoForm = this.fb.group({ paymentToken: [''], autoRenew: [false] });
  protected readonly autoProblem = signal<string | null>(null);
  protected readonly detailsForm = this.fb.group({
    associationNumber: [''],
    associationExpires: this.fb.control<Date | null>(null),
    certificationLevel: ['none'],
    certificationDate: this.fb.control<Date | null>(null),
  });
  protected readonly editingDetails = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly busy = signal(false);

  constructor() {
    effect(() => {
      const m = this.membership();
      if (m) this.autoForm.controls.autoRenew.setValue(m.autoRenew, { emitEvent: false });
    });
  }

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
      const paymentToken = await this.renewCard()?.token();
      const res = await firstValueFrom(
        this.api.renew({
          ...(paymentToken ? { paymentToken } : {}),
          ...(!m.waiverCurrent
            ? { waiverVersion: policy.waiverVersion, safetyCodeVersion: policy.safetyCodeVersion }
            : {}),
        }),
      );
      this.notice.set(
        res.membership.termEnd ? `Renewed. Your dues now run to ${formatDay(res.membership.termEnd)}.` : 'Renewed.',
      );
      this.renewForm.reset();
      this.mine.reload();
    } catch (err) {
      this.problem.set(
        err instanceof HttpErrorResponse || !(err instanceof Error)
          ? applyServerErrors(this.renewForm, err)
          : err.message,
      );
    } finally {
      this.busy.set(false);
    }
  }

  protected editDetails(m: Membership): void {
    this.detailsForm.reset({
      associationNumber: m.associationNumber ?? '',
      associationExpires: fromIsoDate(m.associationExpires),
      certificationLevel: m.certificationLevel,
      certificationDate: fromIsoDate(m.certificationDate),
    });
    this.editingDetails.set(true);
  }

  protected async saveDetails(): Promise<void> {
    this.problem.set(null);
    const v = this.detailsForm.getRawValue();
    try {
      await firstValueFrom(
        this.api.updateProfile({
          associationNumber: v.associationNumber || null,
          associationExpires: toIsoDate(v.associationExpires) || null,
          certificationLevel: v.certificationLevel,
          certificationDate: toIsoDate(v.certificationDate) || null,
        }),
      );
      this.notice.set('Association and certification details saved.');
      this.editingDetails.set(false);
      this.mine.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.detailsForm, err));
    }
  }

  /** Asks the server; the switch then shows its answer, and a refusal sits beside the switch and the card field. */
  protected async setAutoRenew(on: boolean): Promise<void> {
    const m = this.membership();
    if (!m) return;
    this.autoProblem.set(null);
    const toggle = this.autoForm.controls.autoRenew;
    toggle.disable({ emitEvent: false });
    try {
      const paymentToken = await this.autoCard()?.token();
      const res = await firstValueFrom(this.api.setAutoRenew(on, paymentToken));
      toggle.setValue(res.membership.autoRenew, { emitEvent: false });
      this.notice.set(res.membership.autoRenew ? 'Auto-renew is on.' : 'Auto-renew is off.');
      this.autoForm.controls.paymentToken.reset();
      this.mine.reload();
    } catch (err) {
      toggle.setValue(m.autoRenew, { emitEvent: false });
      this.autoProblem.set(
        err instanceof HttpErrorResponse || !(err instanceof Error)
          ? applyServerErrors(this.autoForm, err)
          : err.message,
      );
    } finally {
      toggle.enable({ emitEvent: false });
    }
  }
}
