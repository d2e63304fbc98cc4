import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { applyServerErrors } from '../core/api-error';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { AccountApi } from './account-api';

/** Asks once more, says what goes and what stays, and takes the password; closes with `true` once deleted. */
@Component({
  selector: 'ps-delete-account-dialog',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    FieldErrorPipe,
  ],
  templateUrl: './delete-account-dialog.html',
  // A destructive action in the theme's error colours (Material 3 button tokens).
  styles: `
    .form-problem {
      color: var(--mat-sys-error);
    }
    ul {
      padding-left: 1.25rem;
    }
    .danger {
      --mat-button-filled-container-color: var(--mat-sys-error);
      --mat-button-filled-label-text-color: var(--mat-sys-on-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeleteAccountDialog {
  private readonly api = inject(AccountApi);
  private readonly ref = inject<MatDialogRef<DeleteAccountDialog, boolean>>(MatDialogRef);
  protected readonly form = inject(NonNullableFormBuilder).group({ password: ['', Validators.required] });
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);

  protected async confirm(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.busy()) return;
    this.busy.set(true);
    try {
      await firstValueFrom(this.api.deleteAccount(this.form.getRawValue().password));
      this.ref.close(true);
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    } finally {
      this.busy.set(false);
    }
  }
}
