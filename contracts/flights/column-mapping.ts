// Which columns of an altimeter log hold what, and in which unit. Hobby altimeters each write their own layout, so
// the flyer confirms (or picks) the columns after seeing the first rows; common header names map themselves. Both the upload form (to prefill) and the server (when no mapping is sent) guess
// with this one function.

/** Which columns hold time, pressure and (optionally) temperature and acceleration, with their units. */
export interface ColumnMapping {
  time: { column: string; unit: 's' | 'ms' };
  pressure: { column: string; unit: 'Pa' | 'hPa' };
  temperature?: { column: string; unit: 'C' };
  acceleration?: { columns: string[]; unit: 'g' | 'm/s2' };
}

// Header names are compared without case, spaces, brackets or punctuation: "Pressure (Pa)" -> "pressurepa",
// "accel_z (m/s^2)" -> "accelzms2".
const METRES_PER_S2 = /m\s*\/\s*s\s*(?:\^\s*2|²|\/\s*s|2)|m\s*s\s*\^?\s*-\s*2/gi;
const squash = (header: string) =>
  header
    .toLowerCase()
    .replace(METRES_PER_S2, 'ms2')
    .replace(/[^a-z0-9]+/g, '');

const TIME_MS = ['timems', 'tms', 'millis', 'milliseconds', 'ms', 'timestampms'];
const TIME_S = ['time', 't', 'times', 'seconds', 'sec', 'secs', 'timesec', 'timestamp', 'elapsed', 'elapseds'];
const PRESSURE_HPA = ['pressurehpa', 'presshpa', 'hpa', 'pressurembar', 'pressuremb', 'mbar', 'baro', 'barohpa'];
const PRESSURE_PA = ['pressure', 'pressurepa', 'presspa', 'press', 'pa', 'baropa', 'barometer', 'p'];
const TEMPERATURE = ['temp', 'temperature', 'tempc', 'temperaturec', 'degc', 'c'];
const ACCEL_SINGLE = [
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
];
const AXES = [
  ['ax', 'ay', 'az'],
  ['accelx', 'accely', 'accelz'],
  ['accx', 'accy', 'accz'],
  ['accelerationx', 'accelerationy', 'accelerationz'],
];

function find(headers: string[], names: string[]): string | undefined {
  // In the order of the list: the more telling names come first.
  for (const name of names) {
    const hit = headers.find((h) => squash(h) === name);
    if (hit !== undefined) return hit;
  }
  return undefined;
}

function findAxis(headers: string[], name: string): string | undefined {
  return headers.find((h) => {
    const s = squash(h);
    return s === name || s === `${name}g` || s === `${name}ms2`;
  });
}

const looksLikeMetresPerSecondSquared = (header: string) => squash(header).endsWith('ms2');

/** A mapping from recognised header names (time, time_ms, t, pressure, press_pa, baro, temp, accel, ax/ay/az ...), or null. */
export function guessColumnMapping(headers: string[]): ColumnMapping | null {
  const msColumn = find(headers, TIME_MS);
  const sColumn = msColumn === undefined ? find(headers, TIME_S) : undefined;
  const hpaColumn = find(headers, PRESSURE_HPA);
  const paColumn = hpaColumn === undefined ? find(headers, PRESSURE_PA) : undefined;
  const timeColumn = msColumn ?? sColumn;
  const pressureColumn = hpaColumn ?? paColumn;
  if (timeColumn === undefined || pressureColumn === undefined) return null;

  const mapping: ColumnMapping = {
    time: { column: timeColumn, unit: msColumn !== undefined ? 'ms' : 's' },
    pressure: { column: pressureColumn, unit: hpaColumn !== undefined ? 'hPa' : 'Pa' },
  };
  const temperature = find(headers, TEMPERATURE);
  if (temperature !== undefined) mapping.temperature = { column: temperature, unit: 'C' };

  for (const axes of AXES) {
    const found = axes.map((a) => findAxis(headers, a));
    if (found.every((f) => f !== undefined)) {
      mapping.acceleration = {
        columns: found as string[],
        unit: found.some((f) => looksLikeMetresPerSecondSquared(f!)) ? 'm/s2' : 'g',
      };
      return mapping;
    }
  }
  const single = find(headers, ACCEL_SINGLE);
  if (single !== undefined)
    mapping.acceleration = { columns: [single], unit: looksLikeMetresPerSecondSquared(single) ? 'm/s2' : 'g' };
  return mapping;
}

/** The columns a mapping names that are missing from the headers, as field errors; empty when all are there. */
export function missingColumns(mapping: ColumnMapping, headers: string[]): Record<string, string> {
  const errors: Record<string, string> = {};
  const check = (field: string, name: string) => {
    if (!headers.includes(name)) errors[field] ??= `The log has no column named "${name}".`;
  };
  check('columns.time', mapping.time.column);
  check('columns.pressure', mapping.pressure.column);
  if (mapping.temperature) check('columns.temperature', mapping.temperature.column);
  mapping.acceleration?.columns.forEach((c) => check('columns.acceleration', c));
  return errors;
}
