// Instrument profiles: the shape every meter of a course is described in, and the pure physics of one
// reading on one range (burden, resolution, accuracy band, range choice with hysteresis). No zod, no
// database, no framework: lib/grader and the simulated bench import this module as it is.
//
// Units are SI throughout: amperes, volts, ohms, hertz, seconds. Percentages are plain percent numbers.

export type InstrumentKind = "sampling-meter" | "multimeter" | "feedback-ammeter";

export const INSTRUMENT_KINDS: readonly InstrumentKind[] = ["sampling-meter", "multimeter", "feedback-ammeter"];

/** Resolution of a range: a display with a number of counts over the full scale, or a converter. */
export type RangeResolution = { counts: number } | { bits: number; referenceVolts: number };

/** ±(percentOfReading % of the reading + counts steps of resolution + percentOfRange % of the full scale) */
export interface RangeAccuracy {
  percentOfReading: number;
  counts?: number;
  percentOfRange?: number;
}

export interface InstrumentRange {
  /** stable id within the profile, e.g. "r2m" */
  key: string;
  /** by full scale, e.g. "2 mA" */
  label: string;
  /** amperes */
  fullScale: number;
  /** sampling-meter and multimeter with known shunts */
  shuntOhms?: number;
  /** volts across the input at full scale (multimeter; feedback-ammeter's residual burden) */
  burdenAtFullScale?: number;
  /** feedback-ammeter */
  feedbackOhms?: number;
  resolution: RangeResolution;
  accuracy: RangeAccuracy;
  /** V/A of the analogue output (sampling-meter) */
  sensitivity?: number;
  /** low-pass on the output / display */
  filterCutoffHz?: number;
  settlingSeconds?: number;
}

export interface AutoRange {
  /** switch to the next range up when |I| exceeds this fraction of the present range's full scale */
  upAtFractionOfFullScale: number;
  /** switch down when |I| falls below this fraction of the present range's full scale */
  downAtFractionOfFullScale: number;
  /** the reading is not valid for this long after a switch */
  settlingSeconds: number;
}

export interface InstrumentProfile {
  name: string;
  kind: InstrumentKind;
  /** ordered from the smallest full scale up */
  ranges: InstrumentRange[];
  autoRange?: AutoRange;
  /** mid-scale offset for currents both ways (sampling-meter) */
  offset?: { volts: number };
  /** one line for the handout: what the instrument is */
  description?: string;
}

/** A built-in profile: a stable key the library is addressed by. */
export interface LibraryInstrument extends InstrumentProfile {
  libraryKey: string;
}

// ---------------------------------------------------------------------------------------------------
// One range

/** Input resistance of the range as the circuit sees it (ohms), when the profile gives one. */
export function inputResistance(range: InstrumentRange): number | undefined {
  if (range.shuntOhms !== undefined) return range.shuntOhms;
  if (range.burdenAtFullScale !== undefined) return range.burdenAtFullScale / range.fullScale;
  return undefined;
}

/** Volts across the meter's input at full scale: shunt × full scale, or the stated burden. */
export function burdenAtFullScale(range: InstrumentRange): number {
  if (range.burdenAtFullScale !== undefined) return range.burdenAtFullScale;
  if (range.shuntOhms !== undefined) return range.shuntOhms * range.fullScale;
  return 0;
}

/** Volts across the meter's input while |current| flows (the burden is resistive: it scales with the current). */
export function burdenVolts(range: InstrumentRange, current: number): number {
  return (burdenAtFullScale(range) * Math.abs(current)) / range.fullScale;
}

/** Volts at the analogue output at full scale (sampling-meter: S × I_FS; feedback-ammeter: R_f × I_FS). */
export function outputAtFullScale(range: InstrumentRange): number | undefined {
  if (range.sensitivity !== undefined) return range.sensitivity * range.fullScale;
  if (range.feedbackOhms !== undefined) return range.feedbackOhms * range.fullScale;
  return undefined;
}

/** V/A from current to the analogue output: the stated sensitivity, else the feedback resistor. */
export function transimpedance(range: InstrumentRange): number | undefined {
  return range.sensitivity ?? range.feedbackOhms;
}

/**
 * Amperes one step of the range stands for. A display of N counts: I_FS / N. A converter of N bits on a
 * reference V_ref behind an output of S V/A: V_ref / 2^N / S (IEEE Std 1241, the ideal code width
 * Q = FSR / 2^N); without a stated sensitivity the converter is taken to span the range's full scale.
 */
export function resolutionAmps(range: InstrumentRange): number {
  const r = range.resolution;
  if ("counts" in r) return range.fullScale / r.counts;
  const lsbVolts = r.referenceVolts / 2 ** r.bits;
  const s = transimpedance(range);
  return s !== undefined ? lsbVolts / s : range.fullScale / 2 ** r.bits;
}

/** Volts of one converter step (bits resolution only). */
export function lsbVolts(range: InstrumentRange): number | undefined {
  const r = range.resolution;
  return "bits" in r ? r.referenceVolts / 2 ** r.bits : undefined;
}

/** Steps across the full scale: the counts, or 2^N codes. */
export function stepsOverFullScale(range: InstrumentRange): number {
  const r = range.resolution;
  return "counts" in r ? r.counts : 2 ** r.bits;
}

export interface AccuracyBand {
  reading: number;
  /** ± half-width in amperes */
  halfWidth: number;
  low: number;
  high: number;
  /** the half-width's three parts, for the worked solution */
  parts: { ofReading: number; ofCounts: number; ofRange: number };
}

/**
 * The stated limits of one reading: ±(a % of reading + n counts + b % of range). The counts are steps of
 * the range's resolution. These are the manufacturer's limits, a rectangular distribution in GUM 4.3.7.
 */
export function accuracyBand(range: InstrumentRange, reading: number): AccuracyBand {
  const a = range.accuracy;
  const ofReading = (Math.abs(reading) * a.percentOfReading) / 100;
  const ofCounts = (a.counts ?? 0) * resolutionAmps(range);
  const ofRange = ((a.percentOfRange ?? 0) * range.fullScale) / 100;
  const halfWidth = ofReading + ofCounts + ofRange;
  return { reading, halfWidth, low: reading - halfWidth, high: reading + halfWidth, parts: { ofReading, ofCounts, ofRange } };
}

/** Standard uncertainty of one reading from its stated limits: a / √3 (GUM 4.3.7, rectangular). */
export function standardUncertainty(range: InstrumentRange, reading: number): number {
  return accuracyBand(range, reading).halfWidth / Math.sqrt(3);
}

// ---------------------------------------------------------------------------------------------------
// Ranges of a profile

/** Largest |current| a range shows, one direction: the full scale, or half of it around a mid-scale offset. */
export function usableFullScale(profile: InstrumentProfile, range: InstrumentRange, bothWays = false): number {
  if (!bothWays || !profile.offset) return range.fullScale;
  const out = outputAtFullScale(range);
  if (out === undefined) return range.fullScale;
  // the offset sits at off volts of out: positive currents have out − off left, negative ones off
  return (Math.min(out - profile.offset.volts, profile.offset.volts) / out) * range.fullScale;
}

/** Index of the most sensitive range that holds |current| (|I| below the range's usable full scale); −1 if none. */
export function bestRangeIndex(profile: InstrumentProfile, current: number, bothWays = false): number {
  const i = Math.abs(current);
  return profile.ranges.findIndex((r) => i < usableFullScale(profile, r, bothWays));
}

/**
 * Auto-ranging with hysteresis: from the range `from` (an index), move up while |I| exceeds the upper
 * threshold of the present range and down while it is below the lower threshold. With no `from`, start from
 * the top range (the safe start) and settle. Without an autoRange section the instrument does not switch
 * by itself and the best range is returned.
 */
export function autoRangeIndex(profile: InstrumentProfile, current: number, from?: number): number {
  const ar = profile.autoRange;
  const n = profile.ranges.length;
  if (!ar) return bestRangeIndex(profile, current);
  let k = from === undefined ? n - 1 : Math.max(0, Math.min(n - 1, from));
  const i = Math.abs(current);
  for (let guard = 0; guard < 2 * n; guard++) {
    const fs = profile.ranges[k].fullScale;
    if (i > ar.upAtFractionOfFullScale * fs && k < n - 1) k++;
    else if (i < ar.downAtFractionOfFullScale * fs && k > 0) k--;
    else break;
  }
  return k;
}

/**
 * Whether the thresholds give real hysteresis: after a switch down, the reading on the lower range must sit
 * below that range's upper threshold (down × FS_k / FS_(k−1) < up), or the meter would switch back and forth.
 * Returns the index of the first range where it does not, or −1.
 */
export function hysteresisFault(profile: InstrumentProfile): number {
  const ar = profile.autoRange;
  if (!ar) return -1;
  for (let k = 1; k < profile.ranges.length; k++) {
    const ratio = profile.ranges[k].fullScale / profile.ranges[k - 1].fullScale;
    if (!(ar.downAtFractionOfFullScale * ratio < ar.upAtFractionOfFullScale)) return k;
  }
  return -1;
}

/** Output voltage of a sampling meter for a current on a range (with the offset when bothWays). */
export function outputVolts(profile: InstrumentProfile, range: InstrumentRange, current: number, bothWays = false): number {
  const s = transimpedance(range) ?? 0;
  const off = bothWays && profile.offset ? profile.offset.volts : 0;
  return off + s * (bothWays ? current : Math.abs(current));
}

/** The code a truncating converter returns for an output voltage, clipped to 0 … 2^N − 1. */
export function converterCode(range: InstrumentRange, volts: number): number | undefined {
  const r = range.resolution;
  if (!("bits" in r)) return undefined;
  const levels = 2 ** r.bits;
  return Math.max(0, Math.min(levels - 1, Math.floor((volts * levels) / r.referenceVolts)));
}

/** One row of a handout's range table, already in SI. */
export interface RangeTableRow {
  key: string;
  label: string;
  fullScale: number;
  /** shunt or equivalent input resistance, ohms */
  inputOhms?: number;
  burdenAtFullScale: number;
  /** amperes per step */
  resolution: number;
  resolutionText: string;
  accuracyText: string;
  sensitivity?: number;
  filterCutoffHz?: number;
}

export function accuracyText(a: RangeAccuracy): string {
  const parts = [`${a.percentOfReading} % of reading`];
  if (a.counts) parts.push(`${a.counts} count${a.counts === 1 ? "" : "s"}`);
  if (a.percentOfRange) parts.push(`${a.percentOfRange} % of range`);
  return `±(${parts.join(" + ")})`;
}

export function rangeTable(profile: InstrumentProfile): RangeTableRow[] {
  return profile.ranges.map((r) => ({
    key: r.key,
    label: r.label,
    fullScale: r.fullScale,
    inputOhms: inputResistance(r),
    burdenAtFullScale: burdenAtFullScale(r),
    resolution: resolutionAmps(r),
    resolutionText: "counts" in r.resolution ? `${r.resolution.counts} counts` : `${r.resolution.bits} bit on ${r.resolution.referenceVolts} V`,
    accuracyText: accuracyText(r.accuracy),
    sensitivity: transimpedance(r),
    filterCutoffHz: r.filterCutoffHz,
  }));
}
