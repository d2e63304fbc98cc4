import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { applyServerErrors } from '../core/api-error';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { FlightCaution } from './flight-caution';
import type { RecoveryMethod } from '@contracts/labels/launch-statuses';
import type { FlightView } from '@contracts/launches/launch-answers';
import { LaunchesApi, RECOVERY } from './launches-api';

/** The flyer's flight card, filed at the field after check-in; Padside's warnings show once it is filed. */
@Component({
  selector: 'ps-flight-card-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    FieldErrorPipe,
    FlightCaution,
  ],
  templateUrl: './flight-card-form.html',
  styleUrl: './launches.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlightCardForm {
  private readonly api = inject(LaunchesApi);
  private readonly fb = inject(NonNullableFormBuilder);
  readonly id = input.required<string>();

  protected readonly launch = rxResource({
    params: () => Number(this.id()),
    stream: ({ params }) => this.api.show(params),
  });
  protected readonly recovery = RECOVERY;
  protected readonly form = this.fb.group({
    rocketName: ['', [Validators.required, Validators.maxLength(120)]],
    liftoffMassGrams: this.fb.control<number | null>(null, [Validators.required, Validators.min(1)]),
    motors: this.fb.array([this.fb.control('', Validators.required)]),
    expectedAltitudeMetres: this.fb.control<number | null>(null, Validators.min(1)),
    recovery: this.fb.control<RecoveryMethod | null>(null),
    pad: [''],
    postSlug: [''],
    notes: ['', Validators.maxLength(2000)],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly filed = signal<FlightView | null>(null);
  protected readonly busy = signal(false);

  protected addMotor(): void {
    this.form.controls.motors.push(this.fb.control('', Validators.required));
  }

  protected removeMotor(i: number): void {
    this.form.controls.motors.removeAt(i);
  }

  protected async submit(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.busy()) return;
    this.problem.set(null);
    this.busy.set(true);
    const v = this.form.getRawValue();
    try {
      const res = await firstValueFrom(
        this.api.fileFlight(Number(this.id()), {
          ...v,
          liftoffMassGrams: v.liftoffMassGrams ?? 0,
          expectedAltitudeMetres: v.expectedAltitudeMetres ?? null,
          pad: v.pad || null,
          postSlug: v.postSlug || null,
          notes: v.notes || null,
        }),
      );
      this.filed.set(res.flight);
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    } finally {
      this.busy.set(false);
    }
  }

  protected another(): void {
    this.filed.set(null);
    this.form.reset();
    while (this.form.controls.motors.length > 1) this.form.controls.motors.removeAt(1);
  }
}
