import type { Readable } from 'node:stream';
import { parse as parseCsv } from 'csv-parse';
import { AppError, badRequest } from '../../platform/app-error';
import { guessColumnMapping, missingColumns, type ColumnMapping } from '../../../contracts/flights/column-mapping';
import {
  analyseSamples,
  NoFlightFound,
  type FlightEvent,
  type FlightSamples,
  type FlightSeriesPoint,
  type FlightSummary,
} from './flight-analysis';

/**
 * Reads an altimeter log (CSV) as a stream, row by row into typed arrays, and hands the readings to the pure
 * analysis. The file is never held whole in memory; the readings are (at most 200,000 rows of a few numbers).
 */

export type { FlightEvent, FlightSeriesPoint, FlightSummary } from './flight-analysis';

/** The most data rows one log may hold. */
export const MAX_LOG_ROWS = 200_000;
const STANDARD_GRAVITY = 9.80665;

/** What Padside makes of one log: summary, chart series (at most 1,000 points), events, and how it read and smoothed. */
export interface FlightAnalysis {
  summary: FlightSummary;
  series: FlightSeriesPoint[];
  events: FlightEvent[];
  mapping: ColumnMapping;
  filter: string;
}

const unmappable = (message: string, field: 'log' | 'columns') =>
  new AppError(400, 'unmappable_log', message, { [field]: message });

/** Column indexes of a mapping within the header row. */
interface Indexes {
  time: number;
  pressure: number;
  accel: number[];
}

function indexesFor(mapping: ColumnMapping, headers: string[]): Indexes {
  const missing = missingColumns(mapping, headers);
  const first = Object.values(missing)[0];
  if (first) throw unmappable(first, 'columns');
  return {
    time: headers.indexOf(mapping.time.column),
    pressure: headers.indexOf(mapping.pressure.column),
    accel: mapping.acceleration?.columns.map((c) => headers.indexOf(c)) ?? [],
  };
}

/** Growable columns of readings, converted to s, Pa and g as they arrive. */
class Readings {
  t = new Float64Array(1024);
  p = new Float64Array(1024);
  a: Float64Array | null;
  length = 0;

  constructor(withAccel: boolean) {
    this.a = withAccel ? new Float64Array(1024) : null;
  }

  /** Adds one reading; a missing acceleration repeats the one before (1 g, at rest, for the first). */
  push(t: number, p: number, a: number) {
    if (this.a && Number.isNaN(a)) a = this.length > 0 ? this.a[this.length - 1] : 1;
    if (this.length === this.t.length) {
      const grow = (x: Float64Array) => {
        const y = new Float64Array(x.length * 2);
        y.set(x);
        return y;
      };
      this.t = grow(this.t);
      this.p = grow(this.p);
      if (this.a) this.a = grow(this.a);
    }
    this.t[this.length] = t;
    this.p[this.length] = p;
    if (this.a) this.a[this.length] = a;
    this.length++;
  }
}

/** One data row to (time s, pressure Pa, acceleration g), or null when a needed cell is not a number. */
function readRow(row: string[], ix: Indexes, mapping: ColumnMapping): [number, number, number] | null {
  const tCell = row[ix.time] ?? '';
  const pCell = row[ix.pressure] ?? '';
  // Number() ignores surrounding spaces but reads a blank cell as 0.
  if (tCell.trim() === '' || pCell.trim() === '') return null;
  const t = Number(tCell);
  const p = Number(pCell);
  if (!Number.isFinite(t) || !Number.isFinite(p)) return null;
  let a = NaN;
  if (ix.accel.length > 0) {
    const axes = ix.accel.map((k) => ((row[k] ?? '').trim() === '' ? NaN : Number(row[k])));
    // One axis may be mounted either way up; three give the magnitude.
    a = axes.length === 1 ? Math.abs(axes[0]) : Math.hypot(...axes);
    if (mapping.acceleration?.unit === 'm/s2') a /= STANDARD_GRAVITY;
    if (!Number.isFinite(a)) a = NaN;
  }
  return [mapping.time.unit === 'ms' ? t / 1000 : t, mapping.pressure.unit === 'hPa' ? p * 100 : p, a];
}

/** Air pressure where people fly lies between about 500 and 1,100 hPa; anything else is the wrong column or unit. */
function checkPressureScale(first: Float64Array, mapping: ColumnMapping) {
  const pad = [...first].sort((x, y) => x - y)[first.length >> 1];
  if (pad >= 50_000 && pad <= 110_000) return;
  const shown = mapping.pressure.unit === 'hPa' ? `${Math.round(pad) / 100} hPa` : `${Math.round(pad)} Pa`;
  const hint =
    pad >= 500 && pad <= 1100
      ? ' Is it in hPa?'
      : pad >= 5_000_000 && pad <= 11_000_000
        ? ' Is it in Pa?'
        : ' Check the pressure column.';
  throw unmappable(
    `The pressure column reads about ${shown} before liftoff, which is not air pressure at a launch site.${hint}`,
    'columns',
  );
}

/** Takes rows one at a time: the first is the header row, the rest become readings. */
class LogReader {
  private headers: string[] | null = null;
  private ix: Indexes | null = null;
  private readings: Readings | null = null;
  private rows = 0;
  private unreadable = 0;

  constructor(private mapping: ColumnMapping | undefined) {}

  row(row: string[]) {
    if (!this.headers) {
      this.headers = row.map((h) => h.trim());
      this.mapping ??= guessColumnMapping(this.headers) ?? undefined;
      if (!this.mapping) {
        throw unmappable(
          'Padside could not tell which columns hold the time and the pressure. Pick them from the first rows.',
          'columns',
        );
      }
      this.ix = indexesFor(this.mapping, this.headers);
      this.readings = new Readings(this.ix.accel.length > 0);
      return;
    }
    if (++this.rows > MAX_LOG_ROWS) {
      throw badRequest(`A log may hold at most ${MAX_LOG_ROWS.toLocaleString('en-CA')} rows.`, {
        log: `A log may hold at most ${MAX_LOG_ROWS.toLocaleString('en-CA')} rows; trim the time on the pad before and after the flight.`,
      });
    }
    const readings = this.readings!;
    const sample = readRow(row, this.ix!, this.mapping!);
    // Loggers repeat or reset a time stamp now and then; keep strictly increasing times only.
    if (!sample || (readings.length > 0 && sample[0] <= readings.t[readings.length - 1])) {
      this.unreadable++;
      return;
    }
    readings.push(...sample);
  }

  /** The readings and the mapping they were read with, once the file has ended; refuses a log with too little. */
  finish(): { samples: FlightSamples; mapping: ColumnMapping } {
    const readings = this.readings;
    if (!readings || !this.mapping) throw unmappable('The file is empty.', 'log');
    if (readings.length < 10) {
      throw unmappable(`Only ${readings.length} rows have a number in both the time and the pressure column.`, 'log');
    }
    if (this.unreadable > readings.length) {
      throw unmappable(
        'Most rows have no number in the time or pressure column, or their times go backwards. Check the columns.',
        'columns',
      );
    }
    checkPressureScale(readings.p.subarray(0, Math.min(readings.length, 50)), this.mapping);
    return {
      mapping: this.mapping,
      samples: {
        t: readings.t.subarray(0, readings.length),
        pressurePa: readings.p.subarray(0, readings.length),
        accelG: readings.a ? readings.a.subarray(0, readings.length) : null,
      },
    };
  }
}

/** Streams a CSV altimeter log and analyses it; the mapping is guessed from the header row when none is given. */
export async function analyseFlightLog(input: Readable, mapping?: ColumnMapping): Promise<FlightAnalysis> {
  const parser = parseCsv({
    bom: true,
    comment: '#',
    comment_no_infix: true,
    delimiter: [',', ';', '\t'],
    skip_empty_lines: true,
    relax_column_count: true,
    max_record_size: 65_536,
  });
  const reader = new LogReader(mapping);

  // Data events rather than an async iterator: the iterator costs a promise per row, three times slower here.
  await new Promise<void>((resolve, reject) => {
    let failed = false;
    const stop = (err: unknown) => {
      if (failed) return;
      failed = true;
      // Stop reading: the rest of the file is never pulled (an HTTP server discards an unread body on answering).
      input.unpipe(parser);
      parser.destroy();
      reject(err);
    };
    const fail = (err: unknown) =>
      stop(
        err instanceof AppError
          ? err
          : unmappable(
              'Padside could not read this file as CSV (comma, semicolon or tab separated, one header row).',
              'log',
            ),
      );
    // A broken upload is the caller's to answer; only what the parser refuses is the file's fault.
    input.on('error', stop);
    parser.on('error', fail);
    parser.on('data', (row: string[]) => {
      if (failed) return;
      try {
        reader.row(row);
      } catch (err) {
        fail(err);
      }
    });
    parser.on('end', resolve);
    input.pipe(parser);
  });

  const { samples, mapping: used } = reader.finish();
  try {
    return { ...analyseSamples(samples), mapping: used };
  } catch (err) {
    if (err instanceof NoFlightFound)
      throw new AppError(400, 'no_flight_in_log', `No flight found in this log: ${err.message}`, { log: err.message });
    throw err;
  }
}
