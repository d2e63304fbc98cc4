import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MySubscriptions } from '../announcements/my-subscriptions';
import { applyServerErrors } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import { AccountApi } from './account-api';
import { PASSPHRASE_HINT } from './passphrase-hint';
import { YourData } from './your-data';

/** The account page: name, mail preference, password, and the person's own data. */
@Component({
  selector: 'ps-profile',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCardModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    FieldErrorPipe,
    MySubscriptions,
    YourData,
  ],
  templateUrl: './profile.html',
  styles: `
    .cards {
      display: grid;
      gap: 16px;
      grid-template-columns: repeat(auto-fit, minmax(300px, 1fr));
    }
    mat-card {
      padding: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Profile implements OnInit {
  private readonly api = inject(AccountApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly session = inject(SessionStore);

  readonly welcome = input<string>();
  protected readonly hint = PASSPHRASE_HINT;
  protected readonly profileForm = this.fb.group({
    displayName: ['', [Validators.required, Validators.maxLength(80)]],
    marketingOptOut: [false],
  });
  protected readonly passwordForm = this.fb.group({
    currentPassword: ['', Validators.required],
    newPassword: ['', [Validators.required, Validators.minLength(12), Validators.maxLength(128)]],
  });
  protected readonly profileProblem = signal<string | null>(null);
  protected readonly passwordProblem = signal<string | null>(null);
  protected readonly resent = signal(false);

  async ngOnInit(): Promise<void> {
    const res = await firstValueFrom(this.api.profile());
    this.profileForm.setValue({ displayName: res.user.displayName, marketingOptOut: res.marketingOptOut });
  }

  protected async saveProfile(): Promise<void> {
    this.profileForm.markAllAsTouched();
    if (this.profileForm.invalid) return;
    try {
      const res = await firstValueFrom(this.api.updateProfile(this.profileForm.getRawValue()));
      this.session.replace(res.user);
      this.profileProblem.set(null);
      this.snackBar.open('Profile saved.', undefined, { duration: 3000 });
    } catch (err) {
      this.profileProblem.set(applyServerErrors(this.profileForm, err));
    }
  }

  protected async changePassword(): Promise<void> {
    this.passwordForm.markAllAsTouched();
    if (this.passwordForm.invalid) return;
    try {
      const { currentPassword, newPassword } = this.passwordForm.getRawValue();
      await firstValueFrom(this.api.changePassword(currentPassword, newPassword));
      this.passwordForm.reset();
      this.passwordProblem.set(null);
      this.snackBar.open('Password changed. Other sessions were signed out.', undefined, { duration: 4000 });
    } catch (err) {
      this.passwordProblem.set(applyServerErrors(this.passwordForm, err));
    }
  }

  protected async resendVerification(): Promise<void> {
    await firstValueFrom(this.api.resendVerification());
    this.resent.set(true);
  }
}
