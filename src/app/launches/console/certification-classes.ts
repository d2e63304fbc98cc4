import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormControl, FormRecord, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom, forkJoin } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { applyServerErrors } from '../../core/api-error';
import { SessionStore } from '../../core/session-store';
import { MembershipApi } from '../../membership/membership-api';
import { controlMessage } from '../../shared/field-error-pipe';
import type { LaunchSettings } from '@contracts/launches/launch-schemas';
import { LaunchesApi } from '../launches-api';
import { FlightCaution } from '../flight-caution';
import { classListValidator, formatClassList, parseClassList } from './impulse-class-list';

/** One certification level on the screen: its code (the settings key), the label members see, its classes. */
interface LevelRow {
  code: string;
  label: string;
}

// The server's limit: one class per letter.
const MAX_CLASSES = 26;

/**
 * The motor impulse classes each certification level allows, as the club's association sets them. Flight cards with
 * a motor beyond the flyer's level get a warning and cannot be recorded as cleared.
 */
@Component({
  selector: 'ps-certification-classes',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, FlightCaution],
  templateUrl: './certification-classes.html',
  styleUrl: '../launches.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CertificationClasses {
  private readonly api = inject(LaunchesApi);
  private readonly membership = inject(MembershipApi);
  private readonly current = rxResource({
    stream: () => forkJoin({ policy: this.membership.policy(), settings: this.api.settings() }),
  });
  protected readonly form = new FormRecord<FormControl<string>>({});
  protected readonly rows = signal<LevelRow[]>([]);
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly saving = signal(false);
  protected readonly loadFailed = this.current.error;
  /** The membership settings (where levels are kept) are the treasurer's and the admins'. */
  private readonly session = inject(SessionStore);
  protected readonly mayEditLevels = computed(() => this.session.hasAnyRole(['treasurer', 'admin']));

  constructor() {
    effect(() => {
      const v = this.current.value();
      if (v) this.show(v.policy.certificationLevels, v.settings);
    });
  }

  /** The membership levels in their order, then any level the settings still name that the list no longer has. */
  private show(levels: LevelRow[], settings: LaunchSettings): void {
    const known = new Set(levels.map((l) => l.code));
    const rows = [
      ...levels,
      ...Object.keys(settings.classesByLevel)
        .filter((c) => !known.has(c))
        .map((code) => ({ code, label: `${code} (no longer a membership level)` })),
    ];
    for (const code of Object.keys(this.form.controls)) this.form.removeControl(code);
    for (const r of rows)
      this.form.addControl(
        r.code,
        new FormControl(formatClassList(settings.classesByLevel[r.code] ?? []), {
          nonNullable: true,
          validators: [Validators.required, classListValidator],
        }),
      );
    this.rows.set(rows);
  }

  protected message(code: string, label: string): string | null {
    const control = this.form.controls[code];
    if (!control?.errors) return null;
    if (control.errors['server']) return control.errors['server'] as string;
    // A level new to the membership list starts empty; every level flies at least model motors.
    if (control.errors['required']) return 'List at least one class.';
    return (control.errors['classes'] as string | undefined) ?? controlMessage(control, label);
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    this.notice.set(null);
    if (this.form.invalid) {
      this.problem.set('Some fields need attention.');
      return;
    }
    this.problem.set(null);
    const classesByLevel: Record<string, string[]> = {};
    for (const r of this.rows()) classesByLevel[r.code] = parseClassList(this.form.controls[r.code].value) ?? [];
    // The server names a bad class by its place in the list; it shows beside the level's one field.
    const rename: Record<string, string> = {};
    for (const r of this.rows()) {
      rename[`classesByLevel.${r.code}`] = r.code;
      for (let i = 0; i < MAX_CLASSES; i++) rename[`classesByLevel.${r.code}.${i}`] = r.code;
    }
    this.saving.set(true);
    try {
      const saved = await firstValueFrom(this.api.saveSettings({ classesByLevel }));
      for (const r of this.rows())
        this.form.controls[r.code].setValue(formatClassList(saved.classesByLevel[r.code] ?? []));
      this.notice.set('Saved. Flight cards filed from now on are checked against these classes.');
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err, rename));
    } finally {
      this.saving.set(false);
    }
  }
}
