import { ChangeDetectionStrategy, Component, OnInit, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { applyServerErrors } from '../../core/api-error';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { BooksApi } from './books-api';

/** The card-fee estimate used until the processor reports the real fee. */
@Component({
  selector: 'ps-fee-settings-card',
  imports: [ReactiveFormsModule, MatButtonModule, MatCardModule, MatFormFieldModule, MatInputModule, FieldErrorPipe],
  template: `
    <mat-card appearance="outlined">
      <mat-card-header>
        <mat-card-title>Card-fee estimate</mat-card-title>
        <mat-card-subtitle>Used for each card payment until the processor reports its actual fee</mat-card-subtitle>
      </mat-card-header>
      <mat-card-content>
        <form [formGroup]="form" (ngSubmit)="save()" class="fees" novalidate>
          @if (problem(); as message) {
            <p class="form-problem" role="alert">{{ message }}</p>
          }
          <mat-form-field>
            <mat-label>Percentage of each payment</mat-label>
            <input matInput type="number" inputmode="decimal" step="0.01" formControlName="percent" />
            <span matTextSuffix>%</span>
            <mat-hint>For example 2.9</mat-hint>
            <mat-error>{{ form.controls.percent | fieldError: 'Percentage' }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Fixed part per payment</mat-label>
            <input matInput type="number" inputmode="numeric" formControlName="fixedCents" />
            <span matTextSuffix>cents</span>
            <mat-error>{{ form.controls.fixedCents | fieldError: 'Fixed part' }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Extra for cards from abroad</mat-label>
            <input matInput type="number" inputmode="decimal" step="0.01" formControlName="internationalExtraPercent" />
            <span matTextSuffix>%</span>
            <mat-error>{{ form.controls.internationalExtraPercent | fieldError: 'Extra' }}</mat-error>
          </mat-form-field>
          <button mat-flat-button type="submit">Save estimate</button>
        </form>
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    .fees {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      align-items: baseline;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FeeSettingsCard implements OnInit {
  private readonly api = inject(BooksApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly percent = [Validators.required, Validators.min(0), Validators.max(100)];
  protected readonly form = inject(NonNullableFormBuilder).group({
    percent: [0, this.percent],
    fixedCents: [0, [Validators.required, Validators.min(0), Validators.max(10000)]],
    internationalExtraPercent: [0, this.percent],
  });
  protected readonly problem = signal<string | null>(null);

  async ngOnInit(): Promise<void> {
    this.form.setValue(await firstValueFrom(this.api.fees()));
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    try {
      await firstValueFrom(this.api.saveFees(this.form.getRawValue()));
      this.problem.set(null);
      this.snackBar.open('Fee estimate saved.', undefined, { duration: 3000 });
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    }
  }
}
