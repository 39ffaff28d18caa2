// Splitting a trace into a sleep and an active level with Otsu's method: a time-weighted histogram of the
// sample currents, cut where the between-class variance is largest. A short spike carries little time and
// so cannot pull the cut the way a min/max midpoint would.

const BINS = 4096;
/** Below this share of explained variance the trace is not called two-level (Gaussian noise gives 0.64). */
export const MIN_SEPARATION = 0.85;

export type LevelSplit = {
  /** Otsu's separation measure: between-class variance over total variance, 0..1. */
  separation: number;
  /** Midpoint between the two classes' time-weighted means; null when nothing splits. */
  threshold: number | null;
  low: number | null;
  high: number | null;
};

/**
 * Sample k (k < n − 1) holds its current i[k] for t[k+1] − t[k] (sample-and-hold). `mean` is the
 * time-weighted mean over the same intervals.
 */
export function splitLevels(t: Float64Array, i: Float64Array, mean: number): LevelSplit {
  const n = t.length;
  let lo = Infinity;
  let hi = -Infinity;
  for (let k = 0; k < n - 1; k++) {
    const v = i[k];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  const span = hi - lo;
  if (!(span > 1e-12 * Math.max(Math.abs(hi), Math.abs(lo))) || !(span > 0)) return { separation: 0, threshold: null, low: null, high: null };

  const weight = new Float64Array(BINS);
  const sum = new Float64Array(BINS);
  let total = 0;
  let varSum = 0;
  const scale = BINS / span;
  for (let k = 0; k < n - 1; k++) {
    const v = i[k];
    const dt = t[k + 1] - t[k];
    let b = Math.floor((v - lo) * scale);
    if (b >= BINS) b = BINS - 1;
    weight[b] += dt;
    sum[b] += v * dt;
    total += dt;
    varSum += (v - mean) * (v - mean) * dt;
  }
  const totalSum = mean * total;
  let w0 = 0;
  let s0 = 0;
  let best = -1;
  let bestBin = -1;
  for (let b = 0; b < BINS - 1; b++) {
    w0 += weight[b];
    s0 += sum[b];
    const w1 = total - w0;
    if (w0 <= 0 || w1 <= 0) continue;
    const d = s0 / w0 - (totalSum - s0) / w1;
    const between = w0 * w1 * d * d;
    if (between > best) {
      best = between;
      bestBin = b;
    }
  }
  if (bestBin < 0 || !(varSum > 0)) return { separation: 0, threshold: null, low: null, high: null };
  const separation = Math.min(1, best / (total * varSum));

  // exact class means on either side of the histogram cut, then the threshold halfway between them
  const cut = lo + (bestBin + 1) / scale;
  let wl = 0;
  let sl = 0;
  let wh = 0;
  let sh = 0;
  for (let k = 0; k < n - 1; k++) {
    const v = i[k];
    const dt = t[k + 1] - t[k];
    if (v >= cut) {
      wh += dt;
      sh += v * dt;
    } else {
      wl += dt;
      sl += v * dt;
    }
  }
  if (!(wl > 0 && wh > 0)) return { separation, threshold: null, low: null, high: null };
  const low = sl / wl;
  const high = sh / wh;
  return { separation, threshold: (low + high) / 2, low, high };
}
