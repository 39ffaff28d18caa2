"use client";
// The lab page's opener of the simulated bench: nothing of the simulator loads until the student opens it.
// Then the bench (seed, instrument, circuit) comes from GET /api/labs/{labId}/bench and the simulator's code
// from its own chunk.
import { useState, type ComponentType } from "react";
import { api, isApiError } from "@/lib/http/client";
import type { BenchData } from "./simulated-bench";

type BenchComponent = ComponentType<{ bench: BenchData }>;

export function BenchLauncher({ labId }: { labId: string }) {
  const [state, setState] = useState<{ Bench: BenchComponent; bench: BenchData } | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function open() {
    setBusy(true);
    setError(null);
    try {
      const [m, body] = await Promise.all([import("./simulated-bench"), api<{ bench: BenchData }>(`/api/labs/${labId}/bench`)]);
      setState({ Bench: m.SimulatedBench, bench: body.bench });
    } catch (e) {
      setError(isApiError(e) && e.status !== 0 ? e.message : "The simulated bench could not be loaded. Check your connection and try again.");
    } finally {
      setBusy(false);
    }
  }

  if (state) return <state.Bench bench={state.bench} />;
  return (
    <section className="card" aria-labelledby="bench-open-heading">
      <h2 id="bench-open-heading" className="text-xl">
        Simulated bench
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        No bench today? Measure your own circuit with the course&apos;s meter in the browser: switch ranges, watch the reading settle, log readings and traces. The staff can replay
        every reading you see.
      </p>
      <button type="button" className="btn-primary mt-3" onClick={open} disabled={busy} data-testid="open-bench">
        {busy ? "Opening…" : "Open the simulated bench"}
      </button>
      {error ? (
        <p role="alert" className="mt-2 text-sm text-verdict-wrong">
          {error}
        </p>
      ) : null}
    </section>
  );
}
