import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  effect,
  ElementRef,
  inject,
  Injector,
  input,
  output,
  signal,
  untracked,
} from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { applyServerErrors } from '../../core/api-error';
import type { ApiErrorBody } from '../../core/user';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import type { Plan } from '@contracts/membership/membership-answers';
import { ELIGIBILITY_LABELS, MembersApi } from './members-api';
import type { PlanChanges } from '@contracts/membership/staff-member-schemas';
import { centsToDollars, dollarsToCents } from '../../shared/dollars';

// Six dollar digits stay under the server's cap on amounts.
const DOLLARS = /^\d{1,6}(\.\d{1,2})?$/;

/** The server names amounts in cents; the form asks in dollars. */
const DOLLAR_FIELDS = { duesCents: 'dues', joiningFeeCents: 'joiningFee' } as const;

let nextId = 0;

/** Adds a plan or edits one: name, dues and joining fee (typed in dollars, sent in cents), on or off. */
@Component({
  selector: 'ps-plan-form',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    FieldErrorPipe,
  ],
  templateUrl: './plan-form.html',
  styleUrl: './members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanForm {
  private readonly api = inject(MembersApi);
  private readonly fb = inject(NonNullableFormBuilder);

  /** The plan to edit; without one the form adds a plan. */
  readonly plan = input<Plan | null>(null);
  /** Where a new plan goes in the lists. */
  readonly nextSortOrder = input(0);
  readonly saved = output<Plan>();
  readonly cancelled = output<void>();

  protected readonly headingId = `plan-form-${++nextId}`;
  protected readonly eligibilities = Object.keys(ELIGIBILITY_LABELS) as Plan['eligibility'][];
  protected readonly labels = ELIGIBILITY_LABELS;
  protected readonly form = this.fb.group({
    code: ['', [Validators.required, Validators.pattern(/^[a-z0-9-]{2,32}$/i)]],
    name: ['', [Validators.required, Validators.maxLength(80)]],
    description: ['', Validators.maxLength(400)],
    eligibility: this.fb.control<Plan['eligibility']>('any'),
    dues: ['', [Validators.required, Validators.pattern(DOLLARS)]],
    joiningFee: ['0.00', [Validators.required, Validators.pattern(DOLLARS)]],
    active: [true],
    sortOrder: [0, [Validators.required, Validators.min(0), Validators.max(1000)]],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly saving = signal(false);

  constructor() {
    const host = inject<ElementRef<HTMLElement>>(ElementRef);
    const injector = inject(Injector);
    effect(() => {
      const p = this.plan();
      untracked(() => this.load(p));
      // Keyboard users land in the form they opened, also when they switch to another plan.
      afterNextRender(() => host.nativeElement.querySelector<HTMLElement>('input:not([disabled])')?.focus(), {
        injector,
      });
    });
  }

  private load(p: Plan | null): void {
    this.form.reset(
      p
        ? {
            code: p.code,
            name: p.name,
            description: p.description,
            eligibility: p.eligibility,
            dues: centsToDollars(p.duesCents),
            joiningFee: centsToDollars(p.joiningFeeCents),
            active: p.active,
            sortOrder: p.sortOrder,
          }
        : {
            code: '',
            name: '',
            description: '',
            eligibility: 'any',
            dues: '',
            joiningFee: '0.00',
            active: true,
            sortOrder: this.nextSortOrder(),
          },
    );
    // Members and payments refer to the code, and the join rules to who may hold it.
    for (const c of [this.form.controls.code, this.form.controls.eligibility]) {
      if (p) c.disable();
      else c.enable();
    }
    this.problem.set(null);
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.saving()) return;
    this.problem.set(null);
    const v = this.form.getRawValue();
    const changes: PlanChanges = {
      name: v.name,
      description: v.description,
      duesCents: dollarsToCents(v.dues),
      joiningFeeCents: dollarsToCents(v.joiningFee),
      active: v.active,
      sortOrder: Number(v.sortOrder),
    };
    const p = this.plan();
    this.saving.set(true);
    try {
      const res = await firstValueFrom(
        p
          ? this.api.updatePlan(p.id, changes)
          : this.api.createPlan({ ...changes, code: v.code, eligibility: v.eligibility }),
      );
      this.saved.emit(res.plan);
    } catch (err) {
      this.problem.set(this.showErrors(err));
    } finally {
      this.saving.set(false);
    }
  }

  private showErrors(err: unknown): string {
    const message = applyServerErrors(this.form, err);
    const fields = err instanceof HttpErrorResponse ? (err.error as ApiErrorBody | null)?.error?.fields : undefined;
    for (const [server, control] of Object.entries(DOLLAR_FIELDS)) {
      const text = fields?.[server];
      if (!text) continue;
      this.form.controls[control].setErrors({ server: text });
      this.form.controls[control].markAsTouched();
    }
    return message;
  }
}
