import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { applyServerErrors } from '../core/api-error';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { AccountApi } from './account-api';

@Component({
  selector: 'ps-reset-request',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, FieldErrorPipe],
  template: `
    <section class="ps-narrow">
      <h1>Forgot your password?</h1>
      @if (sent()) {
        <p role="status" data-testid="reset-sent">
          If an account uses that address, a link to choose a new password is on its way. It works for one hour.
        </p>
      } @else {
        <form [formGroup]="form" (ngSubmit)="send()" novalidate>
          @if (problem(); as message) {
            <p class="form-problem" role="alert">{{ message }}</p>
          }
          <mat-form-field class="ps-full-width">
            <mat-label>E-mail</mat-label>
            <input matInput type="email" formControlName="email" autocomplete="email" />
            <mat-error>{{ form.controls.email | fieldError: 'E-mail' }}</mat-error>
          </mat-form-field>
          <button mat-flat-button type="submit" [disabled]="busy()">Send the link</button>
        </form>
      }
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetRequest {
  private readonly api = inject(AccountApi);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
  });
  protected readonly sent = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected async send(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.busy.set(true);
    try {
      await firstValueFrom(this.api.requestReset(this.form.getRawValue().email));
      this.sent.set(true);
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    } finally {
      this.busy.set(false);
    }
  }
}
