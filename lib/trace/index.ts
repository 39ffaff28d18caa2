// Public entry of the logged-current-trace analysis. Framework-free: papaparse and Node
// streams only.
import { analyzeSamples, TraceError, type TraceStats } from "./analyze";
import { readTrace, type TraceInput } from "./parse";
import type { TraceAnalysis, TraceOptions } from "./types";

export { analyzeSamples, TraceError, type TraceStats } from "./analyze";
export { minMaxColumns, minMaxDecimate, type PlotPoints } from "./decimate";
export { currentScale, timeScale, formatCurrent, formatDuration, formatCharge, formatPercent, type Scale } from "./format";
export { squareWaveCsv, squareWaveRows, type SquareWaveSpec } from "./generate";
export { splitLevels, MIN_SEPARATION, type LevelSplit } from "./levels";
export { readTrace, type TraceInput, type ReadResult } from "./parse";
export { columnsFromHeader, readHeaderCell, TIME_DIVISOR, CURRENT_DIVISOR } from "./units";
export type * from "./types";

/**
 * Analyses a logged current trace (CSV of time and current). Bad rows are counted and skipped; a trace
 * with fewer than two good rows throws a TraceError.
 */
export async function analyzeTrace(input: TraceInput, options: TraceOptions = {}): Promise<TraceAnalysis> {
  return (await analyzeTraceSamples(input, options)).analysis;
}

/** analyzeTrace, also handing back the good samples (SI units) it analysed. */
export async function analyzeTraceSamples(
  input: TraceInput,
  options: TraceOptions = {},
): Promise<{ analysis: TraceAnalysis; samples: { t: Float64Array; i: Float64Array } }> {
  const read = await readTrace(input, options);
  const { t, i } = read.samples.views();
  let stats: TraceStats;
  try {
    stats = analyzeSamples(t, i, options);
  } catch (err) {
    if (err instanceof TraceError) {
      err.badRows = read.badRows;
      err.badRowExamples = read.badRowExamples;
      if (read.badRows > 0) err.message += ` ${read.badRows} row${read.badRows === 1 ? " was" : "s were"} skipped.`;
    }
    throw err;
  }
  const analysis: TraceAnalysis = {
    ...stats,
    badRows: read.badRows,
    badRowExamples: read.badRowExamples,
    units: read.units,
    format: read.format,
    warnings: [...read.warnings, ...stats.warnings],
  };
  return { analysis, samples: { t, i } };
}
