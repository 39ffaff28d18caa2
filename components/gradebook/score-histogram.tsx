"use client";
// Histogram of one lab's counted scores (percent of the maximum), drawn as bars by the one plot wrapper
// (components/ui/plot.tsx). The canvas is hidden from assistive technology; the caption and the bin list
// below it carry the same numbers.
import { useMemo } from "react";
import { PlotCanvas, type PlotSeries } from "@/components/ui/plot";

export function ScoreHistogram({ bins, title }: { bins: { from: number; to: number; count: number }[]; title: string }) {
  const x = useMemo(() => bins.map((b) => (b.from + b.to) / 2), [bins]);
  const series = useMemo<PlotSeries[]>(() => [{ label: "students", values: bins.map((b) => b.count), color: "#1f5f8b", barFill: "rgba(31, 95, 139, 0.55)" }], [bins]);
  return (
    <figure className="mt-3">
      <div data-testid="score-histogram">
        <PlotCanvas x={x} series={series} xLabel="score (% of maximum)" yLabel="students" height={160} xRange={[0, 100]} yFromZero legend={false} />
      </div>
      <figcaption className="mt-1 text-xs text-ink-soft">
        {title}: students per 10 % band of the counted score —{" "}
        {bins.map((b) => `${b.from}–${b.to} %: ${b.count}`).join("; ")}.
      </figcaption>
    </figure>
  );
}
