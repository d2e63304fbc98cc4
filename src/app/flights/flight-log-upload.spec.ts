import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { FlightSummary } from './flight-data';
import { FlightLogUpload } from './flight-log-upload';
import { guessColumnMapping } from '@contracts/flights/column-mapping';
import { previewRows } from './flight-log-preview';

const LOG =
  'time_ms,pressure_hpa,temp,ax,ay,az\n0,977.00,20.1,0,0,1\n10,977.01,20.1,0,0,1\n20,976.99,20.1,0.1,0,5.1\n30,976.90,20.1,0.1,0,5.1\n';
const SUMMARY: FlightSummary = {
  apogeeMetres: 634.9,
  apogeeFeet: 2083,
  apogeeAtSeconds: 12.7,
  maxSpeedMps: 100,
  descentRateMps: 5,
  peakAccelG: 5.1,
  flightTimeSeconds: 139.6,
  samples: 14500,
};

describe('FlightLogUpload', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] }));

  const setUp = async () => {
    const fixture = TestBed.createComponent(FlightLogUpload);
    fixture.componentRef.setInput('flightId', 17);
    await fixture.whenStable();
    return fixture;
  };
  const pick = async (fixture: Awaited<ReturnType<typeof setUp>>, text: string, name = 'flight.csv') => {
    const input = fixture.nativeElement.querySelector('input[type=file]') as HTMLInputElement;
    Object.defineProperty(input, 'files', {
      value: [new File([text], name, { type: 'text/csv' })],
      configurable: true,
    });
    input.dispatchEvent(new Event('change'));
    // The preview reads the file asynchronously (FileReader); wait until the form shows what it read.
    const el = fixture.nativeElement as HTMLElement;
    for (let i = 0; i < 200 && !el.querySelector('.preview, .form-problem'); i++) {
      await new Promise((r) => setTimeout(r, 10));
      await fixture.whenStable();
    }
  };
  const submit = async (fixture: Awaited<ReturnType<typeof setUp>>) => {
    (fixture.nativeElement.querySelector('form') as HTMLFormElement).dispatchEvent(new Event('submit'));
    await fixture.whenStable();
  };
  const selectText = (fixture: Awaited<ReturnType<typeof setUp>>) =>
    Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('mat-select')).map((s) => s.textContent!.trim());

  it('should show the first rows and prefill the columns from the header names', async () => {
    const fixture = await setUp();
    await pick(fixture, LOG);
    const el = fixture.nativeElement as HTMLElement;
    expect(Array.from(el.querySelectorAll('.preview th')).map((h) => h.textContent)).toEqual([
      'time_ms',
      'pressure_hpa',
      'temp',
      'ax',
      'ay',
      'az',
    ]);
    expect(el.querySelectorAll('.preview tbody tr')).toHaveLength(4);
    expect(el.textContent).toContain('recognised the columns');
    expect(selectText(fixture)).toEqual([
      'time_ms',
      'milliseconds',
      'pressure_hpa',
      'hPa (mbar)',
      'temp',
      'Three axes',
      'g',
      'ax',
      'ay',
      'az',
    ]);
  });

  it('should ask for the columns when it does not recognise them', async () => {
    const fixture = await setUp();
    await pick(fixture, 'stamp;baro_raw\n1;97700\n');
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('did not recognise the column names');
    await submit(fixture);
    TestBed.inject(HttpTestingController).expectNone('/api/flights/17/data');
    expect((fixture.nativeElement as HTMLElement).querySelector('mat-error')!.textContent).toContain(
      'The time column is required.',
    );
  });

  it('should post the log and the mapping with a progress bar, then emit the summary', async () => {
    const fixture = await setUp();
    const emitted: FlightSummary[] = [];
    fixture.componentInstance.uploaded.subscribe((s) => emitted.push(s));
    await pick(fixture, LOG);
    await submit(fixture);
    const req = TestBed.inject(HttpTestingController).expectOne('/api/flights/17/data');
    expect(req.request.method).toBe('POST');
    expect(req.request.reportProgress).toBe(true);
    const body = req.request.body as FormData;
    expect((body.get('log') as File).name).toBe('flight.csv');
    expect(JSON.parse(body.get('columns') as string)).toEqual({
      time: { column: 'time_ms', unit: 'ms' },
      pressure: { column: 'pressure_hpa', unit: 'hPa' },
      temperature: { column: 'temp', unit: 'C' },
      acceleration: { columns: ['ax', 'ay', 'az'], unit: 'g' },
    });
    req.event({ type: HttpEventType.UploadProgress, loaded: 30, total: 100 });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar')!.getAttribute('aria-label')).toBe('Uploading: 30%');
    req.event({ type: HttpEventType.UploadProgress, loaded: 100, total: 100 });
    await fixture.whenStable();
    expect(el.textContent).toContain('reading the log');
    req.flush({ summary: SUMMARY }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(emitted).toEqual([SUMMARY]);
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    expect(el.querySelector('[role=status]')!.textContent).toContain('634.9 m');
  });

  it('should show the server field errors beside their fields', async () => {
    const fixture = await setUp();
    await pick(fixture, LOG);
    await submit(fixture);
    TestBed.inject(HttpTestingController)
      .expectOne('/api/flights/17/data')
      .flush(
        {
          error: {
            code: 'unmappable_log',
            message: 'The pressure column reads about 977 Pa before liftoff.',
            fields: {
              columns: 'The pressure column reads about 977 Pa before liftoff. Is it in hPa?',
              'columns.time': 'The log has no column named "time_ms".',
            },
          },
        },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('fieldset [role=alert]')!.textContent).toContain('Is it in hPa?');
    expect(el.querySelector('mat-error')!.textContent).toContain('no column named "time_ms"');
    expect(el.querySelector('.form-problem')!.textContent).toContain('977 Pa');
  });

  it('should show a refusal of the file beside the file picker', async () => {
    const fixture = await setUp();
    await pick(fixture, LOG);
    await submit(fixture);
    TestBed.inject(HttpTestingController)
      .expectOne('/api/flights/17/data')
      .flush(
        {
          error: {
            code: 'invalid_request',
            message: 'Too long.',
            fields: { log: 'A log may hold at most 200,000 rows.' },
          },
        },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('#flight-log-file-error')!.textContent).toContain(
      '200,000 rows',
    );
  });
});

describe('the browser-side log preview', () => {
  it('should split on the delimiter the header uses and skip comments', () => {
    expect(previewRows('# logger v2\ntime\tpressure\n0\t97700\n', 5)).toEqual({
      headers: ['time', 'pressure'],
      rows: [['0', '97700']],
    });
    expect(previewRows('')).toEqual({ headers: [], rows: [] });
  });

  it('should guess like the server for the common names', () => {
    expect(guessColumnMapping(['t', 'baro', 'accel_z (m/s^2)'])).toEqual({
      time: { column: 't', unit: 's' },
      pressure: { column: 'baro', unit: 'hPa' },
      acceleration: { columns: ['accel_z (m/s^2)'], unit: 'm/s2' },
    });
    expect(guessColumnMapping(['a', 'b'])).toBeNull();
  });
});
