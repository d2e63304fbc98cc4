import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { applyServerErrors } from '../core/api-error';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import type { ColumnMapping, FlightSummary } from './flight-data';
import { FlightDataApi } from './flight-data-api';
import { guessColumnMapping } from '@contracts/flights/column-mapping';
import { previewRows, readText } from './flight-log-preview';

/** How much of the file the browser reads to show the first rows. */
const PREVIEW_BYTES = 64 * 1024;

/**
 * The server's field names (the mapping's paths, with or without a `columns.` prefix) onto this form's controls,
 * so a refused column shows beside its select.
 */
const SERVER_FIELDS: Record<string, string> = {};
for (const prefix of ['', 'columns.']) {
  Object.assign(SERVER_FIELDS, {
    [`${prefix}time`]: 'timeColumn',
    [`${prefix}time.column`]: 'timeColumn',
    [`${prefix}time.unit`]: 'timeUnit',
    [`${prefix}pressure`]: 'pressureColumn',
    [`${prefix}pressure.column`]: 'pressureColumn',
    [`${prefix}pressure.unit`]: 'pressureUnit',
    [`${prefix}temperature`]: 'temperatureColumn',
    [`${prefix}temperature.column`]: 'temperatureColumn',
    [`${prefix}acceleration`]: 'accelAxes',
    [`${prefix}acceleration.columns`]: 'accelAxes',
    [`${prefix}acceleration.unit`]: 'accelUnit',
  });
}

/** Uploads a flight's altimeter log: shows its first rows, maps the columns, sends it with a progress bar. */
@Component({
  selector: 'ps-flight-log-upload',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    FieldErrorPipe,
  ],
  templateUrl: './flight-log-upload.html',
  styleUrl: './flight-log-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlightLogUpload {
  private readonly api = inject(FlightDataApi);

  readonly flightId = input.required<number>();
  readonly uploaded = output<FlightSummary>();

  protected readonly form = new FormGroup({
    log: new FormControl<File | null>(null, Validators.required),
    timeColumn: new FormControl('', { nonNullable: true, validators: Validators.required }),
    timeUnit: new FormControl<'s' | 'ms'>('s', { nonNullable: true }),
    pressureColumn: new FormControl('', { nonNullable: true, validators: Validators.required }),
    pressureUnit: new FormControl<'Pa' | 'hPa'>('Pa', { nonNullable: true }),
    temperatureColumn: new FormControl('', { nonNullable: true }),
    accelAxes: new FormControl<'none' | 'one' | 'three'>('none', { nonNullable: true }),
    accelX: new FormControl('', { nonNullable: true }),
    accelY: new FormControl('', { nonNullable: true }),
    accelZ: new FormControl('', { nonNullable: true }),
    accelUnit: new FormControl<'g' | 'm/s2'>('g', { nonNullable: true }),
    /** Carries the server's word on the mapping as a whole. */
    columns: new FormControl<null>(null),
  });

  protected readonly headers = signal<string[]>([]);
  protected readonly rows = signal<string[][]>([]);
  protected readonly fileName = signal<string | null>(null);
  protected readonly guessed = signal<boolean | null>(null);
  /** Upload progress in percent; null when nothing is on its way. */
  protected readonly progress = signal<number | null>(null);
  protected readonly sent = computed(() => this.progress() === 100);
  protected readonly problem = signal<string | null>(null);
  protected readonly result = signal<FlightSummary | null>(null);
  protected readonly axes = toSignal(this.form.controls.accelAxes.valueChanges, {
    initialValue: this.form.controls.accelAxes.value,
  });

  protected async pick(picker: HTMLInputElement): Promise<void> {
    const file = picker.files?.[0];
    picker.value = '';
    if (!file) return;
    this.problem.set(null);
    this.result.set(null);
    this.fileName.set(file.name);
    this.form.controls.log.setValue(file);
    this.form.controls.log.setErrors(null);
    this.form.controls.columns.setErrors(null);
    let preview: { headers: string[]; rows: string[][] };
    try {
      preview = previewRows(await readText(file.slice(0, PREVIEW_BYTES)));
    } catch {
      preview = { headers: [], rows: [] };
    }
    if (preview.headers.length === 0)
      this.problem.set('Padside could not read the first rows of this file. Is it a CSV file?');
    this.headers.set(preview.headers);
    this.rows.set(preview.rows);
    const guess = guessColumnMapping(preview.headers);
    this.guessed.set(guess !== null);
    this.applyMapping(guess);
  }

  private applyMapping(m: ColumnMapping | null): void {
    const accel = m?.acceleration?.columns ?? [];
    this.form.patchValue({
      timeColumn: m?.time.column ?? '',
      timeUnit: m?.time.unit ?? 's',
      pressureColumn: m?.pressure.column ?? '',
      pressureUnit: m?.pressure.unit ?? 'Pa',
      temperatureColumn: m?.temperature?.column ?? '',
      accelAxes: accel.length === 3 ? 'three' : accel.length === 1 ? 'one' : 'none',
      accelX: accel.length === 3 ? accel[0] : '',
      accelY: accel.length === 3 ? accel[1] : '',
      accelZ: accel.length === 3 ? accel[2] : (accel[0] ?? ''),
      accelUnit: m?.acceleration?.unit ?? 'g',
    });
  }

  /** The mapping the form describes. */
  protected mapping(): ColumnMapping {
    const v = this.form.getRawValue();
    const mapping: ColumnMapping = {
      time: { column: v.timeColumn, unit: v.timeUnit },
      pressure: { column: v.pressureColumn, unit: v.pressureUnit },
    };
    if (v.temperatureColumn) mapping.temperature = { column: v.temperatureColumn, unit: 'C' };
    const accel = v.accelAxes === 'three' ? [v.accelX, v.accelY, v.accelZ] : v.accelAxes === 'one' ? [v.accelZ] : [];
    if (accel.length && accel.every((c) => c)) mapping.acceleration = { columns: accel, unit: v.accelUnit };
    return mapping;
  }

  protected send(): void {
    const file = this.form.controls.log.value;
    this.form.markAllAsTouched();
    if (this.form.invalid || !file || this.progress() !== null) return;
    this.problem.set(null);
    this.progress.set(0);
    this.api.uploadLog(this.flightId(), file, this.mapping()).subscribe({
      next: (e) => {
        if (e.type === HttpEventType.UploadProgress)
          this.progress.set(e.total ? Math.round((100 * e.loaded) / e.total) : 0);
        if (e.type === HttpEventType.Response && e.body) {
          this.progress.set(null);
          this.result.set(e.body.summary);
          this.uploaded.emit(e.body.summary);
        }
      },
      error: (err) => {
        this.progress.set(null);
        this.problem.set(applyServerErrors(this.form, err, SERVER_FIELDS));
      },
    });
  }
}
