// The simulated bench: what an instrument shows on the student's circuit at each moment. A reading is a pure
// function of (seed, instrument, circuit, run, its index), so the staff's replay on the server equals what the
// browser showed. Model, in order (PHYSICS.md §2–§7, §16):
// 1. the current through the load with the range's input resistance in series (burden);
// 2. a first-order low-pass (the filter, or the amplifier's own bandwidth) started at zero at the run's start
//    or at an automatic range switch, driven by the steady or duty-cycled current and any mains pickup;
// 3. thermal noise of the sensing resistor over the noise bandwidth, a fresh draw per reading (readings are
//    taken far apart compared with τ);
// 4. one fixed gain and offset error per seed and range, drawn within the stated accuracy;
// 5. quantisation to the range's step (rounding), clipping at the top: an overload.
import { hashString, seededRandom } from "@/lib/grader/rng";
import {
  DISPLAY_RATE_HZ, cutoffOf, inputResistance, loadedCurrent, sensitivityOf, stepOf, thermalNoiseCurrent, timeConstantOf,
} from "./model";
import type { BenchCircuit, ReadingRun, SimInstrument, SimRange, SimReading } from "./types";

/** The seed of one student's (or bench's) simulated bench in one lab with one instrument. */
export function benchSeed(labId: string, holderId: string, instrumentName: string): string {
  return hashString(`bench|${labId}|${holderId}|${instrumentName}`).map((w) => w.toString(16).padStart(8, "0")).join("");
}

/** A standard normal draw from a string (Box–Muller on the seeded generator). */
function gaussian(key: string): number {
  const r = seededRandom(key);
  const u1 = 1 - r();
  const u2 = r();
  return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
}

/** The fixed errors of one range for one seed: a gain error within ±% of reading, an offset within the rest. */
export function fixedErrors(seed: string, range: SimRange): { gain: number; offset: number } {
  const r = seededRandom(`${seed}|errors|${range.key}`);
  const step = stepOf(range);
  // the rounding to a step adds up to half a step, so the offset keeps half a step of the stated band free
  const offsetBound = Math.max(0, (range.accuracy.counts ?? 0) * step + ((range.accuracy.percentOfRange ?? 0) / 100) * range.fullScale - step / 2);
  return { gain: (2 * r() - 1) * (range.accuracy.percentOfReading / 100), offset: (2 * r() - 1) * offsetBound };
}

// the fixed errors of a range object for a seed, drawn once
const errorCache = new WeakMap<SimRange, Map<string, { gain: number; offset: number }>>();
function errorsOf(seed: string, range: SimRange) {
  let bySeed = errorCache.get(range);
  if (!bySeed) errorCache.set(range, (bySeed = new Map()));
  let e = bySeed.get(seed);
  if (!e) {
    if (bySeed.size > 64) bySeed.clear();
    e = fixedErrors(seed, range);
    bySeed.set(seed, e);
  }
  return e;
}

/**
 * Output of a first-order low-pass (time constant tau) in periodic steady state for a current that is `low`
 * and rises to `high` for `width` once every `period`, the first rise at `delay`.
 */
function steadyBurstResponse(t: number, low: number, high: number, width: number, period: number, delay: number, tau: number): number {
  const u = (((t - delay) % period) + period) % period;
  const a = Math.exp(-width / tau);
  const b = Math.exp(-(period - width) / tau);
  const atRise = (low + b * (high - low) - a * b * high) / (1 - a * b);
  const atFall = high + (atRise - high) * a;
  return u < width ? high + (atRise - high) * Math.exp(-u / tau) : low + (atFall - low) * Math.exp(-(u - width) / tau);
}

/** The filtered (noise-free, error-free) current on a range at time t, the output having started at 0 at t0. */
export function filteredCurrent(
  instrument: SimInstrument, range: SimRange, circuit: BenchCircuit, filter: boolean, t0: number, t: number, tau = timeConstantOf(range, filter),
): number {
  const rIn = inputResistance(instrument, range);
  const low = loadedCurrent(circuit.supplyVoltage, circuit.loadResistance, rIn);
  const steady = (time: number) => {
    const b = circuit.burst;
    if (!b) return low;
    const high = loadedCurrent(circuit.supplyVoltage, b.loadResistance, rIn);
    return steadyBurstResponse(time, low, high, b.width, b.period, b.delay ?? 0, tau);
  };
  let y = steady(t) - steady(t0) * Math.exp(-(t - t0) / tau);
  const p = circuit.pickup;
  if (p && p.amplitude > 0) {
    const ratio = p.frequency / cutoffOf(range, filter);
    y += (p.amplitude / Math.sqrt(1 + ratio * ratio)) * Math.sin(2 * Math.PI * p.frequency * t - Math.atan(ratio));
  }
  return y;
}

/**
 * What the display shows for an analogue current x on a range, null when it clips. A display of counts rounds
 * to a step. A converter truncates (lib/instruments/profile.ts converterCode) and the reading is the code's
 * centre (PHYSICS.md §3 3f); its top code is clipped (§3). `bothWays` puts the output on the profile's offset.
 */
export function quantise(instrument: SimInstrument, range: SimRange, x: number, bothWays = false): number | null {
  const r = range.resolution;
  const step = stepOf(range);
  if ("counts" in r) {
    const code = Math.round(x / step);
    return Math.abs(code) >= r.counts ? null : code * step;
  }
  const s = sensitivityOf(range);
  const lsb = r.referenceVolts / 2 ** r.bits;
  const offset = bothWays ? (instrument.offset?.volts ?? 0) : 0;
  const top = 2 ** r.bits - 1;
  let code = Math.floor((offset + s * x) / lsb);
  if (code >= top) return null;
  if (code < 0) {
    if (bothWays) return null; // below the offset's reach, as clipped as the top
    code = 0; // a converter without the offset reads a reversed current as zero
  }
  return ((code + 0.5) * lsb - offset) / s;
}

/** One reading on a range at time t of a run that started (or last switched) at t0. */
function readOnce(
  seed: string, instrument: SimInstrument, range: SimRange, circuit: BenchCircuit, run: ReadingRun, t0: number, t: number, tau?: number,
): number | null {
  const filter = run.filter;
  const x = filteredCurrent(instrument, range, circuit, filter, t0, t, tau);
  const sigma = thermalNoiseCurrent(instrument, range, filter, circuit.loadResistance);
  const noisy = x + sigma * gaussian(`${seed}|noise|${range.key}|${filter ? 1 : 0}|${Math.round(t * 1e9)}`);
  const e = errorsOf(seed, range);
  return quantise(instrument, range, noisy * (1 + e.gain) + e.offset, run.bothWays);
}

/**
 * The time constant of the glitch after an automatic switch: the new range's output restarts from zero and is
 * within 1 % after the profile's settling time (τ = t_settle/ln 100), or the filter's τ when that is longer.
 */
export function switchTimeConstant(instrument: SimInstrument, range: SimRange, filter: boolean): number {
  return Math.max(timeConstantOf(range, filter), (instrument.autoRange?.settlingSeconds ?? 0) / Math.log(100));
}

/**
 * The readings of one run, one after another: `next()` gives reading 0, 1, 2, … of the run (the live display
 * calls it as time passes). Throws on a range the instrument does not have (or "auto" without auto-ranging).
 */
export function readingRun(seed: string, instrument: SimInstrument, circuit: BenchCircuit, run: ReadingRun): { next(): SimReading } {
  const rate = run.rate ?? DISPLAY_RATE_HZ;
  const timeOf = (i: number) => run.from + i / rate;
  let i = 0;
  if (run.range !== "auto") {
    const range = instrument.ranges.find((r) => r.key === run.range);
    if (!range) throw new Error(`no range ${run.range}`);
    return {
      next() {
        const t = timeOf(i++);
        return { t, value: readOnce(seed, instrument, range, circuit, run, run.from, t), unit: "A", range: range.key };
      },
    };
  }
  if (!instrument.autoRange) throw new Error("this instrument does not range automatically");
  const ranges = instrument.ranges;
  // an auto-ranger starts on its least sensitive range and works down (PHYSICS.md §3)
  let k = ranges.length - 1;
  let since = run.from;
  let tau = timeConstantOf(ranges[k], run.filter);
  return {
    next() {
      const t = timeOf(i++);
      const range = ranges[k];
      const value = readOnce(seed, instrument, range, circuit, run, since, t, tau);
      // readings taken while the output settles (to 0.1 %, 7τ) are shown but take no decision (PHYSICS.md §3)
      if (t - since >= 7 * tau) {
        const next = autoRangeStep(instrument, k, value);
        if (next !== k) {
          k = next;
          since = t;
          tau = switchTimeConstant(instrument, ranges[k], run.filter);
        }
      }
      return { t, value, unit: "A", range: range.key };
    },
  };
}

/** The readings of one run: `count` readings of readingRun. */
export function simulateReadings(seed: string, instrument: SimInstrument, circuit: BenchCircuit, run: ReadingRun): SimReading[] {
  const stepper = readingRun(seed, instrument, circuit, run);
  const out: SimReading[] = [];
  for (let n = 0; n < run.count; n++) out.push(stepper.next());
  return out;
}

/**
 * The auto-ranger's decision after one settled reading on range k, with the thresholds of
 * lib/instruments/profile.ts (autoRangeIndex): up when |reading| exceeds the up-fraction of this range's full
 * scale (or it clips), down when it is below the down-fraction of this range's full scale.
 */
export function autoRangeStep(instrument: SimInstrument, k: number, value: number | null): number {
  const auto = instrument.autoRange;
  const ranges = instrument.ranges;
  if (!auto) return k;
  const fs = ranges[k].fullScale;
  if (value === null || Math.abs(value) > auto.upAtFractionOfFullScale * fs) return Math.min(k + 1, ranges.length - 1);
  if (k > 0 && Math.abs(value) < auto.downAtFractionOfFullScale * fs) return k - 1;
  return k;
}
