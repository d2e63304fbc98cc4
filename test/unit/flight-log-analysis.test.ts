import { Readable } from 'node:stream';
import { AppError } from '../../server/platform/app-error';
import { analyseFlightLog, MAX_LOG_ROWS } from '../../server/flights/flight-log/analyse-flight-log';
import { analyseSamples, downsampleIndices, MAX_SERIES_POINTS } from '../../server/flights/flight-log/flight-analysis';
import { pressureAbovePadPa } from '../../server/flights/flight-log/pressure-altitude';

// Standard gravity (CGPM 1901) and an analytic flight: constant boost acceleration, a coast under standard gravity
// (no drag) through apogee, one more second of free fall, then a constant descent under the parachute.
const G = 9.80665;
const PAD_PA = 97_700; // about 300 m above sea level, like the prairie around Gopher Flats
const BOOST = 40; // m/s^2 for 2.5 s: 100 m/s at burnout, 125 m up
const BURN_S = 2.5;
const DESCENT = 5; // m/s under the parachute
const PAD_WAIT_S = 5;

const vb = BOOST * BURN_S;
const hb = 0.5 * BOOST * BURN_S ** 2;
const apogeeT = BURN_S + vb / G; // 12.697 s after liftoff
const apogeeM = hb + vb ** 2 / (2 * G); // 634.86 m
const openT = apogeeT + 1;
const openM = apogeeM - 0.5 * G;
const landT = openT + openM / DESCENT;

/** Height (m) and accelerometer reading (g) at a time after liftoff. */
function truth(tau: number): { h: number; accelG: number } {
  if (tau < 0) return { h: 0, accelG: 1 };
  if (tau <= BURN_S) return { h: 0.5 * BOOST * tau * tau, accelG: (BOOST + G) / G };
  if (tau <= openT) return { h: hb + vb * (tau - BURN_S) - 0.5 * G * (tau - BURN_S) ** 2, accelG: 0 };
  if (tau <= landT) return { h: openM - DESCENT * (tau - openT), accelG: 1 };
  return { h: 0, accelG: 1 };
}

/** A seeded generator, so a noisy test is the same on every run. */
function lcg(seed: number) {
  let x = seed;
  return () => {
    x = (x * 1103515245 + 12345) % 2147483648;
    return x / 2147483648;
  };
}

interface SynthOptions {
  hz?: number;
  noisePa?: number;
  seed?: number;
  timeMs?: boolean;
  hPa?: boolean;
  accel?: 'none' | 'one' | 'three';
  header?: string[];
}

/** The synthetic flight as CSV lines, pressures made from the inverse of the USSA 1976 formula. */
function* synthLines(o: SynthOptions = {}): Generator<string> {
  const hz = o.hz ?? 100;
  const rnd = lcg(o.seed ?? 7);
  const accel = o.accel ?? 'none';
  const header = o.header ?? [
    o.timeMs ? 'time_ms' : 'time',
    o.hPa ? 'pressure_hpa' : 'pressure',
    'temp',
    ...(accel === 'one' ? ['accel'] : accel === 'three' ? ['ax', 'ay', 'az'] : []),
  ];
  yield header.join(',') + '\n';
  const total = PAD_WAIT_S + landT + 5;
  for (let i = 0; i < total * hz; i++) {
    const time = i / hz;
    const { h, accelG } = truth(time - PAD_WAIT_S);
    const p = pressureAbovePadPa(h, PAD_PA) + (rnd() * 2 - 1) * (o.noisePa ?? 0);
    const cells = [
      o.timeMs ? (time * 1000).toFixed(1) : time.toFixed(4),
      o.hPa ? (p / 100).toFixed(4) : p.toFixed(2),
      '21.5',
    ];
    // Three axes: the push along the body, tilted a little, so only the magnitude is right.
    if (accel === 'one') cells.push(accelG.toFixed(3));
    if (accel === 'three')
      cells.push((accelG * 0.1).toFixed(4), (accelG * 0.2).toFixed(4), (accelG * Math.sqrt(1 - 0.05)).toFixed(4));
    yield cells.join(',') + '\n';
  }
}

/** Lines gathered into chunks of about 64 KB, as an upload arrives. */
function* chunked(lines: Iterable<string>): Generator<string> {
  let chunk = '';
  for (const line of lines) {
    chunk += line;
    if (chunk.length >= 65_536) {
      yield chunk;
      chunk = '';
    }
  }
  if (chunk) yield chunk;
}

const csv = (o?: SynthOptions) => Readable.from(chunked(synthLines(o)));
const within = (actual: number, expected: number, fraction = 0.01) => {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * fraction);
};
const eventAt = (events: { kind: string; t: number }[], kind: string) => events.find((e) => e.kind === kind)?.t;

describe('analyseFlightLog on a synthetic flight with an analytic answer', () => {
  it.each([0, 3])(
    'should find apogee, its time, max speed and descent rate within 1%% (pressure noise ±%d Pa)',
    async (noisePa) => {
      const r = await analyseFlightLog(csv({ noisePa }));
      within(r.summary.apogeeMetres, apogeeM);
      within(r.summary.apogeeFeet, apogeeM / 0.3048);
      within(r.summary.apogeeAtSeconds, apogeeT);
      within(r.summary.maxSpeedMps, vb);
      within(r.summary.descentRateMps!, DESCENT);
      within(r.summary.flightTimeSeconds!, landT);
      expect(r.summary.peakAccelG).toBeNull();
      expect(r.summary.samples).toBe(Math.ceil((PAD_WAIT_S + landT + 5) * 100));
    },
  );

  it.each([1, 2, 3])('should stay within 1%% at 50 readings a second with ±3 Pa noise (seed %d)', async (seed) => {
    const r = await analyseFlightLog(csv({ hz: 50, noisePa: 3, seed }));
    within(r.summary.apogeeMetres, apogeeM);
    within(r.summary.apogeeAtSeconds, apogeeT);
    within(r.summary.maxSpeedMps, vb);
    within(r.summary.descentRateMps!, DESCENT);
  });

  it('should place the events where the flight has them', async () => {
    const r = await analyseFlightLog(csv({ noisePa: 3 }));
    expect(r.events.map((e) => e.kind)).toEqual(['liftoff', 'burnout', 'apogee', 'deployment', 'landing']);
    expect(eventAt(r.events, 'liftoff')).toBe(0);
    expect(Math.abs(eventAt(r.events, 'burnout')! - BURN_S)).toBeLessThan(0.1);
    expect(Math.abs(eventAt(r.events, 'apogee')! - apogeeT)).toBeLessThan(0.1);
    expect(Math.abs(eventAt(r.events, 'deployment')! - openT)).toBeLessThan(0.5);
    expect(Math.abs(eventAt(r.events, 'landing')! - landT)).toBeLessThan(0.5);
  });

  it('should name the filter it smoothed with', async () => {
    const r = await analyseFlightLog(csv());
    expect(r.filter).toMatch(/Savitzky–Golay/);
  });

  it('should give at most 1,000 chart points, apogee among them, in time order', async () => {
    const r = await analyseFlightLog(csv({ noisePa: 3 }));
    expect(r.series.length).toBeLessThanOrEqual(MAX_SERIES_POINTS);
    expect(r.series.length).toBeGreaterThan(500);
    const top = Math.max(...r.series.map((p) => p.altitudeM));
    within(top, apogeeM);
    for (let i = 1; i < r.series.length; i++) expect(r.series[i].t).toBeGreaterThan(r.series[i - 1].t);
    expect(r.series[0].t).toBeLessThanOrEqual(0);
  });
});

describe('analyseFlightLog units and columns', () => {
  it('should read times in ms and pressures in hPa from their header names', async () => {
    const r = await analyseFlightLog(csv({ timeMs: true, hPa: true }));
    expect(r.mapping.time).toEqual({ column: 'time_ms', unit: 'ms' });
    expect(r.mapping.pressure).toEqual({ column: 'pressure_hpa', unit: 'hPa' });
    within(r.summary.apogeeMetres, apogeeM);
    within(r.summary.apogeeAtSeconds, apogeeT);
  });

  it('should use a mapping it is given for headers it would not guess', async () => {
    const r = await analyseFlightLog(csv({ header: ['stamp', 'baro_raw', 'degrees'], timeMs: false }), {
      time: { column: 'stamp', unit: 's' },
      pressure: { column: 'baro_raw', unit: 'Pa' },
    });
    within(r.summary.apogeeMetres, apogeeM);
  });

  it('should read one acceleration axis: peak in g and burnout from the accelerometer', async () => {
    const r = await analyseFlightLog(csv({ accel: 'one', noisePa: 3 }));
    expect(r.mapping.acceleration).toEqual({ columns: ['accel'], unit: 'g' });
    within(r.summary.peakAccelG!, (BOOST + G) / G);
    expect(Math.abs(eventAt(r.events, 'burnout')! - BURN_S)).toBeLessThanOrEqual(0.05);
  });

  it('should take the magnitude of three axes', async () => {
    const r = await analyseFlightLog(csv({ accel: 'three' }));
    expect(r.mapping.acceleration).toEqual({ columns: ['ax', 'ay', 'az'], unit: 'g' });
    // sqrt(0.01 + 0.04 + 0.95) = 1: the tilted axes add up to the push along the body
    within(r.summary.peakAccelG!, (BOOST + G) / G);
  });

  it('should turn m/s^2 into g', async () => {
    const lines = [...synthLines({ accel: 'one' })].map((line, i) => {
      if (i === 0) return line.replace('accel', 'accel_z (m/s^2)');
      const cells = line.trim().split(',');
      cells[3] = String(Number(cells[3]) * G);
      return cells.join(',') + '\n';
    });
    const r = await analyseFlightLog(Readable.from(lines));
    expect(r.mapping.acceleration).toEqual({ columns: ['accel_z (m/s^2)'], unit: 'm/s2' });
    within(r.summary.peakAccelG!, (BOOST + G) / G);
  });
});

describe('analyseFlightLog refusals', () => {
  const refusal = async (input: Readable, mapping?: Parameters<typeof analyseFlightLog>[1]) => {
    const err = await analyseFlightLog(input, mapping).then(
      () => null,
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(AppError);
    return err as AppError;
  };

  it('should answer 400 unmappable_log naming columns when no header says time and pressure', async () => {
    const err = await refusal(Readable.from(['a,b,c\n1,2,3\n']));
    expect(err.status).toBe(400);
    expect(err.code).toBe('unmappable_log');
    expect(err.fields?.columns).toBeDefined();
  });

  it('should answer 400 naming columns when the mapping names a column the log lacks', async () => {
    const err = await refusal(csv(), { time: { column: 'time', unit: 's' }, pressure: { column: 'nope', unit: 'Pa' } });
    expect(err.code).toBe('unmappable_log');
    expect(err.fields?.columns).toContain('"nope"');
  });

  it('should suggest hPa when a pressure column in hPa is read as Pa', async () => {
    const err = await refusal(csv({ hPa: true, header: ['time', 'p_raw', 'temp'] }), {
      time: { column: 'time', unit: 's' },
      pressure: { column: 'p_raw', unit: 'Pa' },
    });
    expect(err.fields?.columns).toMatch(/hPa\?/);
  });

  it('should answer 400 naming log for an empty file or a file with no numbers', async () => {
    expect((await refusal(Readable.from([]))).fields?.log).toBeDefined();
    const words = await refusal(Readable.from(['time,pressure\n', ...Array.from({ length: 50 }, () => 'soon,high\n')]));
    expect(words.code).toBe('unmappable_log');
    expect(words.fields?.log).toBeDefined();
  });

  it('should answer 400 for a file that is not CSV', async () => {
    const err = await refusal(Readable.from(['time,pressure\n"unclosed,1\n2,3\n']));
    expect(err.status).toBe(400);
    expect(err.code).toBe('unmappable_log');
  });

  it('should answer 400 no_flight_in_log for a log from the pad only', async () => {
    const lines = ['time,pressure\n', ...Array.from({ length: 500 }, (_, i) => `${i / 10},${PAD_PA + (i % 3)}\n`)];
    const err = await refusal(Readable.from(lines));
    expect(err.status).toBe(400);
    expect(err.code).toBe('no_flight_in_log');
    expect(err.fields?.log).toBeDefined();
  });

  it(`should refuse more than ${MAX_LOG_ROWS} rows with 400 naming log, and stop reading there`, async () => {
    // Two million rows on offer: a reader that streams stops pulling soon after row 200,000; one that took the
    // whole file first would pull them all.
    let yielded = 0;
    function* tooMany() {
      yield 'time,pressure\n';
      for (; yielded < 2_000_000; yielded++) yield `${yielded / 100},${PAD_PA}\n`;
    }
    const err = await refusal(Readable.from(chunked(tooMany())));
    expect(err.status).toBe(400);
    expect(err.fields?.log).toMatch(/200,000/);
    expect(yielded).toBeGreaterThan(MAX_LOG_ROWS);
    expect(yielded).toBeLessThan(400_000);
  }, 180_000);
});

describe('analyseFlightLog on a long log', () => {
  it('should read a 200,000-row log at 1,000 readings a second', async () => {
    // 200,000 rows at 1,000 readings a second: the flight above, then pad time to fill.
    function* longLog() {
      let rows = 0;
      yield 'time_ms,pressure_pa,temperature,ax,ay,az\n';
      for (; rows < MAX_LOG_ROWS; rows++) {
        const time = rows / 1000;
        const { h, accelG } = truth(time - PAD_WAIT_S);
        yield `${(time * 1000).toFixed(0)},${pressureAbovePadPa(h, PAD_PA).toFixed(2)},20.0,0,0,${accelG.toFixed(3)}\n`;
      }
    }
    // That the reader streams is shown by the refusal test above (it stops pulling); this one shows a full-size
    // log is read whole and right. No wall-clock limit: the machine is shared; a generous timeout instead.
    const r = await analyseFlightLog(Readable.from(chunked(longLog())));
    expect(r.summary.samples).toBe(MAX_LOG_ROWS);
    within(r.summary.apogeeMetres, apogeeM);
    within(r.summary.maxSpeedMps, vb);
    expect(r.filter).toMatch(/10 ms bins/);
  }, 180_000);
});

describe('analyseSamples on a dual-deployment descent', () => {
  it.each([0, 3])(
    'should read the main descent rate and the main opening, not the drogue (noise ±%d Pa)',
    (noisePa) => {
      // Apogee as above, a drogue at a constant 20 m/s down to 60 m, then the main at a constant 5 m/s.
      const drogueRate = 20;
      const mainAt = 60;
      const mainT = apogeeT + (apogeeM - mainAt) / drogueRate;
      const downT = mainT + mainAt / DESCENT;
      const height = (tau: number) =>
        tau <= apogeeT
          ? truth(tau).h
          : tau <= mainT
            ? apogeeM - drogueRate * (tau - apogeeT)
            : tau <= downT
              ? mainAt - DESCENT * (tau - mainT)
              : 0;
      const hz = 100;
      const n = Math.floor((PAD_WAIT_S + downT + 5) * hz);
      const rnd = lcg(11);
      const t = new Float64Array(n);
      const p = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        t[i] = i / hz;
        p[i] = pressureAbovePadPa(height(t[i] - PAD_WAIT_S), PAD_PA) + (rnd() * 2 - 1) * noisePa;
      }
      const r = analyseSamples({ t, pressurePa: p, accelG: null });
      within(r.summary.descentRateMps!, DESCENT);
      within(r.summary.apogeeMetres, apogeeM);
      expect(Math.abs(eventAt(r.events, 'deployment')! - mainT)).toBeLessThan(0.5);
      expect(Math.abs(eventAt(r.events, 'landing')! - downT)).toBeLessThan(0.5);
    },
  );
});

describe('analyseSamples and downsampleIndices', () => {
  it('should keep the indices it must keep and stay under the limit', () => {
    const picked = downsampleIndices(0, 99_999, 1000, [12_345]);
    expect(picked.length).toBeLessThanOrEqual(1000);
    expect(picked).toContain(12_345);
    expect(picked[0]).toBe(0);
    expect(picked[picked.length - 1]).toBe(99_999);
    expect(downsampleIndices(5, 9, 1000, [])).toEqual([5, 6, 7, 8, 9]);
  });

  it('should leave flight time and landing out when the log ends in the air', () => {
    const hz = 100;
    const n = Math.floor((PAD_WAIT_S + 60) * hz);
    const t = new Float64Array(n);
    const p = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      t[i] = i / hz;
      p[i] = pressureAbovePadPa(truth(t[i] - PAD_WAIT_S).h, PAD_PA);
    }
    const r = analyseSamples({ t, pressurePa: p, accelG: null });
    expect(r.summary.flightTimeSeconds).toBeNull();
    expect(r.events.map((e) => e.kind)).not.toContain('landing');
    within(r.summary.apogeeMetres, apogeeM);
  });
});

describe('analyseSamples with an accelerometer that never reads like the pad', () => {
  it('should take liftoff from the climb when the readings stay high (m/s^2 read as g)', () => {
    const hz = 100;
    const n = Math.floor((PAD_WAIT_S + 30) * hz);
    const t = new Float64Array(n);
    const p = new Float64Array(n);
    const a = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      t[i] = i / hz;
      const { h, accelG } = truth(t[i] - PAD_WAIT_S);
      p[i] = pressureAbovePadPa(h, PAD_PA);
      a[i] = accelG * G + 9.8; // never under 9.8 "g"
    }
    const r = analyseSamples({ t, pressurePa: p, accelG: a });
    within(r.summary.apogeeAtSeconds, apogeeT);
  });
});
