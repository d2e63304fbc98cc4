import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { applyServerErrors } from '../core/api-error';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { AccountApi } from './account-api';
import { PASSPHRASE_HINT } from './passphrase-hint';

@Component({
  selector: 'ps-reset-confirm',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, FieldErrorPipe],
  template: `
    <section class="ps-narrow">
      <h1>Choose a new password</h1>
      @if (done()) {
        <p role="status" data-testid="reset-done">Your password is changed, and every other session is signed out.</p>
        <a mat-flat-button routerLink="/account/sign-in">Sign in</a>
      } @else {
        <form [formGroup]="form" (ngSubmit)="save()" novalidate>
          @if (problem(); as message) {
            <p class="form-problem" role="alert">{{ message }}</p>
          }
          <mat-form-field class="ps-full-width">
            <mat-label>New password</mat-label>
            <input matInput type="password" formControlName="password" autocomplete="new-password" />
            <mat-hint>{{ hint }}</mat-hint>
            <mat-error>{{ form.controls.password | fieldError: 'Password' }}</mat-error>
          </mat-form-field>
          <button mat-flat-button type="submit" [disabled]="busy()">Save password</button>
        </form>
      }
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetConfirm {
  private readonly api = inject(AccountApi);
  readonly token = input<string>('');
  protected readonly hint = PASSPHRASE_HINT;
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', [Validators.required, Validators.minLength(12), Validators.maxLength(128)]],
  });
  protected readonly done = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.busy.set(true);
    try {
      await firstValueFrom(this.api.confirmReset(this.token(), this.form.getRawValue().password));
      this.done.set(true);
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    } finally {
      this.busy.set(false);
    }
  }
}
