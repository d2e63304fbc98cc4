/**
 * Smoothing before differentiating. Barometric altitude carries sensor noise of a few tenths of a metre;
 * differentiating it raw gives speeds that jump by metres per second from sample to sample. Padside fits a
 * quadratic by least squares to the samples in a window of fixed duration around each sample (Savitzky–Golay
 * smoothing, generalised to uneven sample times) and reads the value and the slope at the sample.
 *
 * A centred window smears the sharp corners of a flight (burnout, a parachute opening) and shaves the peak speed.
 * So each sample also gets a window ending at it and one starting at it, and keeps the fit of the three with the
 * smallest residual per degree of freedom: near a corner the window on one side fits the flight on that side
 * without the other (an edge-preserving choice in the manner of Kuwahara's filter). Where all three fit alike the
 * centred one is kept, since its slope is the least noisy. Pure: no I/O.
 */

/** The smoothed value and its first and second derivatives at each sample. */
export interface Smoothed {
  value: Float64Array;
  slope: Float64Array;
  curvature: Float64Array;
}

/** How many times smaller a one-sided window's residual must be than the centred one's to be taken. */
export const ONE_SIDED_ADVANTAGE = 2;

interface Fit {
  a: number;
  b: number;
  c: number;
  /** Residual sum of squares over degrees of freedom; Infinity when the window cannot hold a quadratic. */
  score: number;
}

const NO_FIT: Fit = { a: 0, b: 0, c: 0, score: Infinity };

/** Least-squares quadratic y = a + b d + c d^2 with d = t - t0 over samples lo..hi (inclusive). */
function fitQuadratic(t: ArrayLike<number>, y: ArrayLike<number>, lo: number, hi: number, t0: number): Fit {
  const n = hi - lo + 1;
  let s1 = 0,
    s2 = 0,
    s3 = 0,
    s4 = 0,
    sy = 0,
    sdy = 0,
    sd2y = 0,
    syy = 0;
  // Values relative to the window's first sample keep the sums small, so RSS does not drown in cancellation.
  const y0 = y[lo];
  for (let k = lo; k <= hi; k++) {
    const d = t[k] - t0;
    const d2 = d * d;
    const v = y[k] - y0;
    s1 += d;
    s2 += d2;
    s3 += d2 * d;
    s4 += d2 * d2;
    sy += v;
    sdy += d * v;
    sd2y += d2 * v;
    syy += v * v;
  }
  // Normal equations [[n s1 s2] [s1 s2 s3] [s2 s3 s4]] [a b c] = [sy sdy sd2y], by Cramer's rule.
  const det = n * (s2 * s4 - s3 * s3) - s1 * (s1 * s4 - s3 * s2) + s2 * (s1 * s3 - s2 * s2);
  const scale = Math.max(1e-300, Math.abs(n * s2 * s4));
  if (n < 4 || Math.abs(det) <= 1e-12 * scale) {
    const mean = sy / n;
    return {
      a: mean + y0,
      b: n > 1 && s2 - (s1 * s1) / n > 0 ? (sdy - (s1 * sy) / n) / (s2 - (s1 * s1) / n) : 0,
      c: 0,
      score: Infinity,
    };
  }
  const a = (sy * (s2 * s4 - s3 * s3) - s1 * (sdy * s4 - s3 * sd2y) + s2 * (sdy * s3 - s2 * sd2y)) / det;
  const b = (n * (sdy * s4 - s3 * sd2y) - sy * (s1 * s4 - s3 * s2) + s2 * (s1 * sd2y - sdy * s2)) / det;
  const c = (n * (s2 * sd2y - s3 * sdy) - s1 * (s1 * sd2y - sdy * s2) + sy * (s1 * s3 - s2 * s2)) / det;
  const rss = Math.max(0, syy - (a * sy + b * sdy + c * sd2y));
  return { a: a + y0, b, c, score: rss / (n - 3) };
}

/**
 * Edge-preserving Savitzky–Golay smoothing (local quadratic least squares) of y sampled at increasing times t,
 * over windows of `windowS` seconds: centred, ending at, or starting at each sample, whichever fits best.
 */
export function smoothQuadratic(t: ArrayLike<number>, y: ArrayLike<number>, windowS: number): Smoothed {
  const n = t.length;
  const out: Smoothed = { value: new Float64Array(n), slope: new Float64Array(n), curvature: new Float64Array(n) };
  const half = windowS / 2;
  // Three moving edges per window kind, advanced monotonically: O(n x samples per window).
  let cLo = 0,
    cHi = 0,
    lLo = 0,
    rHi = 0;
  for (let i = 0; i < n; i++) {
    const ti = t[i];
    while (t[cLo] < ti - half) cLo++;
    while (cHi + 1 < n && t[cHi + 1] <= ti + half) cHi++;
    while (t[lLo] < ti - windowS) lLo++;
    if (rHi < i) rHi = i;
    while (rHi + 1 < n && t[rHi + 1] <= ti + windowS) rHi++;
    const centred = fitQuadratic(t, y, cLo, cHi, ti);
    // A one-sided window cut short by the end of the log has too few samples for its residual to mean much.
    const left = ti - t[lLo] >= 0.9 * windowS ? fitQuadratic(t, y, lLo, i, ti) : NO_FIT;
    const right = t[rHi] - ti >= 0.9 * windowS ? fitQuadratic(t, y, i, rHi, ti) : NO_FIT;
    const side = left.score <= right.score ? left : right;
    // A one-sided fit has a noisier slope at its end, so it must fit clearly better to be taken.
    const best =
      Number.isFinite(side.score) &&
      (side.score * ONE_SIDED_ADVANTAGE < centred.score || !Number.isFinite(centred.score))
        ? side
        : centred;
    out.value[i] = best.a;
    out.slope[i] = best.b;
    out.curvature[i] = 2 * best.c;
  }
  return out;
}

/** Centred moving average over `windowS` seconds (for accelerometer readings, which are not differentiated). */
export function movingAverage(t: ArrayLike<number>, y: ArrayLike<number>, windowS: number): Float64Array {
  const n = t.length;
  const out = new Float64Array(n);
  const half = windowS / 2;
  let lo = 0,
    hi = -1,
    sum = 0;
  for (let i = 0; i < n; i++) {
    while (hi + 1 < n && t[hi + 1] <= t[i] + half) sum += y[++hi];
    while (t[lo] < t[i] - half) sum -= y[lo++];
    out[i] = sum / (hi - lo + 1);
  }
  return out;
}

/** Median of a list of numbers (NaN for none); the list is not changed. */
export function median(values: ArrayLike<number>): number {
  const sorted = Float64Array.from(values).sort();
  const n = sorted.length;
  if (n === 0) return NaN;
  return n % 2 ? sorted[(n - 1) / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2;
}

/** Solves a small dense linear system in place by Gaussian elimination with partial pivoting; null if singular. */
function solve(m: number[][], r: number[]): number[] | null {
  const n = r.length;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) if (Math.abs(m[row][col]) > Math.abs(m[pivot][col])) pivot = row;
    if (Math.abs(m[pivot][col]) < 1e-12 * Math.max(1, Math.abs(m[0][0]))) return null;
    [m[col], m[pivot]] = [m[pivot], m[col]];
    [r[col], r[pivot]] = [r[pivot], r[col]];
    for (let row = col + 1; row < n; row++) {
      const f = m[row][col] / m[col][col];
      for (let k = col; k < n; k++) m[row][k] -= f * m[col][k];
      r[row] -= f * r[col];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let row = n - 1; row >= 0; row--) {
    let acc = r[row];
    for (let k = row + 1; k < n; k++) acc -= m[row][k] * x[k];
    x[row] = acc / m[row][row];
  }
  return x;
}

/** A corner found by segmented regression: where it is, and the value and slope there. */
export interface Corner {
  t: number;
  value: number;
  slope: number;
}

/**
 * Finds a corner where the curvature jumps but value and slope run on (burnout: the push stops, the speed does
 * not jump). For each sample from `from` to `to` as a trial corner, fits y = a + b d + c d^2 before it and
 * a + b d + e d^2 after it (d = t - corner) over `windowS` seconds each side, and keeps the trial with the least
 * residual (segmented least-squares regression). Null when no trial fits.
 */
export function findCorner(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  from: number,
  to: number,
  windowS: number,
): Corner | null {
  let best: (Corner & { rss: number }) | null = null;
  let lo = 0,
    hi = 0;
  for (let i = Math.max(1, from); i <= Math.min(to, t.length - 2); i++) {
    const tk = t[i];
    while (t[lo] < tk - windowS) lo++;
    if (hi < i) hi = i;
    while (hi + 1 < t.length && t[hi + 1] <= tk + windowS) hi++;
    if (i - lo < 3 || hi - i < 3) continue;
    const m = [
      [0, 0, 0, 0],
      [0, 0, 0, 0],
      [0, 0, 0, 0],
      [0, 0, 0, 0],
    ];
    const r = [0, 0, 0, 0];
    const y0 = y[i];
    let syy = 0;
    for (let k = lo; k <= hi; k++) {
      const d = t[k] - tk;
      const row = [1, d, d < 0 ? d * d : 0, d < 0 ? 0 : d * d];
      const v = y[k] - y0;
      for (let p = 0; p < 4; p++) {
        r[p] += row[p] * v;
        for (let q = 0; q < 4; q++) m[p][q] += row[p] * row[q];
      }
      syy += v * v;
    }
    const rhs = [...r];
    const x = solve(m, r);
    if (!x) continue;
    const rss = syy - (x[0] * rhs[0] + x[1] * rhs[1] + x[2] * rhs[2] + x[3] * rhs[3]);
    if (!best || rss < best.rss) best = { t: tk, value: x[0] + y0, slope: x[1], rss };
  }
  return best && { t: best.t, value: best.value, slope: best.slope };
}
