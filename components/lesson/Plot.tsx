"use client";
// A small uPlot (canvas) chart for the calculators. The data table stays in React; uPlot draws it.
// A text summary (figcaption) describes what the plot shows for readers who cannot see the canvas.
import { useEffect, useRef } from "react";
import type uPlotType from "uplot";
import "uplot/dist/uPlot.min.css";

export type PlotSeries = { label: string; values: number[]; color: string; dash?: number[]; stepped?: boolean };

export function Plot({
  x,
  series,
  xLabel,
  yLabel,
  yLog = false,
  caption,
  testId,
}: {
  x: number[];
  series: PlotSeries[];
  xLabel: string;
  yLabel: string;
  yLog?: boolean;
  caption: string;
  testId?: string;
}) {
  const host = useRef<HTMLDivElement>(null);
  const chart = useRef<uPlotType | null>(null);
  const shape = `${series.map((s) => `${s.label}|${s.stepped}`).join(",")}|${yLog}|${xLabel}|${yLabel}`;

  // Create (or re-create when the series change shape) the chart.
  useEffect(() => {
    let cancelled = false;
    let observer: ResizeObserver | null = null;
    (async () => {
      const { default: uPlot } = await import("uplot");
      if (cancelled || !host.current) return;
      const width = Math.max(280, host.current.clientWidth);
      const opts: uPlotType.Options = {
        width,
        height: 240,
        scales: { x: { time: false }, y: yLog ? { distr: 3 } : {} },
        axes: [
          { label: xLabel, stroke: "#46505c", grid: { stroke: "#e4e0d6" } },
          { label: yLabel, stroke: "#46505c", grid: { stroke: "#e4e0d6" }, size: 70 },
        ],
        legend: { show: true },
        cursor: { drag: { x: false, y: false } },
        series: [
          { label: xLabel },
          ...series.map((s) => ({
            label: s.label,
            stroke: s.color,
            width: 2,
            dash: s.dash,
            paths: s.stepped ? uPlot.paths.stepped!({ align: 1 }) : undefined,
            points: { show: false },
          })),
        ],
      };
      chart.current?.destroy();
      chart.current = new uPlot(opts, [x, ...series.map((s) => s.values)], host.current);
      observer = new ResizeObserver(() => {
        if (host.current && chart.current) chart.current.setSize({ width: Math.max(280, host.current.clientWidth), height: 240 });
      });
      observer.observe(host.current);
    })();
    return () => {
      cancelled = true;
      observer?.disconnect();
      chart.current?.destroy();
      chart.current = null;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [shape]);

  // New numbers: hand them to the existing chart.
  useEffect(() => {
    chart.current?.setData([x, ...series.map((s) => s.values)]);
  }, [x, series]);

  return (
    <figure className="my-3 break-inside-avoid" data-testid={testId}>
      <div ref={host} className="w-full overflow-hidden" aria-hidden="true" />
      <figcaption className="mt-1 text-sm text-ink-soft" aria-live="polite">
        {caption}
      </figcaption>
    </figure>
  );
}
