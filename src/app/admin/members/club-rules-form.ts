import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  effect,
  ElementRef,
  inject,
  Injector,
  signal,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { applyServerErrors } from '../../core/api-error';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MembersApi } from './members-api';

type LevelRow = FormGroup<{ code: FormControl<string>; label: FormControl<string> }>;

// The server's limit on the list.
const MAX_LEVELS = 12;

/**
 * The club's term rule, grace, proration, the waiver text and versions (a new version asks members again), and
 * the certification levels members choose from.
 */
@Component({
  selector: 'ps-club-rules-form',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    FieldErrorPipe,
  ],
  templateUrl: './club-rules-form.html',
  styleUrl: './members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClubRulesForm {
  private readonly api = inject(MembersApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  private readonly current = rxResource({ stream: () => this.api.settings() });
  protected readonly maxLevels = MAX_LEVELS;
  protected readonly form = this.fb.group({
    termRule: this.fb.control<'calendar' | 'anniversary'>('calendar'),
    lateSeasonFrom: ['09-01', [Validators.required, Validators.pattern(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/)]],
    graceDays: [30, [Validators.required, Validators.min(0), Validators.max(180)]],
    prorate: [false],
    waiverVersion: ['', Validators.required],
    waiverText: ['', Validators.required],
    safetyCodeVersion: ['', Validators.required],
    associationName: ['', Validators.required],
    certificationLevels: this.fb.array<LevelRow>([]),
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  /** Read out after a level moves or goes, since the list changes under the keyboard user. */
  protected readonly announcement = signal('');

  constructor() {
    effect(() => {
      const s = this.current.value()?.settings;
      if (!s) return;
      this.fitLevels(s.certificationLevels.length);
      this.form.reset(s);
    });
  }

  protected get levels() {
    return this.form.controls.certificationLevels;
  }

  /** As many rows as saved levels, reusing the rows there are so the list is not rebuilt after each save. */
  private fitLevels(count: number): void {
    while (this.levels.length > count) this.levels.removeAt(this.levels.length - 1);
    while (this.levels.length < count) this.levels.push(this.level());
    // Saved codes sit on member records, so only their labels change; a new row's code is typed in.
    for (const row of this.levels.controls) row.controls.code.disable();
  }

  private level(): LevelRow {
    return this.fb.group({
      code: ['', [Validators.required, Validators.maxLength(16), Validators.pattern(/^[a-z0-9-]+$/i)]],
      label: ['', [Validators.required, Validators.maxLength(80)]],
    });
  }

  protected levelName(row: LevelRow): string {
    return row.controls.label.value || row.controls.code.value || 'the new level';
  }

  protected addLevel(): void {
    this.levels.push(this.level());
    this.focusAfterRender(`#level-code-${this.levels.length - 1}`);
  }

  /** Moves a level among the others; the first ("none") stays put. */
  protected moveLevel(index: number, by: -1 | 1): void {
    const to = index + by;
    if (index < 1 || to < 1 || to >= this.levels.length) return;
    const row = this.levels.at(index);
    this.levels.removeAt(index);
    this.levels.insert(to, row);
    this.levels.markAsDirty();
    this.announcement.set(`${this.levelName(row)} is now number ${to + 1} of ${this.levels.length}.`);
    // The moved row's buttons are re-created; put focus back on the one pressed, or on its twin at either end.
    const [pressed, twin] = by < 0 ? ['up', 'down'] : ['down', 'up'];
    this.focusAfterRender(`#level-${pressed}-${to}:not([disabled])`, `#level-${twin}-${to}`);
  }

  protected removeLevel(index: number): void {
    if (index < 1) return;
    const name = this.levelName(this.levels.at(index));
    this.levels.removeAt(index);
    this.levels.markAsDirty();
    this.announcement.set(`${name} removed. Save the club rules to keep the change.`);
    this.focusAfterRender(`#level-label-${index - 1}`);
  }

  /** Focuses the first of `selectors` that matches once the list has re-rendered. */
  private focusAfterRender(...selectors: string[]): void {
    afterNextRender(
      () => {
        const root = this.host.nativeElement;
        selectors
          .map((s) => root.querySelector<HTMLElement>(s))
          .find((el) => el)
          ?.focus();
      },
      { injector: this.injector },
    );
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    const s = this.current.value()?.settings;
    if (this.form.invalid || !s) return;
    this.problem.set(null);
    this.notice.set(null);
    try {
      await firstValueFrom(
        this.api.saveSettings({
          ...s,
          ...this.form.getRawValue(),
          graceDays: Number(this.form.controls.graceDays.value),
        }),
      );
      this.notice.set('Club rules saved.');
      this.current.reload();
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    }
  }
}
