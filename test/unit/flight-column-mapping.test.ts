import { guessColumnMapping, missingColumns } from '../../contracts/flights/column-mapping';
import { columnMappingSchema } from '../../contracts/flights/column-mapping-schema';

describe('guessColumnMapping', () => {
  it('should map time in seconds and pressure in Pa', () => {
    expect(guessColumnMapping(['time', 'pressure', 'temp'])).toEqual({
      time: { column: 'time', unit: 's' },
      pressure: { column: 'pressure', unit: 'Pa' },
      temperature: { column: 'temp', unit: 'C' },
    });
  });

  it('should see ms and hPa in the header names', () => {
    expect(guessColumnMapping(['time_ms', 'pressure_hpa'])).toEqual({
      time: { column: 'time_ms', unit: 'ms' },
      pressure: { column: 'pressure_hpa', unit: 'hPa' },
    });
    expect(guessColumnMapping(['Time (ms)', 'Pressure (hPa)'])).toMatchObject({
      time: { unit: 'ms' },
      pressure: { unit: 'hPa' },
    });
    expect(guessColumnMapping(['t', 'press_pa'])).toMatchObject({
      time: { column: 't', unit: 's' },
      pressure: { column: 'press_pa', unit: 'Pa' },
    });
  });

  it('should read baro as hPa and keep the header as written', () => {
    expect(guessColumnMapping(['T', 'Baro'])).toEqual({
      time: { column: 'T', unit: 's' },
      pressure: { column: 'Baro', unit: 'hPa' },
    });
  });

  it('should find three acceleration axes before a single one', () => {
    expect(guessColumnMapping(['time', 'pressure', 'ax', 'ay', 'az'])?.acceleration).toEqual({
      columns: ['ax', 'ay', 'az'],
      unit: 'g',
    });
    expect(guessColumnMapping(['time', 'pressure', 'accel_x', 'accel_y', 'accel_z'])?.acceleration).toEqual({
      columns: ['accel_x', 'accel_y', 'accel_z'],
      unit: 'g',
    });
  });

  it('should map one acceleration column and see m/s^2 in its name', () => {
    expect(guessColumnMapping(['time', 'pressure', 'accel'])?.acceleration).toEqual({ columns: ['accel'], unit: 'g' });
    expect(guessColumnMapping(['time', 'pressure', 'accel_z'])?.acceleration).toEqual({
      columns: ['accel_z'],
      unit: 'g',
    });
    expect(guessColumnMapping(['time', 'pressure', 'Accel Z (m/s^2)'])?.acceleration).toEqual({
      columns: ['Accel Z (m/s^2)'],
      unit: 'm/s2',
    });
    expect(guessColumnMapping(['time', 'pressure', 'accel (m/s²)'])?.acceleration).toEqual({
      columns: ['accel (m/s²)'],
      unit: 'm/s2',
    });
  });

  it('should give null without a time or a pressure column', () => {
    expect(guessColumnMapping(['altitude', 'pressure'])).toBeNull();
    expect(guessColumnMapping(['time', 'altitude'])).toBeNull();
    expect(guessColumnMapping([])).toBeNull();
  });
});

describe('columnMappingSchema', () => {
  it('should accept a full mapping', () => {
    const mapping = {
      time: { column: 'ms', unit: 'ms' },
      pressure: { column: 'p', unit: 'hPa' },
      temperature: { column: 'c', unit: 'C' },
      acceleration: { columns: ['x', 'y', 'z'], unit: 'm/s2' },
    };
    expect(columnMappingSchema.parse(mapping)).toEqual(mapping);
  });

  it.each([
    [
      'an unknown time unit',
      { time: { column: 't', unit: 'min' }, pressure: { column: 'p', unit: 'Pa' } },
      'time.unit',
    ],
    ['a blank column', { time: { column: ' ', unit: 's' }, pressure: { column: 'p', unit: 'Pa' } }, 'time.column'],
    ['no pressure', { time: { column: 't', unit: 's' } }, 'pressure'],
    [
      'two axes',
      {
        time: { column: 't', unit: 's' },
        pressure: { column: 'p', unit: 'Pa' },
        acceleration: { columns: ['x', 'y'], unit: 'g' },
      },
      'acceleration.columns',
    ],
    ['an extra key', { time: { column: 't', unit: 's' }, pressure: { column: 'p', unit: 'Pa' }, altitude: {} }, ''],
  ])('should refuse %s', (_name, value, path) => {
    const result = columnMappingSchema.safeParse(value);
    expect(result.success).toBe(false);
    if (path) expect(result.error!.issues.map((i) => i.path.join('.'))).toContain(path);
  });
});

describe('missingColumns', () => {
  it('should name each column the headers lack', () => {
    const mapping = {
      time: { column: 't', unit: 's' as const },
      pressure: { column: 'p', unit: 'Pa' as const },
      acceleration: { columns: ['az'], unit: 'g' as const },
    };
    expect(missingColumns(mapping, ['t', 'p', 'az'])).toEqual({});
    expect(missingColumns(mapping, ['t'])).toEqual({
      'columns.pressure': 'The log has no column named "p".',
      'columns.acceleration': 'The log has no column named "az".',
    });
  });
});
