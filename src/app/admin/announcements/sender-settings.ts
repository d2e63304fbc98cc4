import { ChangeDetectionStrategy, Component, OnInit, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { apiErrorMessage, applyServerErrors } from '../../core/api-error';
import { SessionStore } from '../../core/session-store';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { AnnouncementAdminApi } from './announcement-admin-api';

/** The sender's mailing address and contact in every commercial mail's footer, and the automatic drop notices (admins change them). */
@Component({
  selector: 'ps-sender-settings',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    FieldErrorPipe,
  ],
  template: `
    <section class="sender" aria-labelledby="sender-title">
      <h2 id="sender-title">Sender and drop notices</h2>
      @if (problem(); as p) {
        <p class="form-problem" role="alert">{{ p }}</p>
      }
      @if (saved()) {
        <p role="status">Saved.</p>
      }
      <form [formGroup]="form" (ngSubmit)="save()" novalidate>
        <mat-form-field class="ps-full-width">
          <mat-label>Mailing address in every footer</mat-label>
          <textarea matInput formControlName="mailingAddress" rows="2"></textarea>
          <mat-error>{{ form.controls.mailingAddress | fieldError: 'Mailing address' }}</mat-error>
        </mat-form-field>
        <mat-form-field class="ps-full-width">
          <mat-label>Contact e-mail in every footer</mat-label>
          <input matInput type="email" formControlName="contactEmail" />
          <mat-error>{{ form.controls.contactEmail | fieldError: 'Contact e-mail' }}</mat-error>
        </mat-form-field>
        <mat-checkbox formControlName="automaticDropNotices"
          >Send the drop notice when a run opens, to those who asked</mat-checkbox
        >
        @if (isAdmin) {
          <p><button mat-stroked-button type="submit">Save sender settings</button></p>
        } @else {
          <p class="note">Only an admin can change these.</p>
        }
      </form>
    </section>
  `,
  styles: `
    .sender {
      max-width: 640px;
      margin-top: 32px;
    }
    .note {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SenderSettings implements OnInit {
  private readonly api = inject(AnnouncementAdminApi);
  protected readonly isAdmin = inject(SessionStore).hasAnyRole(['admin']);
  protected readonly form = inject(NonNullableFormBuilder).group({
    mailingAddress: ['', [Validators.required, Validators.minLength(10), Validators.maxLength(300)]],
    contactEmail: ['', [Validators.required, Validators.email]],
    automaticDropNotices: [true],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly saved = signal(false);

  async ngOnInit(): Promise<void> {
    if (!this.isAdmin) this.form.disable();
    try {
      this.form.setValue(await firstValueFrom(this.api.settings()));
    } catch (err) {
      this.problem.set(apiErrorMessage(err));
    }
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    this.saved.set(false);
    if (this.form.invalid) return;
    this.problem.set(null);
    try {
      this.form.setValue(await firstValueFrom(this.api.saveSettings(this.form.getRawValue())));
      this.saved.set(true);
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    }
  }
}
