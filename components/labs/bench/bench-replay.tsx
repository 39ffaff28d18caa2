"use client";
// The staff's replay of a student's simulated bench on the review page: the run the student's log names
// (range, filter, the moment it started) and how many readings, answered by GET …/bench/readings?userId=,
// which computes them with the same module the student's page ran.
import { useState, type FormEvent } from "react";
import { api, isApiError } from "@/lib/http/client";
import type { InstrumentProfile } from "@/lib/instruments/profile";
import type { SimReading } from "@/lib/simulation/types";
import { displayText } from "./format";

export function BenchReplay({ labId, studentId }: { labId: string; studentId: string }) {
  const [instrument, setInstrument] = useState<InstrumentProfile | null>(null);
  const [readings, setReadings] = useState<SimReading[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function replay(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const q = new URLSearchParams({
      range: String(form.get("range") ?? ""),
      filter: String(form.get("filter") ?? "on"),
      from: String(form.get("from") ?? "0"),
      count: String(form.get("count") ?? "20"),
      userId: studentId,
    });
    setBusy(true);
    setError(null);
    try {
      const [bench, body] = await Promise.all([
        instrument ? Promise.resolve({ bench: { instrument } }) : api<{ bench: { instrument: InstrumentProfile } }>(`/api/labs/${labId}/bench?userId=${studentId}`),
        api<{ readings: SimReading[] }>(`/api/labs/${labId}/bench/readings?${q}`),
      ]);
      setInstrument(bench.bench.instrument);
      setReadings(body.readings);
    } catch (err) {
      setError(isApiError(err) ? err.message : "The replay could not be loaded.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <section className="no-print card mt-8" aria-labelledby="replay-heading" data-testid="bench-replay">
      <h2 id="replay-heading" className="text-xl">
        Replay the student&apos;s simulated bench
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        Enter the run from the student&apos;s log (range, filter and the time it started): the readings are computed again from the student&apos;s seed, exactly as their page showed
        them, four a second from that time.
      </p>
      <form onSubmit={replay} className="mt-3 flex flex-wrap items-end gap-3">
        <label className="text-sm">
          <span className="field-label">Range key (or auto)</span>
          <input name="range" className="field-input w-28" defaultValue="auto" required />
        </label>
        <label className="text-sm">
          <span className="field-label">Filter</span>
          <select name="filter" className="field-input" defaultValue="on">
            <option value="on">on</option>
            <option value="off">off</option>
          </select>
        </label>
        <label className="text-sm">
          <span className="field-label">From (s)</span>
          <input name="from" className="field-input w-28" inputMode="decimal" defaultValue="0" />
        </label>
        <label className="text-sm">
          <span className="field-label">Readings</span>
          <input name="count" className="field-input w-24" inputMode="numeric" defaultValue="20" />
        </label>
        <button type="submit" className="btn-quiet" disabled={busy}>
          {busy ? "Replaying…" : "Replay"}
        </button>
      </form>
      {error ? (
        <p role="alert" className="mt-2 text-sm text-verdict-wrong">
          {error}
        </p>
      ) : null}
      {readings && instrument ? (
        <div className="mt-3 max-h-80 overflow-auto">
          <table className="min-w-full text-sm">
            <thead>
              <tr>
                <th className="pr-3 text-left">Time</th>
                <th className="pr-3 text-left">Reading</th>
                <th className="text-left">Range</th>
              </tr>
            </thead>
            <tbody>
              {readings.map((r) => {
                const range = instrument.ranges.find((x) => x.key === r.range)!;
                const d = displayText(r.value, range);
                return (
                  <tr key={r.t}>
                    <td className="pr-3 tabular-nums">{r.t.toFixed(2)} s</td>
                    <td className="pr-3 tabular-nums">
                      {d.digits} {d.unit}
                    </td>
                    <td>{range.label}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}
    </section>
  );
}
