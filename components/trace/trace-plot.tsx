"use client";
// A logged current trace drawn with the shared uPlot canvas (components/ui/plot.tsx), with its numbers
// written out beside it. Traces of
// 100k+ samples are min/max-decimated first so that every short wake still shows as a peak. The canvas is
// hidden from assistive technology; the caption and the summary list carry the same information, and
// nothing in the figure takes keyboard focus except the log-axis checkbox.
import { useId, useMemo, useState } from "react";
import { PlotCanvas, type PlotSeries } from "@/components/ui/plot";
import { minMaxDecimate } from "@/lib/trace/decimate";
import { currentScale, formatCharge, formatCurrent, formatDuration, formatPercent, timeScale } from "@/lib/trace/format";
import type { TraceAnalysis } from "@/lib/trace/types";

/** The parts of a trace analysis that the plot and its summary show. */
export type PlottedTrace = Pick<
  TraceAnalysis,
  | "plot"
  | "rows"
  | "badRows"
  | "duration"
  | "averageCurrent"
  | "minCurrent"
  | "maxCurrent"
  | "sleepLevel"
  | "activeLevel"
  | "threshold"
  | "dutyCycle"
  | "wakes"
  | "period"
  | "chargePerWake"
  | "batteryLife"
>;

const HEIGHT = 260;

export function TracePlot({
  trace,
  caption = "Logged current trace",
  maxPoints = 4000,
  testId,
}: {
  trace: PlottedTrace;
  caption?: string;
  maxPoints?: number;
  testId?: string;
}) {
  const summaryId = useId();
  const logId = useId();
  const [log, setLog] = useState(false);

  const points = useMemo(
    () => (trace.plot.t.length > maxPoints ? minMaxDecimate(trace.plot.t, trace.plot.i, maxPoints) : trace.plot),
    [trace.plot, maxPoints],
  );
  const cs = currentScale(Math.max(Math.abs(trace.minCurrent), Math.abs(trace.maxCurrent)));
  const ts = timeScale(trace.duration);
  const canLog = points.i.length > 0 && points.i.every((v) => v > 0);
  const useLog = log && canLog;

  const data = useMemo(() => {
    const x = points.t.map((v) => v * ts.factor);
    const level = (v: number | null) => x.map(() => (v === null ? null : v * cs.factor));
    return {
      x,
      y: points.i.map((v) => v * cs.factor),
      average: level(trace.averageCurrent),
      threshold: level(trace.threshold),
    };
  }, [points, ts.factor, cs.factor, trace.averageCurrent, trace.threshold]);
  const series: PlotSeries[] = useMemo(
    () => [
      // sample-and-hold, as the analysis integrates it
      { label: "current", values: data.y, color: "#1f5f8b", width: 1.5, stepped: true },
      { label: "average", values: data.average, color: "#a4532c", width: 1.5, dash: [6, 4] },
      { label: "sleep/active threshold", values: data.threshold, color: "#7a828c", width: 1, dash: [2, 4] },
    ],
    [data],
  );

  const rows: [string, string][] = [
    ["Samples", `${trace.rows.toLocaleString("en")}${trace.badRows > 0 ? ` (${trace.badRows.toLocaleString("en")} bad rows skipped)` : ""}`],
    ["Duration", formatDuration(trace.duration)],
    ["Average current (time-weighted)", formatCurrent(trace.averageCurrent)],
    ["Lowest / highest sample", `${formatCurrent(trace.minCurrent)} / ${formatCurrent(trace.maxCurrent)}`],
  ];
  if (trace.activeLevel !== null && trace.dutyCycle !== null) {
    rows.push(
      ["Sleep level", formatCurrent(trace.sleepLevel)],
      ["Active level", formatCurrent(trace.activeLevel)],
      ["Duty cycle", formatPercent(trace.dutyCycle)],
      ["Wakes", String(trace.wakes)],
    );
    if (trace.period !== null) rows.push(["Time between wakes", formatDuration(trace.period)]);
    if (trace.chargePerWake !== null) rows.push(["Charge per wake", formatCharge(trace.chargePerWake)]);
  } else {
    rows.push(["Levels", "no clear sleep and active levels"]);
  }
  if (trace.batteryLife !== null) rows.push(["Estimated battery life", formatDuration(trace.batteryLife)]);

  const decimated = points.t.length < trace.plot.t.length || points.t.length < trace.rows;

  return (
    <figure className="my-4 break-inside-avoid" data-testid={testId} aria-describedby={summaryId}>
      <PlotCanvas x={data.x} series={series} xLabel={`time (${ts.unit})`} yLabel={`current (${cs.unit})`} yLog={useLog} height={HEIGHT} zoomX />
      <figcaption className="mt-2 text-sm text-ink-soft">
        {caption}: current against time
        {decimated
          ? `, ${trace.rows.toLocaleString("en")} samples drawn as ${points.t.length.toLocaleString("en")} points (the lowest and highest of each stretch, so short peaks still show)`
          : ""}
        . The dashed line is the average current{trace.threshold !== null ? "; the dotted line divides sleep from active" : ""}.
      </figcaption>
      <div className="no-print mt-2 flex items-center gap-2 text-sm">
        <input
          id={logId}
          type="checkbox"
          checked={useLog}
          disabled={!canLog}
          onChange={(e) => setLog(e.currentTarget.checked)}
        />
        <label htmlFor={logId}>
          Logarithmic current axis{canLog ? "" : " (needs every current above zero)"}
        </label>
      </div>
      <dl id={summaryId} className="mt-3 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-ink-soft">{k}</dt>
            <dd className="font-mono text-ink">{v}</dd>
          </div>
        ))}
      </dl>
    </figure>
  );
}
