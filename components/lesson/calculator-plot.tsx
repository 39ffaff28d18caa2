"use client";
// A calculator's chart: the shared uPlot canvas (components/ui/plot.tsx) with a live caption that says in
// words what it shows, for readers who cannot see the canvas.
import { PlotCanvas, type PlotCanvasProps } from "@/components/ui/plot";

export type { PlotSeries } from "@/components/ui/plot";

/** A calculator's chart: the canvas with a live caption that says in words what it shows. */
export function Plot({ caption, testId, ...canvas }: PlotCanvasProps & { caption: string; testId?: string }) {
  return (
    <figure className="my-3 break-inside-avoid" data-testid={testId}>
      <PlotCanvas {...canvas} />
      <figcaption className="mt-1 text-sm text-ink-soft" aria-live="polite">
        {caption}
      </figcaption>
    </figure>
  );
}
