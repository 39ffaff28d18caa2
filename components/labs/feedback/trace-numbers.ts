// Notes on a logged trace's analysis that the plot's own summary leaves out. Pure, for the feedback page and tests.
import type { TraceAnalysis } from "@/lib/trace/types";

/** "4,000 rows read; 3 bad rows skipped (line 12: not a number, …)". */
export function traceRowsNote(a: Partial<TraceAnalysis>): string {
  const read = typeof a.rows === "number" ? `${a.rows.toLocaleString("en-GB")} rows read` : "Rows read";
  if (!a.badRows) return `${read}; no bad rows.`;
  const examples = (a.badRowExamples ?? []).slice(0, 3).map((b) => `line ${b.line}: ${b.reason}`);
  return `${read}; ${a.badRows} bad row${a.badRows === 1 ? "" : "s"} skipped${examples.length ? ` (${examples.join("; ")}${a.badRows > examples.length ? "; …" : ""})` : ""}.`;
}

/** Which units the columns were read in, and whether they were guessed. */
export function traceUnitsNote(a: Partial<TraceAnalysis>): string | null {
  if (!a.units) return null;
  const shown = (u: string) => u.replace(/^u/, "µ");
  const base = `Time in ${shown(a.units.time)}, current in ${shown(a.units.current)}`;
  return a.units.inferred ? `${base} (the header did not say, so these were assumed).` : `${base}, as the header says.`;
}
