"use client";
// The simulated bench: the lab's instrument on the student's own circuit, in the browser. The display shows a
// reading DISPLAY_RATE_HZ times a second; every reading is a pure function of the bench's seed, the run (range,
// filter, the moment of the last change) and its index, so the staff's replay (GET …/bench/readings) shows the
// same numbers. Loaded only when the student opens the bench (bench-launcher.tsx).
import { useEffect, useMemo, useRef, useState } from "react";
import type { InstrumentProfile } from "@/lib/instruments/profile";
import { DISPLAY_RATE_HZ, inputResistance, readingRun, simulateReadings, type BenchCircuit, type ReadingRun, type SimReading } from "@/lib/simulation";
import { BenchCircuitDiagram } from "./circuit-diagram";
import { displayText } from "./format";

export interface BenchData {
  seed: string;
  instrument: InstrumentProfile;
  circuit: BenchCircuit;
}

interface Logged extends SimReading {
  run: ReadingRun;
}

const TRACE_RATES = [1, 10, 100, 1000, 10000];
/** The largest trace the replay route answers in one request. */
const MAX_TRACE = 10_000;

/** Seconds since the bench was opened, to the millisecond. */
function useBenchClock() {
  const start = useRef<number | null>(null);
  return () => {
    const now = performance.now();
    if (start.current === null) start.current = now;
    return Math.round(now - start.current) / 1000;
  };
}

export function SimulatedBench({ bench, compact = false, title = "Simulated bench" }: { bench: BenchData; compact?: boolean; title?: string }) {
  const { instrument, circuit, seed } = bench;
  const clock = useBenchClock();
  const hasFilter = instrument.ranges.some((r) => r.filterCutoffHz);
  const [range, setRange] = useState<string>(instrument.autoRange ? "auto" : instrument.ranges[instrument.ranges.length - 1].key);
  const [filter, setFilter] = useState(true);
  const [run, setRun] = useState<ReadingRun>(() => ({ range, filter, from: 0, count: 1 }));
  const [shown, setShown] = useState<SimReading | null>(null);
  const [log, setLog] = useState<Logged[]>([]);
  const [announce, setAnnounce] = useState("");
  const [traceRate, setTraceRate] = useState(100);
  const [traceSeconds, setTraceSeconds] = useState(10);
  const [trace, setTrace] = useState<{ href: string; name: string; samples: number; overloads: number } | null>(null);

  // a change of range or filter starts a new run at this moment on the bench's clock
  function change(next: { range?: string; filter?: boolean }) {
    const r = next.range ?? range;
    const f = next.filter ?? filter;
    setRange(r);
    setFilter(f);
    setRun({ range: r, filter: f, from: clock(), count: 1 });
  }

  // the live display: the run's readings, one every 1/DISPLAY_RATE_HZ s from its start
  useEffect(() => {
    const stepper = readingRun(seed, instrument, circuit, run);
    let index = -1;
    let last: SimReading | null = null;
    const tick = () => {
      const due = Math.floor((clock() - run.from) * DISPLAY_RATE_HZ + 1e-9);
      while (index < due) {
        last = stepper.next();
        index++;
      }
      if (last) setShown(last);
    };
    tick();
    const id = window.setInterval(tick, 1000 / (4 * DISPLAY_RATE_HZ));
    return () => window.clearInterval(id);
    // clock is stable for the bench's life
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [seed, instrument, circuit, run]);

  const shownRange = instrument.ranges.find((r) => r.key === (shown?.range ?? run.range)) ?? instrument.ranges[0];
  const text = shown ? displayText(shown.value, shownRange) : { digits: "----", unit: "" };
  const meterOhms = inputResistance(instrument, shownRange);

  function logReading() {
    if (!shown) return;
    const entry = { ...shown, run };
    setLog((l) => [...l, entry]);
    setAnnounce(`Logged ${text.digits} ${text.unit} at ${shown.t.toFixed(2)} s.`);
  }

  const traceCount = Math.min(MAX_TRACE, Math.max(2, Math.round(traceRate * traceSeconds)));
  function recordTrace() {
    const from = clock();
    const readings = simulateReadings(seed, instrument, circuit, { range, filter, from, count: traceCount, rate: traceRate });
    const rows = readings.filter((r) => r.value !== null).map((r) => `${(r.t - from).toFixed(6)},${(r.value as number).toExponential(6)}`);
    const csv = `time (s),current (A)\n${rows.join("\n")}\n`;
    if (trace) URL.revokeObjectURL(trace.href);
    const name = `simulated-trace-${from.toFixed(3)}s-${range}-${traceRate}Hz.csv`;
    setTrace({ href: URL.createObjectURL(new Blob([csv], { type: "text/csv" })), name, samples: rows.length, overloads: readings.length - rows.length });
    setAnnounce(`Recorded ${rows.length} samples at ${traceRate} per second.`);
  }
  useEffect(() => () => (trace ? URL.revokeObjectURL(trace.href) : undefined), [trace]);

  const rangeOptions = useMemo(
    () => [...(instrument.autoRange ? [{ key: "auto", label: "Auto" }] : []), ...instrument.ranges.map((r) => ({ key: r.key, label: r.label }))],
    [instrument],
  );

  return (
    <section className="card" aria-label={title} data-testid="simulated-bench" data-seed={seed}>
      <h2 className={compact ? "text-lg" : "text-xl"}>{title}</h2>
      <p className="mt-1 text-sm text-ink-soft">
        {instrument.name} on {compact ? "an example circuit" : "your own circuit"}. Each range puts its own resistance in series, so the current depends on the range you
        choose.
      </p>
      <div className="mt-3 grid gap-4 md:grid-cols-2">
        <BenchCircuitDiagram circuit={circuit} meterOhms={meterOhms} rangeLabel={shownRange.label} />
        <div>
          <div className="rounded-md border border-ink/20 bg-paper-sunk p-3" data-testid="bench-display"
            data-t={shown?.t}
            data-value={shown === null ? "" : shown.value === null ? "OL" : shown.value}
            data-range={shown?.range}
            data-run-range={run.range}
            data-run-filter={run.filter ? "on" : "off"}
            data-run-from={run.from}
          >
            <p className="font-mono text-4xl tabular-nums" aria-hidden="true">
              {text.digits} <span className="text-xl">{text.unit}</span>
            </p>
            <p className="mt-1 text-xs text-ink-soft">
              {run.range === "auto" ? "Auto · " : ""}
              {shownRange.label} range{hasFilter ? (filter ? " · filter on" : " · filter off") : ""} · t = {shown ? shown.t.toFixed(2) : "0.00"} s
            </p>
          </div>
          <fieldset className="mt-3">
            <legend className="field-label">Range</legend>
            <div className="flex flex-wrap gap-2">
              {rangeOptions.map((o) => (
                <label key={o.key} className={`btn-quiet cursor-pointer ${range === o.key ? "border-copper ring-2 ring-copper/40" : ""}`}>
                  <input type="radio" name={`bench-range-${seed}`} value={o.key} checked={range === o.key} onChange={() => change({ range: o.key })} className="sr-only" />
                  {o.label}
                </label>
              ))}
            </div>
          </fieldset>
          {hasFilter ? (
            <label className="mt-3 flex items-center gap-2 text-sm">
              <input type="checkbox" checked={filter} onChange={(e) => change({ filter: e.target.checked })} />
              Low-pass filter ({shownRange.filterCutoffHz ?? "none"} Hz): less noise and hum, slower to settle
            </label>
          ) : null}
          <div className="mt-3 flex flex-wrap gap-2">
            <button type="button" className="btn-primary" onClick={logReading} disabled={!shown}>
              Log this reading
            </button>
          </div>
          <p role="status" className="mt-2 text-sm">
            {announce}
          </p>
        </div>
      </div>

      {log.length ? (
        <div className="mt-4 overflow-x-auto">
          <table className="min-w-full text-sm" data-testid="bench-log">
            <caption className="text-left font-semibold">Your logged readings</caption>
            <thead>
              <tr>
                <th className="pr-3 text-left">Time</th>
                <th className="pr-3 text-left">Reading</th>
                <th className="pr-3 text-left">Range</th>
                <th className="text-left">Run (for a replay)</th>
              </tr>
            </thead>
            <tbody>
              {log.map((r, i) => {
                const rr = instrument.ranges.find((x) => x.key === r.range)!;
                const d = displayText(r.value, rr);
                return (
                  <tr key={i}>
                    <td className="pr-3 tabular-nums">{r.t.toFixed(2)} s</td>
                    <td className="pr-3 tabular-nums">
                      {d.digits} {d.unit}
                    </td>
                    <td className="pr-3">{rr.label}</td>
                    <td className="text-xs text-ink-soft">
                      {r.run.range}, filter {r.run.filter ? "on" : "off"}, from {r.run.from.toFixed(3)} s
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}

      {!compact || circuit.burst ? (
        <details className="mt-4">
          <summary className="cursor-pointer font-semibold">Record a trace</summary>
          <p className="mt-1 text-sm text-ink-soft">
            Logs the current at the rate you choose on the range and filter set above. A logger slower than the load&apos;s wakes shows them at the wrong rate (aliasing);
            download the trace and attach it as a trace file.
          </p>
          <div className="mt-2 flex flex-wrap items-end gap-3">
            <label className="text-sm">
              <span className="field-label">Samples per second</span>
              <select className="field-input" value={traceRate} onChange={(e) => setTraceRate(Number(e.target.value))}>
                {TRACE_RATES.map((r) => (
                  <option key={r} value={r}>
                    {r}
                  </option>
                ))}
              </select>
            </label>
            <label className="text-sm">
              <span className="field-label">Seconds</span>
              <select className="field-input" value={traceSeconds} onChange={(e) => setTraceSeconds(Number(e.target.value))}>
                {[1, 10, 60, 600].map((s) => (
                  <option key={s} value={s}>
                    {s}
                  </option>
                ))}
              </select>
            </label>
            <button type="button" className="btn-quiet" onClick={recordTrace}>
              Record {traceCount.toLocaleString("en")} samples
            </button>
          </div>
          {trace ? (
            <p className="mt-2 text-sm">
              <a href={trace.href} download={trace.name} data-testid="bench-trace">
                Download the trace ({trace.samples.toLocaleString("en")} samples{trace.overloads ? `, ${trace.overloads} overloads left out` : ""})
              </a>
            </p>
          ) : null}
        </details>
      ) : null}
    </section>
  );
}
