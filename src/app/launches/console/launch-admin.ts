import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { apiErrorMessage, applyServerErrors } from '../../core/api-error';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import type { LaunchView } from '@contracts/launches/launch-answers';
import { LaunchesApi } from '../launches-api';

/** Reasons a launch director offers first when calling a day off; any other reason can be typed. */
const CALL_OFF_REASONS = [
  'Wind above the safe limit',
  'Fire risk (burn ban or dry field)',
  'Airspace not available',
  'Field closed (mud, snow or crops)',
];

/** The launch director's page: put launch days on the calendar, call one off with a reason, close a day. */
@Component({
  selector: 'ps-launch-admin',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    ClubDatePipe,
    EmptyState,
    FieldErrorPipe,
  ],
  templateUrl: './launch-admin.html',
  styleUrl: '../launches.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LaunchAdmin {
  private readonly api = inject(LaunchesApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly launches = rxResource({ stream: () => this.api.adminList() });
  protected readonly reasons = CALL_OFF_REASONS;
  protected readonly form = this.fb.group({
    title: ['', Validators.required],
    date: ['', Validators.required],
    startsAt: ['10:00', Validators.required],
    endsAt: ['16:00', Validators.required],
    site: this.fb.group({
      name: ['', Validators.required],
      address: [''],
      lat: this.fb.control<number | null>(null),
      lon: this.fb.control<number | null>(null),
    }),
    ceilingMetres: this.fb.control<number | null>(null),
    notes: [''],
  });
  protected readonly problem = signal<string | null>(null);
  /** The launch whose call-off form is open, and its reason. */
  protected readonly callingOff = signal<number | null>(null);
  protected readonly reason = signal('');
  protected readonly callOffProblem = signal<string | null>(null);

  protected async create(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.problem.set(null);
    const v = this.form.getRawValue();
    try {
      await firstValueFrom(
        this.api.create({ ...v, site: { ...v.site, address: v.site.address || null }, notes: v.notes || null }),
      );
      this.form.reset();
      this.launches.reload();
      this.snackBar.open('Launch day added to the calendar.', undefined, { duration: 3000 });
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    }
  }

  protected openCallOff(l: LaunchView): void {
    this.callingOff.set(l.id);
    this.reason.set('');
    this.callOffProblem.set(null);
  }

  protected async callOff(l: LaunchView): Promise<void> {
    try {
      const res = await firstValueFrom(this.api.callOff(l.id, this.reason()));
      this.callingOff.set(null);
      this.launches.reload();
      this.snackBar.open(
        `Called off; ${res.notified} ${res.notified === 1 ? 'person' : 'people'} told by e-mail.`,
        undefined,
        { duration: 4000 },
      );
    } catch (err) {
      this.callOffProblem.set(apiErrorMessage(err));
    }
  }

  protected async close(l: LaunchView): Promise<void> {
    try {
      await firstValueFrom(this.api.markDone(l.id));
      this.launches.reload();
    } catch (err) {
      this.snackBar.open(apiErrorMessage(err), undefined, { duration: 4000 });
    }
  }
}
