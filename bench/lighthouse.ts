// Benchmark: Lighthouse 12 (its default mobile profile: a mid-range phone, simulated slow 4G and a 4×
// slower CPU) on a lesson page and a lab page of the demo, signed in as the demo student, against the
// production build served on a scratch database seeded with the demo. Prints the performance score, the
// total blocking time and largest contentful paint, the compressed JavaScript the page loads, and the
// bytes of KaTeX JavaScript among it. Goal (issue 14): a score of at least 95 on both pages, 0 bytes of
// KaTeX JavaScript, a lesson under 150 KB of compressed JavaScript. Chromium is Debian's
// (/usr/bin/chromium, or CHROMIUM_PATH). SHUNTWISE_LIGHTHOUSE_LIST=1 lists each script with its size, the
// main thread's time by kind of work and by script, the other metrics (a layout shift explains a low score
// with little blocking), the long tasks and the size of the page's HTML.
// Run: npm run bench:lighthouse
import * as chromeLauncher from "chrome-launcher";
import lighthouse from "lighthouse";
import { createDb } from "../db";
import { migrateToLatest } from "../db/migrator";
import { seedDemo } from "../scripts/seed/demo";
import { atEnd, benchEnv, build, runBench, scratchDatabase, sessionCookie, startApp } from "./lib";

const DB_NAME = "shuntwise_bench_pages";
const STUDENT = "student.one@larkmoor-tech.example";
const LESSON = "/lessons/burden-voltage";
const RUNS = Number(process.env.SHUNTWISE_LIGHTHOUSE_RUNS ?? 1);
// A string only KaTeX's own code carries (its parse error), so a chunk with it ships KaTeX.
const KATEX_MARK = "KaTeX parse error";
// The units library the grader reads quantities with: its unit table names this prefix set.
const UNITS_MARK = "BTU";

type NetworkItem = { url: string; resourceType?: string; transferSize?: number; resourceSize?: number };

async function measure(port: number, url: string, cookie: string) {
  const result = await lighthouse(url, {
    port,
    output: "json",
    logLevel: "error",
    onlyCategories: ["performance"],
    extraHeaders: { Cookie: cookie },
  });
  if (!result) throw new Error(`lighthouse gave no result for ${url}`);
  const lhr = result.lhr;
  if (lhr.runtimeError) throw new Error(`lighthouse: ${lhr.runtimeError.message}`);
  const items = ((lhr.audits["network-requests"]?.details as { items?: NetworkItem[] } | undefined)?.items ?? []).filter((i) => i.resourceType === "Script");
  let katex = 0;
  let units = 0;
  for (const s of items) {
    const text = await (await fetch(s.url)).text();
    if (text.includes(KATEX_MARK)) katex += s.transferSize ?? 0;
    if (text.includes(UNITS_MARK)) units += s.transferSize ?? 0;
  }
  if (process.env.SHUNTWISE_LIGHTHOUSE_LIST) {
    for (const s of [...items].sort((a, b) => (b.transferSize ?? 0) - (a.transferSize ?? 0))) console.log(`  ${((s.transferSize ?? 0) / 1024).toFixed(1)} KB ${s.url}`);
    // where the main thread's time went (simulated 4× slower CPU): by kind of work, and by script
    const work = (lhr.audits["mainthread-work-breakdown"]?.details as { items?: { groupLabel: string; duration: number }[] } | undefined)?.items ?? [];
    console.log(`  main thread: ${work.map((w) => `${w.groupLabel} ${w.duration.toFixed(0)} ms`).join(", ")}`);
    const boot = (lhr.audits["bootup-time"]?.details as { items?: { url: string; total: number; scripting: number; scriptParseCompile: number }[] } | undefined)?.items ?? [];
    for (const b of boot) console.log(`  ${b.total.toFixed(0)} ms (scripting ${b.scripting.toFixed(0)}, parse ${b.scriptParseCompile.toFixed(0)}) ${b.url}`);
    const metric = (id: string) => lhr.audits[id]?.displayValue ?? "?";
    console.log(`  first contentful paint ${metric("first-contentful-paint")}, speed index ${metric("speed-index")}, layout shift ${metric("cumulative-layout-shift")}`);
    const long = (lhr.audits["long-tasks"]?.details as { items?: { url: string; duration: number; startTime: number }[] } | undefined)?.items ?? [];
    console.log(`  long tasks: ${long.map((t) => `${t.duration.toFixed(0)} ms at ${t.startTime.toFixed(0)} (${t.url.replace(/^.*\//, "")})`).join(", ")}`);
    const all = (lhr.audits["network-requests"]?.details as { items?: NetworkItem[] } | undefined)?.items ?? [];
    const doc = all.find((i) => i.resourceType === "Document");
    if (doc) console.log(`  page HTML: ${((doc.transferSize ?? 0) / 1024).toFixed(1)} KB compressed, ${((doc.resourceSize ?? 0) / 1024).toFixed(1)} KB`);
  }
  return {
    score: Math.round((lhr.categories.performance.score ?? 0) * 100),
    tbt: lhr.audits["total-blocking-time"].numericValue ?? NaN,
    lcp: lhr.audits["largest-contentful-paint"].numericValue ?? NaN,
    js: items.reduce((n, i) => n + (i.transferSize ?? 0), 0),
    scripts: items.length,
    katex,
    units,
  };
}

runBench(async () => {
  const url = await scratchDatabase(DB_NAME);
  const db = createDb(url, 2);
  atEnd(() => db.destroy());
  await migrateToLatest(db);
  await seedDemo(db, { mailDatabaseUrl: url });
  const env = benchEnv(url);
  await build(env);
  const app = await startApp(env);
  const student = await db.selectFrom("users").select("id").where("email", "=", STUDENT).executeTakeFirstOrThrow();
  const cookie = await sessionCookie(db, student.id, env.NEXTAUTH_SECRET!);

  // the demo student's lab that is open now
  const get = async <T>(path: string) => (await (await fetch(`${app.base}${path}`, { headers: { cookie } })).json()) as T;
  const { courses } = await get<{ courses: { id: string; code: string }[] }>("/api/courses");
  const course = courses.find((c) => c.code === "ELM-214");
  if (!course) throw new Error("the demo course is missing");
  const { labs } = await get<{ labs: { id: string; opensAt: string | null; closesAt: string | null }[] }>(`/api/courses/${course.id}/labs`);
  const now = Date.now();
  const lab = labs.find((l) => (!l.opensAt || Date.parse(l.opensAt) <= now) && (!l.closesAt || Date.parse(l.closesAt) > now));
  if (!lab) throw new Error("the demo has no open lab");
  for (const path of [LESSON, `/labs/${lab.id}`]) {
    const res = await fetch(`${app.base}${path}`, { headers: { cookie } });
    if (res.status !== 200) throw new Error(`${path} answered ${res.status}`);
  }

  const chrome = await chromeLauncher.launch({
    chromePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    chromeFlags: ["--headless=new", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update"],
  });
  atEnd(() => chrome.kill());

  const pages = [
    { name: "lesson page", path: LESSON },
    { name: "lab page", path: `/labs/${lab.id}` },
  ];
  for (const p of pages) {
    const runs = [];
    for (let i = 0; i < RUNS; i++) {
      // Lighthouse sometimes loses the trace on a busy machine (NO_NAVSTART): such a run is tried again, twice at most
      for (let tries = 1; ; tries++) {
        try {
          runs.push(await measure(chrome.port, `${app.base}${p.path}`, cookie));
          break;
        } catch (e) {
          if (tries >= 3) throw e;
          console.log(`  ${p.name}: ${(e as Error).message}; trying again`);
        }
      }
    }
    runs.sort((a, b) => a.score - b.score);
    const m = runs[Math.floor((runs.length - 1) / 2)]; // the median run by score
    const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
    const line =
      `${p.name} (${p.path.replace(lab.id, "{labId}")}): performance ${m.score} (mobile), total blocking time ${m.tbt.toFixed(0)} ms, ` +
      `largest contentful paint ${(m.lcp / 1000).toFixed(2)} s; ${kb(m.js)} of compressed JavaScript in ${m.scripts} files, ` +
      `KaTeX JavaScript ${m.katex} bytes, units library ${kb(m.units)}`;
    console.log(line);
  }
});
