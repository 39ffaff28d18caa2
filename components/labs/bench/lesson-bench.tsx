"use client";
// A small simulated bench inside a lesson, on a fixed example circuit with the course teaching meter (the same
// module as the lab page's bench). Nothing of the simulator loads until the reader opens it.
import { useState, type ComponentType } from "react";
import type { BenchCircuit } from "@/lib/simulation";
import type { BenchData } from "./simulated-bench";

type BenchComponent = ComponentType<{ bench: BenchData; compact?: boolean; title?: string }>;

/** The example circuits the lessons use: what each one shows is in the lesson's text. */
const EXAMPLES: Record<string, { title: string; circuit: BenchCircuit }> = {
  // 0.4 V across 1 kΩ: the 500 µA range's 100 Ω cuts 400 µA to 363.6 µA, the 50 mA range's 1 Ω barely
  burden: { title: "Try it: burden on each range", circuit: { supplyVoltage: 0.4, loadResistance: 1000 } },
  // 30 µA: auto-ranging comes down from the top range and settles on the 500 µA range
  "auto-ranging": { title: "Try it: auto-ranging", circuit: { supplyVoltage: 3.3, loadResistance: 110e3 } },
  // 2 µA with 0.5 µA peak of 1.01 kHz ripple from a switching regulator coupled in: the 200 Hz filter takes it
  // down about fivefold (1/√(1 + (1010/200)²) = 0.194); 50 Hz hum it would barely touch (0.970)
  filtering: { title: "Try it: the filter against ripple", circuit: { supplyVoltage: 3.3, loadResistance: 1.65e6, pickup: { amplitude: 0.5e-6, frequency: 1010 } } },
  // a node at 5 µA that wakes to 20 mA for 50 ms every 1.02 s: log it at 1 per second and see the alias
  sampling: {
    title: "Try it: logging short bursts",
    circuit: { supplyVoltage: 3.3, loadResistance: 3.3 / 5e-6, burst: { loadResistance: 3.3 / 20e-3, width: 0.05, period: 1.02, delay: 0.25 } },
  },
};

export type LessonBenchExample = keyof typeof EXAMPLES;

export function LessonBench({ example }: { example: LessonBenchExample }) {
  const ex = EXAMPLES[example];
  const [state, setState] = useState<{ Bench: BenchComponent; bench: BenchData } | null>(null);
  const [busy, setBusy] = useState(false);

  async function open() {
    setBusy(true);
    const [m, lib] = await Promise.all([import("./simulated-bench"), import("@/lib/instruments/library")]);
    const { libraryKey, ...instrument } = lib.teachingMeter;
    void libraryKey;
    setState({ Bench: m.SimulatedBench, bench: { seed: `lesson-${example}`, instrument, circuit: ex.circuit } });
    setBusy(false);
  }

  if (state) return <div className="my-6"><state.Bench bench={state.bench} compact title={ex.title} /></div>;
  return (
    <div className="card my-6" data-testid={`lesson-bench-${example}`}>
      <p className="font-semibold">{ex.title}</p>
      <p className="mt-1 text-sm text-ink-soft">The course teaching meter on an example circuit, simulated in your browser.</p>
      <button type="button" className="btn-quiet mt-2" onClick={open} disabled={busy}>
        {busy ? "Opening…" : "Open the bench"}
      </button>
    </div>
  );
}
