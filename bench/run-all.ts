// `npm run bench`: runs every benchmark one after the other (each starts and stops what it needs, on
// free ports and its own scratch database), shows their output as they go, and writes
// bench/RESULTS.md with the machine (CPU count and model, Node.js version), the date and each one's
// figures. A benchmark that fails is reported there too, and the run ends with a failure.
import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

const here = import.meta.dirname;
const BENCHES = [
  { name: "grader", file: "grader.ts", goal: "graded 10-question attempts per second, against a baseline in the same run" },
  { name: "trace", file: "trace.ts", goal: "time and peak memory to analyse a 1,000,000-row trace" },
  { name: "long-log", file: "long-log.ts", goal: "3.6 million rows from completed upload to stored results under 5 s, job peak under 300 MB, at most 2× the CSV parser alone; 1-second zoom under 100 ms; app memory flat during an upload" },
  { name: "gradebook", file: "gradebook.ts", goal: "gradebook route p50 under 150 ms and at most 3× its SQL alone" },
  { name: "burst", file: "burst.ts", goal: "0 errors, 0 lost, p95 under 300 ms, at least 25 % of the health route's throughput; two processes: ratio printed" },
  { name: "lighthouse", file: "lighthouse.ts", goal: "performance ≥ 95 on both pages (mobile), 0 bytes of KaTeX JavaScript, a lesson under 150 KB of compressed JavaScript" },
];

function run(file: string): Promise<{ code: number | null; out: string; seconds: number }> {
  const t0 = Date.now();
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [path.join(here, "..", "node_modules/tsx/dist/cli.mjs"), path.join(here, file)], {
      stdio: ["ignore", "pipe", "pipe"],
      env: process.env,
    });
    let out = "";
    child.stdout.on("data", (d: Buffer) => {
      out += d;
      process.stdout.write(d);
    });
    child.stderr.on("data", (d: Buffer) => {
      out += d;
      process.stderr.write(d);
    });
    const stop = () => child.kill("SIGTERM");
    process.once("SIGINT", stop);
    process.once("SIGTERM", stop);
    child.on("exit", (code) => {
      process.off("SIGINT", stop);
      process.off("SIGTERM", stop);
      resolve({ code, out, seconds: (Date.now() - t0) / 1000 });
    });
  });
}

const only = process.argv.slice(2);
const cpus = os.cpus();
const lines = [
  "# Benchmark results",
  "",
  `Written by \`npm run bench\` on ${new Date().toISOString()}.`,
  "",
  `Machine: ${cpus.length} CPUs (${cpus[0]?.model.trim() ?? "unknown model"}), ${(os.totalmem() / 2 ** 30).toFixed(1)} GB of memory, ` +
    `Node.js ${process.version}, ${os.platform()} ${os.release()}; load average at the start ${os.loadavg().map((l) => l.toFixed(2)).join(", ")}.`,
  "",
];
let failed = 0;
for (const b of BENCHES.filter((x) => only.length === 0 || only.includes(x.name))) {
  console.log(`\n=== ${b.name} (bench/${b.file})`);
  const r = await run(b.file);
  if (r.code !== 0) failed++;
  // the figures: the output without blank lines and without the build's own messages
  const shown = r.out
    .split("\n")
    .filter((l) => l.trim() && !/^\s*(▲|✓|○|ƒ|├|└|┌|│|Route|Creating an optimized|Compiled|Collecting|Generating|Finalizing|Skipping|Linting|Running TypeScript|Building the app)/.test(l))
    .join("\n");
  lines.push(`## ${b.name} (\`bench/${b.file}\`, ${r.seconds.toFixed(0)} s)`, "", `Goal: ${b.goal}.`, "", "```", shown || "(no output)", "```", "");
  if (r.code !== 0) lines.push(`**Failed** (exit code ${r.code}).`, "");
}
fs.writeFileSync(path.join(here, "RESULTS.md"), lines.join("\n"));
console.log(`\nWrote bench/RESULTS.md${failed ? `; ${failed} benchmark(s) failed` : ""}.`);
process.exit(failed ? 1 : 0);
