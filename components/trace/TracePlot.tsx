"use client";
// A logged current trace drawn with uPlot (canvas), with its numbers written out beside it. Traces of
// 100k+ samples are min/max-decimated first so that every short wake still shows as a peak. The canvas is
// hidden from assistive technology; the caption and the summary list carry the same information, and
// nothing in the figure takes keyboard focus except the log-axis checkbox.
import { useEffect, useId, useMemo, useRef, useState } from "react";
import type uPlotType from "uplot";
import "uplot/dist/uPlot.min.css";
import { minMaxDecimate } from "@/lib/trace/decimate";
import { currentScale, formatCharge, formatCurrent, formatDuration, formatPercent, timeScale } from "@/lib/trace/format";
import type { TraceAnalysis } from "@/lib/trace/types";

export type TraceSummary = Pick<
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
  trace: TraceSummary;
  caption?: string;
  maxPoints?: number;
  testId?: string;
}) {
  const host = useRef<HTMLDivElement>(null);
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

  useEffect(() => {
    let cancelled = false;
    let chart: uPlotType | null = null;
    let observer: ResizeObserver | null = null;
    (async () => {
      const { default: uPlot } = await import("uplot");
      if (cancelled || !host.current) return;
      const width = Math.max(280, host.current.clientWidth);
      const opts: uPlotType.Options = {
        width,
        height: HEIGHT,
        scales: { x: { time: false }, y: useLog ? { distr: 3 } : {} },
        axes: [
          { label: `time (${ts.unit})`, stroke: "#46505c", grid: { stroke: "#e4e0d6" } },
          { label: `current (${cs.unit})`, stroke: "#46505c", grid: { stroke: "#e4e0d6" }, size: 70 },
        ],
        legend: { show: true },
        cursor: { drag: { x: true, y: false } },
        series: [
          { label: `time (${ts.unit})` },
          // sample-and-hold, as the analysis integrates it
          { label: "current", stroke: "#1f5f8b", width: 1.5, paths: uPlot.paths.stepped!({ align: 1 }), points: { show: false } },
          { label: "average", stroke: "#a4532c", width: 1.5, dash: [6, 4], points: { show: false } },
          { label: "sleep/active threshold", stroke: "#7a828c", width: 1, dash: [2, 4], points: { show: false } },
        ],
      };
      chart = new uPlot(opts, [data.x, data.y, data.average, data.threshold] as uPlotType.AlignedData, host.current);
      observer = new ResizeObserver(() => {
        if (host.current && chart) chart.setSize({ width: Math.max(280, host.current.clientWidth), height: HEIGHT });
      });
      observer.observe(host.current);
    })();
    return () => {
      cancelled = true;
      observer?.disconnect();
      chart?.destroy();
    };
  }, [data, useLog, ts.unit, cs.unit]);

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
      <div ref={host} className="w-full overflow-hidden" aria-hidden="true" />
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
