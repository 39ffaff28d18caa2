"use client";
// Histogram of one lab's counted scores (percent of the maximum) drawn with uPlot as bars. The canvas
// is hidden from assistive technology; the caption and the bin list below it carry the same numbers.
import { useEffect, useRef } from "react";
import type uPlotType from "uplot";
import "uplot/dist/uPlot.min.css";

const HEIGHT = 160;

export function ScoreHistogram({ bins, title }: { bins: { from: number; to: number; count: number }[]; title: string }) {
  const host = useRef<HTMLDivElement>(null);
  useEffect(() => {
    let cancelled = false;
    let chart: uPlotType | null = null;
    (async () => {
      const { default: uPlot } = await import("uplot");
      if (cancelled || !host.current) return;
      const x = bins.map((b) => (b.from + b.to) / 2);
      const y = bins.map((b) => b.count);
      chart = new uPlot(
        {
          width: Math.max(240, host.current.clientWidth),
          height: HEIGHT,
          legend: { show: false },
          cursor: { show: false },
          scales: { x: { time: false, range: [0, 100] }, y: { range: (_u, _min, max) => [0, Math.max(1, max)] } },
          axes: [
            { label: "score (% of maximum)", stroke: "#46505c", grid: { show: false } },
            { label: "students", stroke: "#46505c", grid: { stroke: "#e4e0d6" }, size: 40 },
          ],
          series: [
            {},
            { label: "students", fill: "rgba(31, 95, 139, 0.55)", stroke: "#1f5f8b", width: 1, paths: uPlot.paths.bars!({ size: [0.9, 60] }), points: { show: false } },
          ],
        },
        [x, y] as uPlotType.AlignedData,
        host.current,
      );
    })();
    return () => {
      cancelled = true;
      chart?.destroy();
    };
  }, [bins]);
  return (
    <figure className="mt-3">
      <div ref={host} className="w-full overflow-hidden" aria-hidden="true" data-testid="score-histogram" />
      <figcaption className="mt-1 text-xs text-ink-soft">
        {title}: students per 10 % band of the counted score —{" "}
        {bins.map((b) => `${b.from}–${b.to} %: ${b.count}`).join("; ")}.
      </figcaption>
    </figure>
  );
}
