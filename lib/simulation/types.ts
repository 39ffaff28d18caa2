// The shapes the simulated bench works on. The instrument is an instrument profile (lib/instruments); only
// the fields the simulation reads are named here, so any profile of that shape can be passed.

export type SimResolution = { counts: number } | { bits: number; referenceVolts: number };

export interface SimRange {
  key: string;
  label: string;
  /** amperes */
  fullScale: number;
  shuntOhms?: number;
  burdenAtFullScale?: number;
  feedbackOhms?: number;
  resolution: SimResolution;
  accuracy: { percentOfReading: number; counts?: number; percentOfRange?: number };
  /** V/A of the analogue output that the converter reads (sampling meter) */
  sensitivity?: number;
  filterCutoffHz?: number;
  settlingSeconds?: number;
}

export interface SimInstrument {
  name: string;
  kind: "sampling-meter" | "multimeter" | "feedback-ammeter";
  /** ordered from the smallest full scale up */
  ranges: SimRange[];
  autoRange?: { upAtFractionOfFullScale: number; downAtFractionOfFullScale: number; settlingSeconds: number };
  offset?: { volts: number };
}

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
 */
export interface ReadingRun {
  range: string;
  filter: boolean;
  from: number;
  count: number;
  /** readings per second; the live display uses DISPLAY_RATE_HZ */
  rate?: number;
}

/** One reading: `value` in amperes, null while the meter shows an overload. */
export interface SimReading {
  t: number;
  value: number | null;
  unit: "A";
  range: string;
}
