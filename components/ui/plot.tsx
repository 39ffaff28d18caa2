"use client";
// The one uPlot (canvas) wrapper: the lessons' calculators, the logged-trace plot and the gradebook's
// score histogram all draw through PlotCanvas. The chart is created once per shape (series, labels, scale) and then only handed new numbers;
// it follows its container's width. The canvas is hidden from assistive technology: every caller writes
// what it shows in text beside it (a caption, a summary list).
import { useEffect, useRef } from "react";
import type uPlotType from "uplot";
import "uplot/dist/uPlot.min.css";

export type PlotSeries = {
  label: string;
  values: (number | null)[];
  color: string;
  width?: number;
  dash?: number[];
  stepped?: boolean;
  /** drawn as bars filled with this colour (a histogram) */
  barFill?: string;
};

export interface PlotCanvasProps {
  x: number[];
  series: PlotSeries[];
  xLabel: string;
  yLabel: string;
  yLog?: boolean;
  height?: number;
  /** let the reader drag across the x axis to zoom */
  zoomX?: boolean;
  /** a fixed x range instead of the data's */
  xRange?: [number, number];
  /** the y axis starts at zero (and shows at least 0 to 1) */
  yFromZero?: boolean;
  /** the legend and the cursor's readout under the chart */
  legend?: boolean;
}

export function PlotCanvas({ x, series, xLabel, yLabel, yLog = false, height = 240, zoomX = false, xRange, yFromZero = false, legend = true }: PlotCanvasProps) {
  const host = useRef<HTMLDivElement>(null);
  const chart = useRef<uPlotType | null>(null);
  const shape = JSON.stringify([series.map((s) => [s.label, s.color, s.width, s.dash, s.stepped, s.barFill]), xLabel, yLabel, yLog, height, zoomX, xRange, yFromZero, legend]);

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
        scales: {
          x: { time: false, ...(xRange ? { range: xRange } : {}) },
          y: yLog ? { distr: 3 } : yFromZero ? { range: (_u, _min, max) => [0, Math.max(1, max)] } : {},
        },
        axes: [
          { label: xLabel, stroke: "#46505c", grid: { stroke: "#e4e0d6" } },
          { label: yLabel, stroke: "#46505c", grid: { stroke: "#e4e0d6" }, size: 70 },
        ],
        legend: { show: legend },
        cursor: legend ? { drag: { x: zoomX, y: false } } : { show: false },
        series: [
          { label: xLabel },
          ...series.map((s) => ({
            label: s.label,
            stroke: s.color,
            width: s.width ?? (s.barFill ? 1 : 2),
            dash: s.dash,
            fill: s.barFill,
            paths: s.barFill ? uPlot.paths.bars!({ size: [0.9, 60] }) : s.stepped ? uPlot.paths.stepped!({ align: 1 }) : undefined,
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
