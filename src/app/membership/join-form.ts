import { ClubDatePipe } from '../shared/club-date-pipe';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  inject,
  Injector,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { applyServerErrors } from '../core/api-error';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { MoneyPipe } from '../shared/money-pipe';
import type { Membership } from '@contracts/membership/membership-answers';
import { MembershipApi } from './membership-api';
import { provideClubDates, toIsoDate } from '../shared/club-date-adapter';
import { focusFirstInvalid } from '../shared/focus-first-invalid';
import { CardChoice } from './card-choice';

/** The join form: plan, member profile, family, association and certification, waiver, card and auto-renew. */
@Component({
  selector: 'ps-join-form',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    FieldErrorPipe,
    MoneyPipe,
    ClubDatePipe,
    CardChoice,
  ],
  providers: [provideClubDates()],
  templateUrl: './join-form.html',
  styleUrl: './membership-forms.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JoinForm {
  private readonly api = inject(MembershipApi);
  private readonly fb = inject(NonNullableFormBuilder);

  /** Emits the new membership once the first payment has gone through. */
  readonly joined = output<Membership>();

  private readonly injector = inject(Injector);
  private readonly formEl = viewChild.required<ElementRef<HTMLFormElement>>('formEl');
  private readonly cardChoice = viewChild.required(CardChoice);
  protected readonly plans = rxResource({ stream: () => this.api.plans() });
  protected readonly policy = rxResource({ stream: () => this.api.policy() });
  protected readonly form = this.fb.group({
    planId: this.fb.control<number | null>(null, Validators.required),
    profile: this.fb.group({
      legalName: ['', [Validators.required, Validators.maxLength(120)]],
      dateOfBirth: this.fb.control<Date | null>(null, Validators.required),
      address: ['', [Validators.required, Validators.maxLength(400)]],
      phone: ['', Validators.required],
      emergencyContact: ['', Validators.required],
      associationNumber: [''],
      associationExpires: this.fb.control<Date | null>(null),
      certificationLevel: ['none'],
      certificationDate: this.fb.control<Date | null>(null),
      familyMembers: this.fb.array<FormGroup>([]),
    }),
    waiverAccepted: [false, Validators.requiredTrue],
    waiverVersion: [''],
    paymentToken: ['', Validators.required],
    autoRenew: [false],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);

  private readonly planId = toSignal(this.form.controls.planId.valueChanges, { initialValue: null });
  protected readonly selectedPlan = computed(
    () => this.plans.value()?.items.find((p) => p.id === this.planId()) ?? null,
  );
  protected readonly quote = rxResource({
    params: () => this.planId() ?? undefined,
    stream: ({ params }) => this.api.quote(params),
  });

  protected get family(): FormArray<FormGroup> {
    return this.form.controls.profile.controls.familyMembers;
  }

  protected addFamilyMember(): void {
    this.family.push(
      this.fb.group({
        name: ['', Validators.required],
        dateOfBirth: this.fb.control<Date | null>(null, Validators.required),
      }),
    );
  }

  protected removeFamilyMember(i: number): void {
    this.family.removeAt(i);
  }

  protected async submit(): Promise<void> {
    this.form.markAllAsTouched();
    const policy = this.policy.value();
    if (this.form.invalid || !policy) {
      focusFirstInvalid(this.formEl().nativeElement, this.injector);
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    const v = this.form.getRawValue();
    try {
      const paymentToken = await this.cardChoice().token();
      const family = this.selectedPlan()?.eligibility === 'family' ? v.profile.familyMembers : [];
      const res = await firstValueFrom(
        this.api.join({
          planId: v.planId!,
          profile: {
            ...v.profile,
            dateOfBirth: toIsoDate(v.profile.dateOfBirth),
            associationExpires: toIsoDate(v.profile.associationExpires),
            certificationDate: toIsoDate(v.profile.certificationDate),
            familyMembers: family.map((p) => ({
              name: p['name'] as string,
              dateOfBirth: toIsoDate(p['dateOfBirth'] as Date | null),
            })),
          },
          waiverVersion: policy.waiverVersion,
          safetyCodeVersion: policy.safetyCodeVersion,
          paymentToken: paymentToken ?? '',
          autoRenew: v.autoRenew,
        }),
      );
      this.joined.emit(res.membership);
    } catch (err) {
      // The processor's frame shows its own words beside the card; everything else goes on the fields.
      this.problem.set(
        err instanceof HttpErrorResponse || !(err instanceof Error) ? applyServerErrors(this.form, err) : err.message,
      );
      focusFirstInvalid(this.formEl().nativeElement, this.injector);
    } finally {
      this.busy.set(false);
    }
  }
}
