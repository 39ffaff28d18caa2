// The physics of one range of an instrument on the bench (pure): the meter's input resistance (its burden),
// the current it lets through, the size of one step, its bandwidth, time constant and noise.
// PHYSICS.md §2 (burden), §4 (steps), §6 (RC low-pass), §7 (thermal noise).
import { BOLTZMANN } from "@/lib/grader/constants";
import { resolutionAmps, transimpedance } from "@/lib/instruments/profile";
import type { BenchCircuit, SimInstrument, SimRange } from "./types";

/** Temperature of the bench, K (the lessons' 300 K). */
export const BENCH_TEMPERATURE = 300;
/** Bandwidth of a range with its filter off (the amplifier's own), Hz. A modelling choice, not a profile field. */
export const UNFILTERED_CUTOFF_HZ = 10_000;
/** Open-loop gain of a feedback ammeter's amplifier: its burden is V_out / A_OL (PHYSICS.md §2 2e). */
export const OPEN_LOOP_GAIN = 1e5;
/** The live display's readings per second. */
export const DISPLAY_RATE_HZ = 4;

/**
 * Resistance the meter puts in series with the load on this range, Ω: the shunt, or the stated burden at full
 * scale over the full scale, or a feedback ammeter's R_F / A_OL.
 */
export function inputResistance(instrument: SimInstrument, range: SimRange): number {
  if (range.shuntOhms !== undefined) return range.shuntOhms;
  if (range.burdenAtFullScale !== undefined) return range.burdenAtFullScale / range.fullScale;
  if (range.feedbackOhms) return range.feedbackOhms / OPEN_LOOP_GAIN;
  return 0;
}

/** The resistor whose thermal noise the meter reads on this range: the feedback resistor or the shunt. */
export function senseResistance(instrument: SimInstrument, range: SimRange): number {
  if (instrument.kind === "feedback-ammeter" && range.feedbackOhms) return range.feedbackOhms;
  return inputResistance(instrument, range);
}

/** Current through the load with the meter in series: V_s / (R_L + R_in). */
export function loadedCurrent(supplyVoltage: number, loadResistance: number, rIn: number): number {
  return supplyVoltage / (loadResistance + rIn);
}

/** Output sensitivity of a range, V/A: the profile's (or its feedback resistor), else the reference over the full scale. */
export function sensitivityOf(range: SimRange): number {
  const s = transimpedance(range);
  if (s) return s;
  if ("bits" in range.resolution) return range.resolution.referenceVolts / range.fullScale;
  return 1;
}

/** One step of the display or converter, in amperes (lib/instruments/profile.ts). */
export function stepOf(range: SimRange): number {
  return resolutionAmps(range);
}

/** Cut-off of the low-pass in front of the reading, Hz. */
export function cutoffOf(range: SimRange, filter: boolean): number {
  return filter && range.filterCutoffHz ? range.filterCutoffHz : UNFILTERED_CUTOFF_HZ;
}

/** τ = 1/(2π f_c). */
export function timeConstantOf(range: SimRange, filter: boolean): number {
  return 1 / (2 * Math.PI * cutoffOf(range, filter));
}

/** Noise-equivalent bandwidth of one pole, (π/2)·f_c. */
export function noiseBandwidthOf(range: SimRange, filter: boolean): number {
  return (Math.PI / 2) * cutoffOf(range, filter);
}

/**
 * rms thermal noise current the meter reads. A shunt R_sh in the loop with the load R_L: the voltage across the
 * shunt carries the noise of R_sh ∥ R_L, read as current through R_sh: σ² = 4kTB·(R_sh∥R_L)/R_sh². A feedback
 * ammeter holds its input at ground: σ² = 4kTB·(1/R_F + 1/R_L). Both tend to √(4kTB/R) when R_L ≫ R.
 */
export function thermalNoiseCurrent(instrument: SimInstrument, range: SimRange, filter: boolean, loadResistance: number): number {
  const b = noiseBandwidthOf(range, filter);
  const kt4b = 4 * BOLTZMANN * BENCH_TEMPERATURE * b;
  if (instrument.kind === "feedback-ammeter" && range.feedbackOhms) return Math.sqrt(kt4b * (1 / range.feedbackOhms + 1 / loadResistance));
  const r = inputResistance(instrument, range);
  if (!(r > 0)) return 0;
  const parallel = (r * loadResistance) / (r + loadResistance);
  return Math.sqrt((kt4b * parallel) / (r * r));
}

/** The largest accuracy error on a reading: ±(% of reading + counts·step + % of range). */
export function accuracyBound(range: SimRange, reading: number): number {
  const a = range.accuracy;
  return (a.percentOfReading / 100) * Math.abs(reading) + (a.counts ?? 0) * stepOf(range) + ((a.percentOfRange ?? 0) / 100) * range.fullScale;
}

/** The current the meter would read with no settling, noise or error on this range (loaded, asleep). */
export function steadyCurrent(instrument: SimInstrument, range: SimRange, circuit: BenchCircuit): number {
  return loadedCurrent(circuit.supplyVoltage, circuit.loadResistance, inputResistance(instrument, range));
}
