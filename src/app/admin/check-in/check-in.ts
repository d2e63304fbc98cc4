import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { HttpClient, HttpContext } from '@angular/common/http';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { applyServerErrors } from '../../core/api-error';
import { QUIET_ERRORS } from '../../core/error-interceptor';
import { FlyingCaution } from '../../membership/flying-caution';
import { CameraScanner } from '../../shared/camera-scanner';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import type { CheckInResult } from '@contracts/membership/check-in-answers';
import { CheckInVerdict } from './check-in-verdict';

/**
 * Launch-day check-in: the phone's camera reads the card's code, or a handheld scanner types it into the field (or staff
 * paste it), and the verdict shows.
 */
@Component({
  selector: 'ps-check-in',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    FieldErrorPipe,
    FlyingCaution,
    CheckInVerdict,
    CameraScanner,
  ],
  templateUrl: './check-in.html',
  styleUrl: './check-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CheckIn {
  private readonly http = inject(HttpClient);
  protected readonly form = inject(NonNullableFormBuilder).group({ token: ['', Validators.required] });
  protected readonly result = signal<CheckInResult | null>(null);
  protected readonly problem = signal<string | null>(null);

  /** A code read by the camera goes through the same check as a typed one. */
  protected scanned(token: string, formDir: FormGroupDirective): Promise<void> {
    this.form.setValue({ token });
    return this.check(formDir);
  }

  /** `formDir` resets the submitted state too, so the empty field is ready for the next scan without an error. */
  protected async check(formDir: FormGroupDirective): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.problem.set(null);
    try {
      this.result.set(
        await firstValueFrom(
          this.http.post<CheckInResult>('/api/admin/checkin', this.form.getRawValue(), {
            context: new HttpContext().set(QUIET_ERRORS, true),
          }),
        ),
      );
      formDir.resetForm();
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    }
  }
}
