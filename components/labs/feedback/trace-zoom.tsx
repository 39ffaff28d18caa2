"use client";
// Zooming into a stretch of a long logged trace: the reader gives a time window, and the server answers
// that window at full resolution from the stored samples (GET /api/uploads/{id}/trace), reduced by
// min/max per pixel column of this plot's width, so a short wake still shows at its full height.
import { useId, useRef, useState } from "react";
import { PlotCanvas } from "@/components/ui/plot";
import { api, isApiError } from "@/lib/http/client";
import { currentScale, formatDuration } from "@/lib/trace/format";

type Window = { from: number; to: number; samples: number; t: number[]; i: number[] };

export function TraceZoom({ uploadId, duration }: { uploadId: string; duration: number }) {
  const id = useId();
  const box = useRef<HTMLDivElement>(null);
  const [from, setFrom] = useState("0");
  const [to, setTo] = useState(String(Math.min(duration, 1)));
  const [win, setWin] = useState<Window | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function show(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    const a = Number(from);
    const b = Number(to);
    if (!Number.isFinite(a) || !Number.isFinite(b) || b <= a) {
      setError("Give a start and a later end, in seconds.");
      return;
    }
    const columns = Math.max(100, Math.min(4000, Math.round(box.current?.clientWidth ?? 800)));
    setBusy(true);
    try {
      setWin(await api<Window>(`/api/uploads/${uploadId}/trace?from=${a}&to=${b}&points=${columns}`));
    } catch (err) {
      setError(isApiError(err) ? err.message : "The stretch could not be read.");
    } finally {
      setBusy(false);
    }
  }

  const cs = win ? currentScale(Math.max(...win.i.map(Math.abs), 1e-12)) : null;
  return (
    <div className="mt-3" ref={box} data-testid="trace-zoom">
      <form className="flex flex-wrap items-end gap-3 text-sm" onSubmit={show} aria-describedby={`${id}-hint`}>
        <label className="flex flex-col">
          <span className="field-label">From (s)</span>
          <input className="input w-28" inputMode="decimal" value={from} onChange={(e) => setFrom(e.target.value)} />
        </label>
        <label className="flex flex-col">
          <span className="field-label">To (s)</span>
          <input className="input w-28" inputMode="decimal" value={to} onChange={(e) => setTo(e.target.value)} />
        </label>
        <button type="submit" className="btn-quiet px-3 py-1" disabled={busy}>
          {busy ? "Reading…" : "Show at full resolution"}
        </button>
      </form>
      <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
        The whole trace lasts {formatDuration(duration)}; times count from its first sample.
      </p>
      {error ? (
        <p className="field-error" role="alert">
          {error}
        </p>
      ) : null}
      {win && cs ? (
        <figure className="mt-2" data-testid="trace-zoom-plot">
          <PlotCanvas
            x={win.t}
            series={[{ label: "current", values: win.i.map((v) => v * cs.factor), color: "#1f5f8b", width: 1.5, stepped: true }]}
            xLabel="time (s)"
            yLabel={`current (${cs.unit})`}
            height={220}
          />
          <figcaption className="mt-1 text-sm text-ink-soft">
            {win.from} s to {win.to} s: {win.samples.toLocaleString("en")} samples
            {win.t.length < win.samples ? `, drawn as ${win.t.length.toLocaleString("en")} points (the lowest and highest of each pixel column)` : ", every one drawn"}.
          </figcaption>
        </figure>
      ) : null}
    </div>
  );
}
