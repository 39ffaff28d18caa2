// Benchmark (issue 26): an hour-long log of a sleeping node (3,600,001 rows at 1 kS/s, about 64 MB of
// CSV) sent in parts straight to the object-store stand-in, then analysed by the upload-analysis job.
// Figures, each step in a process of its own (node --conditions=react-server --import tsx, as the server resolves server-only):
// - job: from a completed upload to stored results (stream → SHA-256 → CSV parser → lib/trace analysis
//   → compact samples → one UPDATE), its time and its process's peak RSS; goal < 5 s and < 300 MB;
// - baseline in the same run: streaming the same object through papaparse alone; goal job ≤ 2× it;
// - zoom: one second of the log at full resolution read from the compact samples (what
//   GET /api/uploads/{id}/trace does after its one query), 20 times; goal < 100 ms;
// - the app's memory while the browser's stand-in (this process) sends the 64 MB in parts: the app process
//   (which asked for the upload and completes it) sampled every 20 ms; goal: flat (no growth with the file).
// Its own scratch database in the local PostgreSQL and its own stand-in on free ports; everything stopped
// at the end. Run: npm run bench:long-log
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { once } from "node:events";
import { createDb } from "../db";
import { migrateToLatest } from "../db/migrator";
import { atEnd, cfg, runBench, scratchDatabase } from "./lib";
import { freePort } from "../scripts/lib/processes";
import { startStandIns } from "../scripts/lib/standins";

const here = import.meta.dirname;
const ROWS = 3_600_001;

function step(name: string, env: NodeJS.ProcessEnv, input?: (child: ReturnType<typeof spawn>, line: string) => void): Promise<Record<string, unknown>> {
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(here, "long-log-steps.ts"), name], {
    stdio: ["pipe", "pipe", "inherit"],
    env,
  });
  atEnd(() => {
    if (child.exitCode === null) child.kill("SIGTERM");
  });
  let out = "";
  child.stdout!.on("data", (d: Buffer) => {
    const text = d.toString();
    out += text;
    for (const line of text.split("\n")) if (line.startsWith("@")) input?.(child, line.slice(1));
  });
  return new Promise((resolve, reject) =>
    child.on("exit", (code) => {
      const last = out.trim().split("\n").filter((l) => l.startsWith("{")).pop();
      if (code !== 0 || !last) reject(new Error(`step ${name} ended with ${code}: ${out.slice(-500)}`));
      else resolve(JSON.parse(last));
    }),
  );
}

async function writeLog(file: string): Promise<number> {
  const out = fs.createWriteStream(file);
  out.write("time_s,current_A\n");
  let text = "";
  for (let k = 0; k < ROWS; k++) {
    const phase = k % 1000;
    text += (k / 1000).toFixed(3) + (phase >= 500 && phase < 510 ? ",0.020000\n" : ",0.000002\n");
    if (k % 50_000 === 49_999) {
      if (!out.write(text)) await once(out, "drain");
      text = "";
    }
  }
  out.end(text);
  await once(out, "finish");
  return fs.statSync(file).size;
}

runBench(async () => {
  const url = await scratchDatabase("shuntwise_bench_long_log");
  const db = createDb(url, 2);
  try {
    await migrateToLatest(db);
  } finally {
    await db.destroy();
  }
  const dataDir = path.join(cfg.dataDir, "bench-long-log");
  const s3Port = await freePort(cfg.s3Port + 17, "127.0.0.1", []);
  const smtpPort = await freePort(cfg.smtpPort + 17, "127.0.0.1", [s3Port]);
  const standIns = await startStandIns({ ...cfg, profile: "test", dataDir, s3Port, smtpPort });
  atEnd(() => standIns.close());
  atEnd(() => fs.rmSync(dataDir, { recursive: true, force: true }));
  const file = path.join(dataDir, "hour.csv");
  const size = await writeLog(file);
  console.log(`log: ${ROWS.toLocaleString("en-GB")} rows, ${(size / 1e6).toFixed(1)} MB`);
  const env = { ...process.env, DATABASE_URL: url, S3_ENDPOINT: standIns.s3Endpoint, NODE_ENV: "production" as const, BENCH_FILE: file, BENCH_SIZE: String(size) };

  // the app asks for the upload, this process sends the parts from the file, then the app completes it
  const upload = await step("app", env, (child, line) => {
    const asked = JSON.parse(line) as { parts: { number: number; url: string }[]; partSize: number };
    void (async () => {
      const bytes = fs.readFileSync(file);
      for (const p of asked.parts) {
        const start = (p.number - 1) * asked.partSize;
        const body = bytes.subarray(start, Math.min(size, start + asked.partSize));
        const res = await fetch(p.url, { method: "PUT", body });
        if (!res.ok) throw new Error(`part ${p.number}: ${res.status}`);
      }
      child.stdin!.write("sent\n");
    })();
  });
  console.log(`app memory while 64 MB went to storage in parts: RSS ${upload.rssBefore} MB before, ${upload.rssMin}–${upload.rssMax} MB during (${upload.samples} samples), ${upload.rssAfter} MB after completing`);

  const job = await step("job", { ...env, BENCH_UPLOAD: String(upload.id) });
  const parse = await step("parse", { ...env, BENCH_UPLOAD: String(upload.id) });
  const zoom = await step("zoom", { ...env, BENCH_UPLOAD: String(upload.id) });
  const ratio = (job.seconds as number) / (parse.seconds as number);
  console.log(`job, completed upload → stored results: ${(job.seconds as number).toFixed(2)} s, peak RSS ${job.peakRss} MB (goal < 5 s, < 300 MB)`);
  console.log(`baseline, the object through papaparse alone: ${(parse.seconds as number).toFixed(2)} s (${parse.rows} rows); job ÷ baseline = ${ratio.toFixed(2)} (goal ≤ 2)`);
  console.log(`zoom, 1 s at full resolution (${zoom.samples} samples): median ${zoom.median} ms, max ${zoom.max} ms over ${zoom.runs} (goal < 100 ms)`);
  console.log(`analysis: average ${(job.averageCurrent as number) * 1e6} µA, ${job.wakes} wakes`);
  const ok = (job.seconds as number) < 5 && (job.peakRss as number) < 300 && ratio <= 2 && (zoom.median as number) < 100;
  console.log(ok ? "long-log: every goal met" : "long-log: a goal was missed (figures above, measured on a shared machine)");
});
