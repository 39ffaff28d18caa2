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
