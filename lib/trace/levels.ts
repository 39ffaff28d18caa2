// Splitting a trace into a sleep and an active level with Otsu's method: a time-weighted histogram of the
// sample currents, cut where the between-class variance is largest.
//
// The histogram is taken of asinh(i / s) with s = 10⁻⁶ of the largest |i|: logarithmic for currents well
// above s (sleep at µA and wakes at tens of mA sit far apart, and a short spike far above the active
// level stays close to it), linear near zero, so zero and slightly negative sleep readings are fine. The
// threshold is the midpoint of the two classes' means on that scale (near the geometric mean of the
// levels), and the hysteresis band is ±10 % of their gap on the same scale.

const BINS = 4096;
const HYSTERESIS = 0.1;
/** Below this share of explained variance the trace is not called two-level (Gaussian noise gives 0.64). */
export const MIN_SEPARATION = 0.85;

export type LevelSplit = {
  /** Otsu's separation measure on the compressed scale: between-class over total variance, 0..1. */
  separation: number;
  /** Current that divides the classes, A; null when nothing splits. */
  threshold: number | null;
  /** Hysteresis: a sleeping trace wakes above `on` and a waking one sleeps again below `off`. */
  on: number | null;
  off: number | null;
  /** Time-weighted means of the two classes, A. */
  low: number | null;
  high: number | null;
};

const NONE = { threshold: null, on: null, off: null, low: null, high: null };

/** Sample k (k < n − 1) holds its current i[k] for t[k+1] − t[k] (sample-and-hold). */
export function splitLevels(t: Float64Array, i: Float64Array): LevelSplit {
  const n = Math.min(t.length, i.length);
  if (n < 2) return { separation: 0, ...NONE };
  let big = 0;
  for (let k = 0; k < n - 1; k++) big = Math.max(big, Math.abs(i[k]));
  if (!(big > 0) || !Number.isFinite(big)) return { separation: 0, ...NONE };
  const s = big * 1e-6;
  const g = new Float64Array(n - 1);
  let lo = Infinity;
  let hi = -Infinity;
  let total = 0;
  let gSum = 0;
  let last = NaN;
  let gLast = NaN;
  for (let k = 0; k < n - 1; k++) {
    // logged currents repeat (flat levels, ADC codes): reuse the last transform
    if (i[k] !== last) {
      last = i[k];
      gLast = Math.asinh(last / s);
    }
    const v = gLast;
    g[k] = v;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
    const dt = t[k + 1] - t[k];
    total += dt;
    gSum += v * dt;
  }
  const span = hi - lo;
  if (!(span > 1e-9)) return { separation: 0, ...NONE };
  const gMean = gSum / total;

  const weight = new Float64Array(BINS);
  const sum = new Float64Array(BINS);
  let varSum = 0;
  const scale = BINS / span;
  for (let k = 0; k < n - 1; k++) {
    const v = g[k];
    const dt = t[k + 1] - t[k];
    let b = Math.floor((v - lo) * scale);
    if (b >= BINS) b = BINS - 1;
    weight[b] += dt;
    sum[b] += v * dt;
    varSum += (v - gMean) * (v - gMean) * dt;
  }
  let w0 = 0;
  let s0 = 0;
  let best = -1;
  let bestBin = -1;
  for (let b = 0; b < BINS - 1; b++) {
    w0 += weight[b];
    s0 += sum[b];
    const w1 = total - w0;
    if (w0 <= 0 || w1 <= 0) continue;
    const d = s0 / w0 - (gSum - s0) / w1;
    const between = w0 * w1 * d * d;
    if (between > best) {
      best = between;
      bestBin = b;
    }
  }
  if (bestBin < 0 || !(varSum > 0)) return { separation: 0, ...NONE };
  const separation = Math.min(1, best / (total * varSum));

  // exact time-weighted class means (in amperes) on either side of the histogram cut
  const cut = lo + (bestBin + 1) / scale;
  let wl = 0;
  let sl = 0;
  let wh = 0;
  let sh = 0;
  for (let k = 0; k < n - 1; k++) {
    const dt = t[k + 1] - t[k];
    if (g[k] >= cut) {
      wh += dt;
      sh += i[k] * dt;
    } else {
      wl += dt;
      sl += i[k] * dt;
    }
  }
  if (!(wl > 0 && wh > 0)) return { separation, ...NONE };
  const low = sl / wl;
  const high = sh / wh;
  const gLow = Math.asinh(low / s);
  const gHigh = Math.asinh(high / s);
  const mid = (gLow + gHigh) / 2;
  const band = HYSTERESIS * (gHigh - gLow);
  return {
    separation,
    threshold: s * Math.sinh(mid),
    on: s * Math.sinh(mid + band),
    off: s * Math.sinh(mid - band),
    low,
    high,
  };
}
