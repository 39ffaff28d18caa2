"use client";
// The analysis of a logged current trace attached to an attempt: its numbers and its plot.
import type { TraceAnalysis } from "@/lib/trace/types";
import { traceRows, traceRowsNote, traceUnitsNote } from "./trace-numbers";

export function TracePanel({ name, analysis }: { name: string; analysis: TraceAnalysis }) {
  const rows = traceRows(analysis);
  const units = traceUnitsNote(analysis);
  return (
    <div className="card mt-3" data-testid="trace-analysis">
      <h3 className="text-lg">Logged trace: {name}</h3>
      <p className="mt-1 text-sm text-ink-soft">{traceRowsNote(analysis)}</p>
      {units ? <p className="text-sm text-ink-soft">{units}</p> : null}
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        {rows.map((r) => (
          <div key={r.key} className="flex justify-between gap-4 border-b border-ink/10 py-1">
            <dt className="text-ink-soft">{r.label}</dt>
            <dd className="m-0 font-semibold tabular-nums" data-testid={`trace-${r.key}`}>
              {r.value}
            </dd>
          </div>
        ))}
      </dl>
      {analysis.twoLevel === false ? <p className="mt-2 text-sm text-ink-soft">The trace does not split clearly into a sleep and an active level, so no duty cycle is given.</p> : null}
      {analysis.warnings?.length ? (
        <ul className="mt-2 list-disc pl-6 text-sm text-ink-soft">
          {analysis.warnings.map((w, k) => (
            <li key={k}>{w}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
