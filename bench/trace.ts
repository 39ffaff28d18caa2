// Benchmark: analyse a 1,000,000-row logged current trace from a file stream. Baseline in the same run:
// streaming the same file through papaparse and summing the current column, nothing else.
// Goal (issue 5): under 2 s and 300 MB peak on the 2-core development machine.
// Run: npx tsx bench/trace.ts  (npm run bench:trace)
import { createReadStream, createWriteStream, mkdtempSync, rmSync, statSync } from "node:fs";
import { once } from "node:events";
import { tmpdir } from "node:os";
import path from "node:path";
import Papa from "papaparse";
import { analyzeTrace } from "../lib/trace/index";
import { squareWaveRows, type SquareWaveSpec } from "../lib/trace/generate";

// 1000 wakes of 5 ms at 20 mA every 100 ms, sleep 2 µA, one sample every 100 µs: 1,000,001 rows.
const SPEC: SquareWaveSpec = {
  sleepCurrent: 2e-6,
  activeCurrent: 20e-3,
  activeTime: 0.005,
  period: 0.1,
  cycles: 1000,
  sampleInterval: 1e-4,
  // seconds and amperes make the longest numbers ("0.0123,0.000002"), the harder case for the parser
  units: { time: "s", current: "A" },
};
const EXPECTED_AVERAGE = (SPEC.activeTime / SPEC.period) * SPEC.activeCurrent + (1 - SPEC.activeTime / SPEC.period) * SPEC.sleepCurrent;

async function writeTrace(file: string): Promise<void> {
  const out = createWriteStream(file);
  let batch: string[] = [];
  for (const line of squareWaveRows(SPEC)) {
    batch.push(line);
    if (batch.length === 10_000) {
      if (!out.write(batch.join("\n") + "\n")) await once(out, "drain");
      batch = [];
    }
  }
  out.end(batch.join("\n") + "\n");
  await once(out, "finish");
}

const MB = 1024 * 1024;

/** Runs fn while sampling memory every 5 ms; returns seconds and the peaks in MB. */
async function measure<T>(fn: () => Promise<T>): Promise<{ value: T; seconds: number; rss: number; heap: number; buffers: number }> {
  let rss = 0;
  let heap = 0;
  let buffers = 0;
  const sample = () => {
    const m = process.memoryUsage();
    rss = Math.max(rss, m.rss);
    heap = Math.max(heap, m.heapUsed);
    buffers = Math.max(buffers, m.arrayBuffers);
  };
  sample();
  const timer = setInterval(sample, 5);
  const start = performance.now();
  const value = await fn();
  const seconds = (performance.now() - start) / 1000;
  sample();
  clearInterval(timer);
  return { value, seconds, rss: rss / MB, heap: heap / MB, buffers: buffers / MB };
}

function baseline(file: string): Promise<number> {
  return new Promise((resolve, reject) => {
    let sum = 0;
    Papa.parse<string[]>(createReadStream(file), {
      chunk: (results) => {
        for (const row of results.data) sum += Number(row[1]) || 0;
      },
      complete: () => resolve(sum),
      error: (err: Error) => reject(err),
    });
  });
}

const dir = mkdtempSync(path.join(tmpdir(), "shuntwise-trace-bench-"));
const file = path.join(dir, "trace.csv");
try {
  await writeTrace(file);
  console.log(`trace: ${SPEC.cycles * Math.round(SPEC.period / SPEC.sampleInterval) + 1} rows, ${(statSync(file).size / MB).toFixed(1)} MB`);
  console.log(`rss before: ${(process.memoryUsage().rss / MB).toFixed(0)} MB`);

  for (let run = 1; run <= 2; run++) {
    const base = await measure(() => baseline(file));
    const analysis = await measure(() => analyzeTrace(createReadStream(file)));
    const r = analysis.value;
    const error = Math.abs(r.averageCurrent - EXPECTED_AVERAGE) / EXPECTED_AVERAGE;
    console.log(`run ${run} baseline (papaparse stream, sum a column): ${base.seconds.toFixed(3)} s, peak rss ${base.rss.toFixed(0)} MB, peak heap ${base.heap.toFixed(0)} MB`);
    console.log(`run ${run} analyzeTrace: ${analysis.seconds.toFixed(3)} s, peak rss ${analysis.rss.toFixed(0)} MB, peak heap ${analysis.heap.toFixed(0)} MB, peak array buffers ${analysis.buffers.toFixed(0)} MB`);
    console.log(`run ${run} ratio analysis/baseline: ${(analysis.seconds / base.seconds).toFixed(2)}`);
    console.log(
      `run ${run} result: rows ${r.rows}, bad ${r.badRows}, average ${(r.averageCurrent * 1e6).toFixed(3)} uA (relative error ${error.toExponential(1)}), ` +
        `duty ${r.dutyCycle?.toFixed(4)}, wakes ${r.wakes}, charge per wake ${((r.chargePerWake ?? NaN) * 1e6).toFixed(3)} uC, plot ${r.plot.t.length} points`,
    );
  }
  const ok = (s: number, m: number) => (s < 2 && m < 300 ? "met" : "NOT met");
  const final = await measure(() => analyzeTrace(createReadStream(file)));
  console.log(`goal (under 2 s and 300 MB): ${ok(final.seconds, final.rss)} (${final.seconds.toFixed(3)} s, ${final.rss.toFixed(0)} MB)`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
