// IEC 60063 preferred-number series, hard-coded (not generated). Mantissas are stored as integers:
// tenths for E6–E24 (2 significant figures), hundredths for E48–E192 (3 significant figures).
import type { SeriesName } from "./types";

export const SERIES_NAMES: SeriesName[] = ["E6", "E12", "E24", "E48", "E96", "E192"];

const E6 = [10, 15, 22, 33, 47, 68];
const E12 = [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82];
// 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2 are the historical exceptions to 10^(i/24).
const E24 = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];
// E96 has no exceptions.
const E96 = [
  100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154, 158,
  162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255,
  261, 267, 274, 280, 287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412,
  422, 432, 442, 453, 464, 475, 487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665,
  681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953, 976,
];
// E48 is every other E96 value.
const E48 = [
  100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169, 178, 187, 196, 205, 215, 226, 237, 249,
  261, 274, 287, 301, 316, 332, 348, 365, 383, 402, 422, 442, 464, 487, 511, 536, 562, 590, 619, 649,
  681, 715, 750, 787, 825, 866, 909, 953,
];
// E192: 9.20 replaces the computed 9.19 (the one documented exception).
const E192 = [
  100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124, 126,
  127, 129, 130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156, 158, 160,
  162, 164, 165, 167, 169, 172, 174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203,
  205, 208, 210, 213, 215, 218, 221, 223, 226, 229, 232, 234, 237, 240, 243, 246, 249, 252, 255, 258,
  261, 264, 267, 271, 274, 277, 280, 284, 287, 291, 294, 298, 301, 305, 309, 312, 316, 320, 324, 328,
  332, 336, 340, 344, 348, 352, 357, 361, 365, 370, 374, 379, 383, 388, 392, 397, 402, 407, 412, 417,
  422, 427, 432, 437, 442, 448, 453, 459, 464, 470, 475, 481, 487, 493, 499, 505, 511, 517, 523, 530,
  536, 542, 549, 556, 562, 569, 576, 583, 590, 597, 604, 612, 619, 626, 634, 642, 649, 657, 665, 673,
  681, 690, 698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816, 825, 835, 845, 856,
  866, 876, 887, 898, 909, 920, 931, 942, 953, 965, 976, 988,
];

const TABLES: Record<SeriesName, { ints: number[]; digits: number }> = {
  E6: { ints: E6, digits: 2 },
  E12: { ints: E12, digits: 2 },
  E24: { ints: E24, digits: 2 },
  E48: { ints: E48, digits: 3 },
  E96: { ints: E96, digits: 3 },
  E192: { ints: E192, digits: 3 },
};

/** The series' mantissas in [1, 10), e.g. E12 → [1, 1.2, 1.5, …, 8.2]. */
export function seriesValues(series: SeriesName): number[] {
  const t = TABLES[series];
  const div = 10 ** (t.digits - 1);
  return t.ints.map((i) => i / div);
}

export function isSeriesName(s: unknown): s is SeriesName {
  return typeof s === "string" && s in TABLES;
}

/** value = int · 10^p, built so that it is the double nearest the decimal (e.g. 16.9e3, 30.1e-3). */
function build(int: number, p: number): number {
  return p >= 0 ? int * 10 ** p : int / 10 ** -p;
}

/** Tolerance for values that are a standard value up to floating-point noise (0.1/0.01 = 10.000000000000002). */
const EPS = 1e-9;

/**
 * The standard value of `series` for `value` (> 0, in any unit):
 * - "nearest": nearest in ratio (|ln(value/E)| smallest; the boundary between neighbours is their
 *   geometric mean); an exact tie goes to the larger value;
 * - "floor": the largest standard value ≤ value; "ceil": the smallest ≥ value.
 * Returns NaN for a value that is not a positive finite number.
 */
export function nearestStandard(value: number, series: SeriesName, mode: "nearest" | "floor" | "ceil" = "nearest"): number {
  const t = TABLES[series];
  if (!t || !(value > 0) || !Number.isFinite(value)) return NaN;
  const ints = t.ints;
  const n = ints.length;
  const top = 10 ** t.digits; // the next decade's first value, as an integer
  // decade so that value = m · 10^(k) with m in [10^(digits-1), 10^digits)
  let k = Math.floor(Math.log10(value)) - (t.digits - 1);
  let m = value / 10 ** k;
  if (m >= top) {
    k += 1;
    m = value / 10 ** k;
  } else if (m < top / 10) {
    k -= 1;
    m = value / 10 ** k;
  }
  // lo: index of the largest mantissa ≤ m (with tolerance); -1 means below the first (binary search)
  const mm = m * (1 + EPS);
  let a = 0;
  let b = n - 1;
  let lo = -1;
  while (a <= b) {
    const mid = (a + b) >> 1;
    if (ints[mid] <= mm) {
      lo = mid;
      a = mid + 1;
    } else b = mid - 1;
  }
  const below = lo >= 0 ? build(ints[lo], k) : build(ints[n - 1], k - 1);
  const exact = lo >= 0 && Math.abs(ints[lo] - m) <= m * EPS;
  const aboveIdx = exact ? lo : lo + 1;
  const above = aboveIdx < n ? build(ints[aboveIdx], k) : build(ints[0], k + 1);
  if (mode === "floor") return below;
  if (mode === "ceil") return above;
  if (exact) return below;
  const dBelow = Math.log(value / below);
  const dAbove = Math.log(above / value);
  return dAbove <= dBelow ? above : below;
}
