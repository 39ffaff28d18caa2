// The numbers of a trace from its good samples (SI units).
//
// Integration: sample-and-hold (left-point rule). Sample k's current holds from t[k] until t[k+1]; the last
// sample only closes the last interval. A logger that writes a line when the current changes is read
// correctly this way, and the sleep/active split, the levels and the average then agree exactly:
// Ī = D·I_a + (1 − D)·I_s. The trapezoidal average is reported beside it as a cross-check; on a square
// wave that starts and ends asleep the two agree, because each rising edge's extra half-step is taken
// back by its falling edge.
//
// Sleep and active: the threshold and its hysteresis band come from levels.ts. The active state starts at
// a sample above the band and ends at a sample below it (a Schmitt trigger), so noise near the threshold
// does not count as extra wakes. Charge per wake is ∫ i dt over each wake's
// active run (lib/grader/PHYSICS.md §8: Q_wake = I_a·t_a), averaged over the runs that both start and end inside
// the trace.
import { minMaxDecimate } from "./decimate";
import { MIN_SEPARATION, splitLevels } from "./levels";
import type { BadRow, TraceAnalysis, TraceOptions } from "./types";

/** A trace that cannot be analysed (fewer than two good rows). Carries the bad-row report when known. */
export class TraceError extends Error {
  badRows = 0;
  badRowExamples: BadRow[] = [];
  constructor(message: string) {
    super(message);
    this.name = "TraceError";
  }
}

export type TraceStats = Omit<TraceAnalysis, "badRows" | "badRowExamples" | "units" | "format" | "warnings"> & {
  warnings: string[];
};

export function analyzeSamples(t: Float64Array, i: Float64Array, options: TraceOptions = {}): TraceStats {
  const n = Math.min(t.length, i.length);
  const usableFraction = options.usableFraction ?? 0.8;
  const maxPlotPoints = options.maxPlotPoints ?? 4000;
  if (!(usableFraction > 0 && usableFraction <= 1)) throw new RangeError("usableFraction must be in (0, 1]");
  if (options.batteryCapacity !== undefined && !(options.batteryCapacity > 0)) throw new RangeError("batteryCapacity must be positive (coulombs)");
  if (!(maxPlotPoints >= 4)) throw new RangeError("maxPlotPoints must be at least 4");
  if (n < 2) throw new TraceError(`The trace has ${n} usable row${n === 1 ? "" : "s"}; at least two are needed.`);
  const warnings: string[] = [];

  let min = Infinity;
  let max = -Infinity;
  let plain = 0;
  let hold = 0;
  let trapezoid = 0;
  for (let k = 0; k < n; k++) {
    const v = i[k];
    if (v < min) min = v;
    if (v > max) max = v;
    plain += v;
    if (k < n - 1) {
      const dt = t[k + 1] - t[k];
      hold += v * dt;
      trapezoid += (v + i[k + 1]) * 0.5 * dt;
    }
  }
  const duration = t[n - 1] - t[0];
  const averageCurrent = hold / duration;

  const split = splitLevels(t.subarray(0, n), i.subarray(0, n));
  const twoLevel = split.threshold !== null && split.separation >= MIN_SEPARATION;

  let sleepLevel = averageCurrent;
  let activeLevel: number | null = null;
  let threshold: number | null = null;
  let dutyCycle: number | null = null;
  let wakes = 0;
  let period: number | null = null;
  let activeTimePerWake: number | null = null;
  let chargePerWake: number | null = null;

  if (twoLevel) {
    threshold = split.threshold!;
    const on = split.on!;
    const off = split.off!;
    let active = i[0] > threshold;
    let runStart = active ? -1 : 0; // -1: the run began before the trace did
    let runTime = 0;
    let runCharge = 0;
    let activeTime = 0;
    let activeCharge = 0;
    let firstRise = NaN;
    let lastRise = NaN;
    let completeRuns = 0;
    let completeTime = 0;
    let completeCharge = 0;
    for (let k = 0; k < n - 1; k++) {
      const v = i[k];
      if (active ? v < off : v > on) {
        if (!active) {
          wakes++;
          if (wakes === 1) firstRise = t[k];
          lastRise = t[k];
          runStart = k;
          runTime = 0;
          runCharge = 0;
        } else if (runStart >= 0) {
          completeRuns++;
          completeTime += runTime;
          completeCharge += runCharge;
        }
        active = !active;
      }
      if (active) {
        const dt = t[k + 1] - t[k];
        activeTime += dt;
        activeCharge += v * dt;
        runTime += dt;
        runCharge += v * dt;
      }
    }
    const sleepTime = duration - activeTime;
    activeLevel = activeTime > 0 ? activeCharge / activeTime : split.high;
    sleepLevel = sleepTime > 0 ? (hold - activeCharge) / sleepTime : split.low!;
    dutyCycle = activeTime / duration;
    if (wakes >= 2) period = (lastRise - firstRise) / (wakes - 1);
    if (completeRuns > 0) {
      activeTimePerWake = completeTime / completeRuns;
      chargePerWake = completeCharge / completeRuns;
    }
  }

  let batteryLife: number | null = null;
  if (options.batteryCapacity !== undefined) {
    if (averageCurrent > 0) batteryLife = (usableFraction * options.batteryCapacity) / averageCurrent;
    else warnings.push("The average current is not positive, so no battery life was estimated.");
  }

  return {
    rows: n,
    integration: "sample-and-hold",
    duration,
    averageCurrent,
    averageCurrentTrapezoid: trapezoid / duration,
    sampleMean: plain / n,
    minCurrent: min,
    maxCurrent: max,
    totalCharge: hold,
    twoLevel,
    separation: split.separation,
    threshold,
    sleepLevel,
    activeLevel,
    dutyCycle,
    wakes,
    period,
    activeTimePerWake,
    chargePerWake,
    batteryLife,
    plot: minMaxDecimate(t.subarray(0, n), i.subarray(0, n), maxPlotPoints),
    warnings,
  };
}
