// Plain-text numbers for trace summaries and plot axes. Free of Node imports, so the client plot uses it.

export type Scale = { unit: string; factor: number };

const CURRENT_SCALES: Scale[] = [
  { unit: "A", factor: 1 },
  { unit: "mA", factor: 1e3 },
  { unit: "µA", factor: 1e6 },
  { unit: "nA", factor: 1e9 },
];
const TIME_SCALES: Scale[] = [
  { unit: "s", factor: 1 },
  { unit: "ms", factor: 1e3 },
  { unit: "µs", factor: 1e6 },
];

function pick(scales: Scale[], magnitude: number): Scale {
  const m = Math.abs(magnitude);
  if (!(m > 0) || !Number.isFinite(m)) return scales[0];
  return scales.find((s) => m * s.factor >= 1) ?? scales[scales.length - 1];
}

/** The unit that shows the largest |current| as a number of at least 1 (A, mA, µA or nA). */
export function currentScale(largest: number): Scale {
  return pick(CURRENT_SCALES, largest);
}

/** The unit that shows a time span as a number of at least 1 (s, ms or µs). */
export function timeScale(span: number): Scale {
  return pick(TIME_SCALES, span);
}

function sig(x: number, digits = 4): string {
  return x === 0 ? "0" : x.toPrecision(digits);
}

/** "202.0 µA"-style text to 4 significant figures. */
export function formatCurrent(amperes: number): string {
  const s = currentScale(amperes);
  return `${(amperes * s.factor).toPrecision(4)} ${s.unit}`;
}

/** Seconds as s, ms or µs, or as hours and days when long (battery life). */
export function formatDuration(seconds: number): string {
  if (seconds >= 48 * 3600) return `${sig(seconds / 3600)} h (${sig(seconds / 86400)} days)`;
  if (seconds >= 2 * 3600) return `${sig(seconds / 3600)} h`;
  const s = timeScale(seconds);
  return `${sig(seconds * s.factor)} ${s.unit}`;
}

/** Coulombs as C, mC, µC or nC. */
export function formatCharge(coulombs: number): string {
  const s = currentScale(coulombs);
  return `${(coulombs * s.factor).toPrecision(4)} ${s.unit.replace("A", "C")}`;
}

export function formatPercent(fraction: number): string {
  return `${sig(fraction * 100, 3)} %`;
}
