import { ChangeDetectionStrategy, Component, effect, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { applyServerErrors } from '../../core/api-error';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MembersApi } from './members-api';

/** The club's term rule, grace, proration and the waiver text and versions (a new version asks members again). */
@Component({
  selector: 'ps-club-rules-form',
  imports: [ReactiveFormsModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, FieldErrorPipe],
  templateUrl: './club-rules-form.html',
  styleUrl: './members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClubRulesForm {
  private readonly api = inject(MembersApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly current = rxResource({ stream: () => this.api.settings() });
  protected readonly form = this.fb.group({
    termRule: this.fb.control<'calendar' | 'anniversary'>('calendar'),
    lateSeasonFrom: ['09-01', [Validators.required, Validators.pattern(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/)]],
    graceDays: [30, [Validators.required, Validators.min(0), Validators.max(180)]],
    prorate: [false],
    waiverVersion: ['', Validators.required],
    waiverText: ['', Validators.required],
    safetyCodeVersion: ['', Validators.required],
    associationName: ['', Validators.required],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);

  constructor() {
    effect(() => {
      const s = this.current.value()?.settings;
      if (s) this.form.reset(s);
    });
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    const s = this.current.value()?.settings;
    if (this.form.invalid || !s) return;
    this.problem.set(null);
    try {
      await firstValueFrom(this.api.saveSettings({ ...s, ...this.form.getRawValue(), graceDays: Number(this.form.controls.graceDays.value) }));
      this.notice.set('Club rules saved.');
      this.current.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    }
  }
}
