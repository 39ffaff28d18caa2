"use client";
// The analysis of a logged current trace attached to an attempt: the plot with its numbers (TracePlot),
// which units the columns were read in, and which rows were skipped.
import { TracePlot } from "@/components/trace";
import type { TraceAnalysis } from "@/lib/trace/types";
import { traceRowsNote, traceUnitsNote } from "./trace-numbers";
import { TraceZoom } from "./trace-zoom";

export function TracePanel({ name, analysis, uploadId, zoomable = false }: { name: string; analysis: TraceAnalysis; uploadId?: string; zoomable?: boolean }) {
  const units = traceUnitsNote(analysis);
  return (
    <div className="card mt-3" data-testid="trace-analysis">
      <h3 className="text-lg">Logged trace: {name}</h3>
      <p className="mt-1 text-sm text-ink-soft" data-testid="trace-rows">
        {traceRowsNote(analysis)}
      </p>
      {units ? <p className="text-sm text-ink-soft">{units}</p> : null}
      {analysis.plot?.t?.length ? (
        <TracePlot trace={analysis} caption={`Your trace ${name}`} testId="trace-plot" />
      ) : (
        <p className="mt-2 text-sm text-ink-soft">This trace was stored without plot points.</p>
      )}
      {zoomable && uploadId ? <TraceZoom uploadId={uploadId} duration={analysis.duration} /> : null}
      {analysis.warnings?.length ? (
        <ul className="mt-2 list-disc pl-6 text-sm text-ink-soft" aria-label="Notes on the trace">
          {analysis.warnings.map((w, k) => (
            <li key={k}>{w}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
