// The numbers of a logged trace's analysis as label/value rows. Pure, for the feedback page and tests.
import { formatQuantity } from "@/lib/grader/format";
import type { TraceAnalysis } from "@/lib/trace/types";

export type TraceRow = { label: string; value: string; key: string };

export function traceRows(a: Partial<TraceAnalysis>): TraceRow[] {
  const rows: TraceRow[] = [];
  const add = (key: string, label: string, v: number | null | undefined, unit: string, opts?: { displayUnit?: string }) => {
    if (typeof v === "number" && Number.isFinite(v)) rows.push({ key, label, value: formatQuantity(v, unit, opts) });
  };
  add("averageCurrent", "Average current (time-weighted)", a.averageCurrent, "A");
  add("minCurrent", "Lowest current", a.minCurrent, "A");
  add("maxCurrent", "Highest current", a.maxCurrent, "A");
  if (a.twoLevel !== false) {
    add("sleepLevel", "Sleep level", a.sleepLevel, "A");
    add("activeLevel", "Active level", a.activeLevel, "A");
    if (typeof a.dutyCycle === "number") rows.push({ key: "dutyCycle", label: "Duty cycle", value: formatQuantity(a.dutyCycle * 100, "%") });
    if (typeof a.wakes === "number") rows.push({ key: "wakes", label: "Wakes in the trace", value: String(a.wakes) });
    add("period", "Time between wakes", a.period, "s");
    add("activeTimePerWake", "Active time per wake", a.activeTimePerWake, "s");
    add("chargePerWake", "Charge per wake", a.chargePerWake, "C");
  }
  if (typeof a.batteryLife === "number" && Number.isFinite(a.batteryLife)) {
    rows.push({
      key: "batteryLife",
      label: "Estimated battery life",
      value: `${formatQuantity(a.batteryLife, "s", { displayUnit: "h" })} = ${formatQuantity(a.batteryLife, "s", { displayUnit: "d" })}`,
    });
  }
  add("duration", "Length of the trace", a.duration, "s");
  return rows;
}

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
