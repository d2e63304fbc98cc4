import type { ColumnMapping } from './flight-data';

/**
 * The browser's first look at a log: the header row and the first rows, and a guess at the columns. The server
 * reads the whole file and guesses again when no mapping is sent (server/flights/flight-log/column-mapping.ts);
 * this copy only prefills the form, so the two may differ on odd headers without harm.
 */

/** The header row and up to `rows` data rows of a CSV text (comma, semicolon or tab separated; `#` comments). */
export function previewRows(text: string, rows = 5): { headers: string[]; rows: string[][] } {
  const lines = text
    .replace(/^\uFEFF/, '')
    .split(/\r\n|\n|\r/)
    .filter((l) => l.trim() !== '' && !l.startsWith('#'));
  if (lines.length === 0) return { headers: [], rows: [] };
  const counts = [',', ';', '\t'].map((d) => [d, lines[0].split(d).length] as const);
  const delimiter = counts.reduce((best, c) => (c[1] > best[1] ? c : best))[0];
  const split = (line: string) => line.split(delimiter).map((cell) => cell.trim().replace(/^"(.*)"$/, '$1'));
  const body = lines.slice(1, rows + 1);
  return { headers: split(lines[0]), rows: body.map(split) };
}

const squash = (h: string) =>
  h
    .toLowerCase()
    .replace(/m\s*\/\s*s\s*(?:\^\s*2|²|\/\s*s|2)|m\s*s\s*\^?\s*-\s*2/gi, 'ms2')
    .replace(/[^a-z0-9]+/g, '');
const find = (headers: string[], names: string[]) => {
  for (const n of names) {
    const hit = headers.find((h) => squash(h) === n);
    if (hit !== undefined) return hit;
  }
  return undefined;
};

/** A mapping from recognised header names, or null when time or pressure is not among them. */
export function guessMapping(headers: string[]): ColumnMapping | null {
  const ms = find(headers, ['timems', 'tms', 'millis', 'milliseconds', 'ms', 'timestampms']);
  const s =
    ms ??
    find(headers, ['time', 't', 'times', 'seconds', 'sec', 'secs', 'timesec', 'timestamp', 'elapsed', 'elapseds']);
  const hpa = find(headers, [
    'pressurehpa',
    'presshpa',
    'hpa',
    'pressurembar',
    'pressuremb',
    'mbar',
    'baro',
    'barohpa',
  ]);
  const pa = hpa ?? find(headers, ['pressure', 'pressurepa', 'presspa', 'press', 'pa', 'baropa', 'barometer', 'p']);
  if (s === undefined || pa === undefined) return null;
  const mapping: ColumnMapping = {
    time: { column: s, unit: ms ? 'ms' : 's' },
    pressure: { column: pa, unit: hpa ? 'hPa' : 'Pa' },
  };
  const temp = find(headers, ['temp', 'temperature', 'tempc', 'temperaturec', 'degc', 'c']);
  if (temp !== undefined) mapping.temperature = { column: temp, unit: 'C' };
  const unit = (cols: string[]) => (cols.some((c) => squash(c).endsWith('ms2')) ? 'm/s2' : 'g');
  for (const axes of [
    ['ax', 'ay', 'az'],
    ['accelx', 'accely', 'accelz'],
    ['accx', 'accy', 'accz'],
    ['accelerationx', 'accelerationy', 'accelerationz'],
  ]) {
    const found = axes.map((a) => headers.find((h) => [a, `${a}g`, `${a}ms2`].includes(squash(h))));
    if (found.every((f) => f !== undefined)) {
      mapping.acceleration = { columns: found as string[], unit: unit(found as string[]) };
      return mapping;
    }
  }
  const one = find(headers, [
    'accel',
    'acceleration',
    'accelz',
    'az',
    'acc',
    'accz',
    'accelerationz',
    'accelg',
    'accelerationg',
    'accelzg',
    'azg',
    'accms2',
    'accelms2',
    'accelzms2',
  ]);
  if (one !== undefined) mapping.acceleration = { columns: [one], unit: unit([one]) };
  return mapping;
}

/** The text of a slice of a file (FileReader, which every browser and the test DOM have). */
export function readText(blob: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result ?? ''));
    reader.onerror = () => reject(reader.error);
    reader.readAsText(blob);
  });
}
