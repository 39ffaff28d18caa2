"use client";
// The one uPlot (canvas) wrapper: the lessons' calculators and the logged-trace plot both draw through
// PlotCanvas. The chart is created once per shape (series, labels, scale) and then only handed new numbers;
// it follows its container's width. The canvas is hidden from assistive technology: every caller writes
// what it shows in text beside it (a caption, a summary list).
import { useEffect, useRef } from "react";
import type uPlotType from "uplot";
import "uplot/dist/uPlot.min.css";

export type PlotSeries = { label: string; values: (number | null)[]; color: string; width?: number; dash?: number[]; stepped?: boolean };

export interface PlotCanvasProps {
  x: number[];
  series: PlotSeries[];
  xLabel: string;
  yLabel: string;
  yLog?: boolean;
  height?: number;
  /** let the reader drag across the x axis to zoom */
  zoomX?: boolean;
}

export function PlotCanvas({ x, series, xLabel, yLabel, yLog = false, height = 240, zoomX = false }: PlotCanvasProps) {
  const host = useRef<HTMLDivElement>(null);
  const chart = useRef<uPlotType | null>(null);
  const shape = JSON.stringify([series.map((s) => [s.label, s.color, s.width, s.dash, s.stepped]), xLabel, yLabel, yLog, height, zoomX]);

  // Create (or re-create when the shape changes) the chart.
  useEffect(() => {
    let cancelled = false;
    let observer: ResizeObserver | null = null;
    (async () => {
      const { default: uPlot } = await import("uplot");
      if (cancelled || !host.current) return;
      const opts: uPlotType.Options = {
        width: Math.max(280, host.current.clientWidth),
        height,
        scales: { x: { time: false }, y: yLog ? { distr: 3 } : {} },
        axes: [
          { label: xLabel, stroke: "#46505c", grid: { stroke: "#e4e0d6" } },
          { label: yLabel, stroke: "#46505c", grid: { stroke: "#e4e0d6" }, size: 70 },
        ],
        legend: { show: true },
        cursor: { drag: { x: zoomX, y: false } },
        series: [
          { label: xLabel },
          ...series.map((s) => ({
            label: s.label,
            stroke: s.color,
            width: s.width ?? 2,
            dash: s.dash,
            paths: s.stepped ? uPlot.paths.stepped!({ align: 1 }) : undefined,
            points: { show: false },
          })),
        ],
      };
      chart.current?.destroy();
      chart.current = new uPlot(opts, [x, ...series.map((s) => s.values)] as uPlotType.AlignedData, host.current);
      observer = new ResizeObserver(() => {
        if (host.current && chart.current) chart.current.setSize({ width: Math.max(280, host.current.clientWidth), height });
      });
      observer.observe(host.current);
    })();
    return () => {
      cancelled = true;
      observer?.disconnect();
      chart.current?.destroy();
      chart.current = null;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- `shape` stands for everything the options use
  }, [shape]);

  // New numbers: hand them to the existing chart.
  useEffect(() => {
    chart.current?.setData([x, ...series.map((s) => s.values)] as uPlotType.AlignedData);
  }, [x, series]);

  return <div ref={host} className="w-full overflow-hidden" aria-hidden="true" />;
}
