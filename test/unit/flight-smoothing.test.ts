import { findCorner, median, movingAverage, smoothQuadratic } from '../../server/flights/flight-log/smoothing';

const range = (n: number, dt: number) => Float64Array.from({ length: n }, (_, i) => i * dt);

describe('smoothQuadratic', () => {
  it('should reproduce a parabola and its slope exactly (a quadratic fit of a quadratic)', () => {
    const t = range(300, 0.01);
    const y = t.map((x) => 3 + 2 * x - 4.9 * x * x);
    const s = smoothQuadratic(t, y, 0.5);
    for (const i of [0, 10, 150, 299]) {
      expect(s.value[i]).toBeCloseTo(y[i], 9);
      expect(s.slope[i]).toBeCloseTo(2 - 9.8 * t[i], 7);
      expect(s.curvature[i]).toBeCloseTo(-9.8, 5);
    }
  });

  it('should keep a corner sharp where a centred window would round it', () => {
    // Slope 10 then 0 after t = 1: a centred 0.5 s window would read 7.5 or so near the corner.
    const t = range(200, 0.01);
    const y = t.map((x) => (x < 1 ? 10 * x : 10));
    const s = smoothQuadratic(t, y, 0.5);
    expect(s.slope[95]).toBeCloseTo(10, 6);
    expect(s.slope[105]).toBeCloseTo(0, 6);
  });

  it('should cut noise on a flat line', () => {
    let x = 3;
    const rnd = () => ((x = (x * 1103515245 + 12345) % 2147483648) / 2147483648) * 2 - 1;
    const t = range(2000, 0.01);
    const y = t.map(() => rnd() * 0.25);
    const s = smoothQuadratic(t, y, 1);
    const rms = (a: ArrayLike<number>) => Math.sqrt(Array.from(a).reduce((q, v) => q + v * v, 0) / a.length);
    expect(rms(s.value)).toBeLessThan(rms(y) / 3);
    expect(rms(s.slope)).toBeLessThan(0.3);
  });
});

describe('findCorner', () => {
  it('should find where the push stops and the slope there', () => {
    // h = 20 t^2 up to 2.5 s, then a coast under 9.80665 m/s^2: the corner at 2.5 s with a slope of 100 m/s
    const t = range(500, 0.01);
    const y = t.map((x) => (x <= 2.5 ? 20 * x * x : 125 + 100 * (x - 2.5) - 4.903325 * (x - 2.5) ** 2));
    const c = findCorner(t, y, 200, 300, 1)!;
    expect(c.t).toBeCloseTo(2.5, 6);
    expect(c.slope).toBeCloseTo(100, 4);
    expect(c.value).toBeCloseTo(125, 4);
  });
});

describe('movingAverage and median', () => {
  it('should average over a centred window', () => {
    const t = range(5, 1);
    expect(Array.from(movingAverage(t, [0, 10, 20, 30, 40], 2))).toEqual([5, 10, 20, 30, 35]);
  });

  it('should give the middle value', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 2, 3])).toBe(2.5);
    expect(median([])).toBeNaN();
  });
});
