// The shapes the simulated bench works on. The instrument is an instrument profile (lib/instruments/profile.ts).
import type { InstrumentProfile, InstrumentRange } from "@/lib/instruments/profile";

export type SimInstrument = InstrumentProfile;
export type SimRange = InstrumentRange;

/**
 * The student's circuit on the bench: an ideal supply feeding a load through the meter. A duty-cycled load
 * draws more (a lower resistance) for `burst.width` once every `burst.period`, the first wake at `burst.delay`
 * on the bench's clock. `pickup` is mains hum coupled into the meter's input (peak amperes at its frequency).
 */
export interface BenchCircuit {
  supplyVoltage: number;
  loadResistance: number;
  burst?: { loadResistance: number; width: number; period: number; delay?: number };
  pickup?: { amplitude: number; frequency: number };
}

/**
 * One run of readings: a range key (or "auto" where the profile auto-ranges), the filter on or off, and
 * `count` readings `1/rate` seconds apart starting at `from` seconds on the bench's clock. `from` is the moment
 * of the last change (range, filter, circuit connected): the meter's output starts at zero there and settles.
 * `bothWays` puts a sampling meter's output on its mid-scale offset (currents in both directions).
 */
export interface ReadingRun {
  range: string;
  filter: boolean;
  from: number;
  count: number;
  /** readings per second; the live display uses DISPLAY_RATE_HZ */
  rate?: number;
  bothWays?: boolean;
}

/** One reading: `value` in amperes, null while the meter shows an overload. */
export interface SimReading {
  t: number;
  value: number | null;
  unit: "A";
  range: string;
}
