// The steps of bench/long-log.ts, each run in its own process (node --conditions=react-server); each
// prints one JSON line of figures last.
import Papa from "papaparse";

const MB = 1024 * 1024;
const mb = (n: number) => Math.round(n / MB);

async function app() {
  const { db } = await import("../db");
  const { requestUpload, completeUpload } = await import("../lib/uploads/direct");
  const course = await db.insertInto("courses").values({ code: "BENCH-26", title: "Long log bench", term: "T1", institution: "Bench college", join_code: `B-${Date.now()}` }).returning("id").executeTakeFirstOrThrow();
  const user = await db.insertInto("users").values({ email: `bench.${course.id.slice(0, 8)}@test.example`, name: "Bench Student", password_hash: null }).returning("id").executeTakeFirstOrThrow();
  const size = Number(process.env.BENCH_SIZE);
  const asked = await requestUpload({ ownerId: user.id, courseId: course.id, labId: null as unknown as string, input: { labId: course.id, name: "hour.csv", size, type: "text/csv" } });
  global.gc?.();
  const before = process.memoryUsage().rss;
  let min = Infinity;
  let max = 0;
  let samples = 0;
  const timer = setInterval(() => {
    const r = process.memoryUsage().rss;
    min = Math.min(min, r);
    max = Math.max(max, r);
    samples++;
  }, 20);
  console.log("@" + JSON.stringify(asked));
  // wait until the parts are sent
  await new Promise<void>((resolve) => process.stdin.once("data", () => resolve()));
  clearInterval(timer);
  await completeUpload({ uploadId: asked.upload.id, ownerId: user.id });
  const after = process.memoryUsage().rss;
  console.log(JSON.stringify({ id: asked.upload.id, rssBefore: mb(before), rssMin: mb(min), rssMax: mb(max), rssAfter: mb(after), samples }));
  await db.destroy();
}

async function job() {
  const { db } = await import("../db");
  const { analyseUpload } = await import("../lib/uploads/analysis");
  const { findUpload } = await import("../db/queries/uploads");
  const id = process.env.BENCH_UPLOAD!;
  let peak = process.memoryUsage().rss;
  const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 5);
  const t0 = performance.now();
  await analyseUpload({ uploadId: id, params: { batteryCapacity: 792, usableFraction: 0.8 } });
  const seconds = (performance.now() - t0) / 1000;
  clearInterval(timer);
  peak = Math.max(peak, process.memoryUsage().rss, process.resourceUsage().maxRSS * 1024);
  const row = await findUpload(db, id);
  if (row?.status !== "ready") throw new Error(`the upload is ${row?.status}`);
  const a = row.analysis as { averageCurrent: number; wakes: number };
  console.log(JSON.stringify({ seconds, peakRss: mb(peak), averageCurrent: a.averageCurrent, wakes: a.wakes }));
  await db.destroy();
}

async function parse() {
  const { db } = await import("../db");
  const { findUpload } = await import("../db/queries/uploads");
  const { getObjectStream } = await import("../lib/uploads/storage");
  const row = (await findUpload(db, process.env.BENCH_UPLOAD!))!;
  await db.destroy();
  const t0 = performance.now();
  const body = await getObjectStream(row.storageKey);
  let rows = 0;
  await new Promise<void>((resolve, reject) => {
    Papa.parse(body as never, { chunk: (r: Papa.ParseResult<string[]>) => void (rows += r.data.length), complete: () => resolve(), error: (e: Error) => reject(e) });
  });
  console.log(JSON.stringify({ seconds: (performance.now() - t0) / 1000, rows }));
}

async function zoom() {
  const { db } = await import("../db");
  const { readWindow } = await import("../lib/uploads/samples");
  const { findUploadSamples } = await import("../db/queries/uploads");
  const times: number[] = [];
  let samples = 0;
  for (let k = 0; k < 20; k++) {
    const from = 100 + k * 170.5;
    const t0 = performance.now();
    const row = (await findUploadSamples(db, process.env.BENCH_UPLOAD!))!;
    const w = await readWindow(row.samples as never, from, from + 1, 1000);
    times.push(performance.now() - t0);
    samples = w.samples;
  }
  await db.destroy();
  times.sort((a, b) => a - b);
  console.log(JSON.stringify({ median: Math.round(times[10] * 10) / 10, max: Math.round(times[19] * 10) / 10, runs: 20, samples }));
}

const steps: Record<string, () => Promise<void>> = { app, job, parse, zoom };
steps[process.argv[2]]().then(
  () => process.exit(0),
  (e) => {
    console.error(e);
    process.exit(1);
  },
);
