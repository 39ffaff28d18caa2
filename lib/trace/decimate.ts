// Min/max decimation for plotting: the samples are cut into equal runs of indices, and each run gives its
// lowest and its highest point in time order, so a one-sample spike still shows. Framework-free and free
// of Node imports, so the client plot can use it too.

export type PlotPoints = { t: number[]; i: number[] };

export function minMaxDecimate(t: ArrayLike<number>, i: ArrayLike<number>, maxPoints: number): PlotPoints {
  const n = Math.min(t.length, i.length);
  if (!(maxPoints >= 4)) throw new RangeError("maxPoints must be at least 4");
  const limit = Math.floor(maxPoints);
  if (n <= limit) return { t: Array.from({ length: n }, (_, k) => t[k]), i: Array.from({ length: n }, (_, k) => i[k]) };
  const outT: number[] = [t[0]];
  const outI: number[] = [i[0]];
  // the first and last points are kept; the rest is split into runs of two points each
  const runs = Math.floor((limit - 2) / 2);
  const inner = n - 2;
  for (let r = 0; r < runs; r++) {
    const from = 1 + Math.floor((r * inner) / runs);
    const to = 1 + Math.floor(((r + 1) * inner) / runs);
    if (to <= from) continue;
    let lo = from;
    let hi = from;
    for (let k = from + 1; k < to; k++) {
      if (i[k] < i[lo]) lo = k;
      if (i[k] > i[hi]) hi = k;
    }
    const a = Math.min(lo, hi);
    const b = Math.max(lo, hi);
    outT.push(t[a]);
    outI.push(i[a]);
    if (b !== a) {
      outT.push(t[b]);
      outI.push(i[b]);
    }
  }
  outT.push(t[n - 1]);
  outI.push(i[n - 1]);
  return { t: outT, i: outI };
}

/**
 * Min/max per pixel column over a time window: the window [from, to] is cut into `columns` equal spans of
 * time, and each span with samples gives its lowest and its highest sample in time order (one point when
 * they are the same sample), so a burst narrower than a column still shows at its full height. Samples
 * must be in increasing time; those outside the window are left out. When the window holds at most
 * 2 × columns samples they are all returned as they are.
 */
export function minMaxColumns(t: ArrayLike<number>, i: ArrayLike<number>, from: number, to: number, columns: number): PlotPoints {
  const n = Math.min(t.length, i.length);
  if (!(columns >= 1)) throw new RangeError("columns must be at least 1");
  let a = 0;
  while (a < n && t[a] < from) a++;
  let b = a;
  while (b < n && t[b] <= to) b++;
  const outT: number[] = [];
  const outI: number[] = [];
  if (b - a <= 2 * columns) {
    for (let k = a; k < b; k++) {
      outT.push(t[k]);
      outI.push(i[k]);
    }
    return { t: outT, i: outI };
  }
  const span = (to - from) / Math.floor(columns);
  let k = a;
  while (k < b) {
    const column = Math.min(Math.floor(columns) - 1, Math.floor((t[k] - from) / span));
    const end = from + (column + 1) * span;
    let lo = k;
    let hi = k;
    let m = k + 1;
    for (; m < b && (t[m] < end || column === Math.floor(columns) - 1); m++) {
      if (i[m] < i[lo]) lo = m;
      if (i[m] > i[hi]) hi = m;
    }
    const first = Math.min(lo, hi);
    const second = Math.max(lo, hi);
    outT.push(t[first]);
    outI.push(i[first]);
    if (second !== first) {
      outT.push(t[second]);
      outI.push(i[second]);
    }
    k = m;
  }
  return { t: outT, i: outI };
}
