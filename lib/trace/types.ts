// Shared types of the trace analysis. All results are in SI units: seconds, amperes, coulombs.

export type TimeUnit = "s" | "ms" | "us";
export type CurrentUnit = "A" | "mA" | "uA" | "nA";

/** Where a column's unit came from: the file's header, the caller's options, or the default (s, A). */
export type UnitSource = "header" | "option" | "default";

export type TraceOptions = {
  /** Unit of the time column when the header does not name one. */
  timeUnit?: TimeUnit;
  /** Unit of the current column when the header does not name one. */
  currentUnit?: CurrentUnit;
  /** Battery capacity in coulombs (1 mAh = 3.6 C). */
  batteryCapacity?: number;
  /** Usable fraction of the capacity (derating), default 0.8. */
  usableFraction?: number;
  /** Largest number of points in `plot`, default 4000. */
  maxPlotPoints?: number;
};

export type BadRow = { line: number; reason: string };

export type TraceUnits = {
  time: TimeUnit;
  current: CurrentUnit;
  timeSource: UnitSource;
  currentSource: UnitSource;
  /** True when either unit was not given by the header or the options (the defaults were taken). */
  inferred: boolean;
};

export type TraceFormat = {
  delimiter: "," | ";" | "\t";
  decimalComma: boolean;
  /** The header row's cells, or null when the first row holds numbers. */
  header: string[] | null;
  timeColumn: number;
  currentColumn: number;
};

export type TraceAnalysis = {
  /** Good rows used in the analysis. */
  rows: number;
  /** Rows skipped (not numbers, missing cells, time not increasing). Blank lines are not counted. */
  badRows: number;
  /** The first few skipped rows, with 1-based line numbers in the file. */
  badRowExamples: BadRow[];
  units: TraceUnits;
  format: TraceFormat;
  /** How the integrals were taken (see analyze.ts). */
  integration: "sample-and-hold";
  /** Time from the first to the last good row, s. */
  duration: number;
  /** Time-weighted mean current, A (sample-and-hold). */
  averageCurrent: number;
  /** Time-weighted mean current by the trapezoidal rule, A: a cross-check of averageCurrent. */
  averageCurrentTrapezoid: number;
  /** Plain mean of the samples, A. Wrong for uneven sampling; kept to show the difference. */
  sampleMean: number;
  minCurrent: number;
  maxCurrent: number;
  /** ∫ i dt over the trace, C. */
  totalCharge: number;
  /** True when the trace splits clearly into a sleep and an active level. */
  twoLevel: boolean;
  /** Otsu's separation measure (between-class over total variance, 0..1) on the scale of levels.ts. */
  separation: number;
  /** Current that divides sleep from active, A; null when the trace is not two-level. */
  threshold: number | null;
  /** Time-weighted mean of the sleep side, A (the average current when the trace is not two-level). */
  sleepLevel: number;
  /** Time-weighted mean of the active side, A. */
  activeLevel: number | null;
  /** Fraction of the time above the threshold. */
  dutyCycle: number | null;
  /** Number of rising crossings of the threshold. */
  wakes: number;
  /** Mean time between wakes, s (needs two wakes). */
  period: number | null;
  /** Mean active time per wake, s (active runs cut by the trace's ends are left out). */
  activeTimePerWake: number | null;
  /** Mean ∫ i dt over each wake's active run, C: Q_wake = I_a·t_a for a square wave. */
  chargePerWake: number | null;
  /** usableFraction · batteryCapacity / averageCurrent, s; null without a capacity. */
  batteryLife: number | null;
  /** The trace min/max-decimated to at most maxPlotPoints points (see decimate.ts), SI units. */
  plot: { t: number[]; i: number[] };
  warnings: string[];
};
