// Benchmark: the gradebook route for 1,000 students × 20 labs × 2 attempts, against the same SQL alone
// in the same run. Seeds a scratch database in the project's local PostgreSQL, builds the app if its
// sources changed, serves it on a spare port, signs in as the instructor and calls
// GET /api/courses/{courseId}/gradebook repeatedly. Goal (issue 12): p50 under 150 ms and no more than
// 3 times the SQL alone. Run: npm run bench:gradebook
// `npm run bench:gradebook -- --explain` seeds the same data and prints EXPLAIN (ANALYZE, BUFFERS) of the
// gradebook statement instead (no build, no server).
// The machine may be shared: the load average is printed beside the figures, and the ratio (route over
// SQL alone, measured in the same run) is the figure to compare between runs on a loaded machine, with
// the CPU time per call of PostgreSQL (for the SQL alone) and of the app's server process (for the route).
// "SQL alone" is the very statement the route runs (db/queries/gradebook.ts), which returns the JSON
// document as text; the route adds the sign-in check, the compression and the transfer.
// The client asks for the encodings a browser asks for (Accept-Encoding "gzip, deflate, br, zstd", as
// chromium sends), so the route's time includes compressing what a browser gets: Next.js gzips the JSON at
// zlib's default level (it offers only gzip and deflate, and drops a Content-Encoding set by a route
// handler, so a route cannot answer brotli itself). The figure is taken when the whole body is read and
// decoded.
import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import { chromium } from "playwright-core";
import { hash } from "@node-rs/argon2";
import { sql } from "kysely";
import pg from "pg";
import { createDb } from "../db";
import { gradebookJsonQuery } from "../db/queries/gradebook";
import { migrateToLatest } from "../db/migrator";
import { appEnv } from "../scripts/lib/app-env";
import { buildIfStale } from "../scripts/lib/build";
import { databaseUrl, serviceConfig } from "../scripts/lib/config";
import { ensurePostgres, recreateDatabase } from "../scripts/lib/postgres";
import { portInUse, startNext, waitForHttp } from "../scripts/lib/server";

const STUDENTS = 1000;
const LABS = 20;
const ATTEMPTS = 2;
const QUESTIONS = 5;
const WARMUP = 5;
const RUNS = 40;
const DB_NAME = "shuntwise_bench_gradebook";
const PASSWORD = "bench-gradebook-1";
const EMAIL = "instructor@bench.example";

/** Linux's USER_HZ, the unit of the CPU times in /proc/<pid>/stat. */
const CLOCK_TICKS = 100;
/** What chromium asks for. */
const BROWSER_ACCEPT_ENCODING = "gzip, deflate, br, zstd";

/** CPU time (user + system, ms) a process has used so far, from /proc (the local machine). */
function cpuMsOf(pid: number): number {
  const f = fs.readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
  return ((Number(f[11]) + Number(f[12])) * 1000) / CLOCK_TICKS;
}

/** The process and every process below it (the app server may run in a child of the one started). */
function processTree(root: number): number[] {
  const children = new Map<number, number[]>();
  for (const d of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(d)) continue;
    try {
      const ppid = Number(fs.readFileSync(`/proc/${d}/stat`, "utf8").split(") ")[1].split(" ")[1]);
      children.set(ppid, [...(children.get(ppid) ?? []), Number(d)]);
    } catch {
      // the process ended meanwhile
    }
  }
  const out = [root];
  for (let i = 0; i < out.length; i++) out.push(...(children.get(out[i]) ?? []));
  return out;
}

/** One raw request: the bytes sent on the wire and their Content-Encoding. */
function wireSize(url: string, headers: Record<string, string>): Promise<{ bytes: number; encoding: string }> {
  return new Promise((resolve, reject) => {
    http
      .get(url, { headers }, (res) => {
        let bytes = 0;
        res.on("data", (c: Buffer) => (bytes += c.length));
        res.on("end", () => resolve({ bytes, encoding: String(res.headers["content-encoding"] ?? "identity") }));
        res.on("error", reject);
      })
      .on("error", reject);
  });
}

const cfg = serviceConfig("dev");
const port = Number(process.env.SHUNTWISE_BENCH_PORT ?? cfg.appPort + 7);

function p50(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}


/** One course, its instructor, 1,000 students in 8 sections, 20 published labs, 2 graded attempts each. */
async function seed(url: string): Promise<string> {
  const db = createDb(url, 2);
  try {
    await migrateToLatest(db);
    const course = await db
      .insertInto("courses")
      .values({ code: "BENCH-1", title: "Bench course", term: "T", institution: "Bench college", join_code: "BENCH" })
      .returning("id")
      .executeTakeFirstOrThrow();
    const instructor = await db.insertInto("users").values({ email: EMAIL, name: "Bench Instructor", password_hash: await hash(PASSWORD) }).returning("id").executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ course_id: course.id, user_id: instructor.id, role: "instructor" }).execute();
    const questions = JSON.stringify(Array.from({ length: QUESTIONS }, (_, i) => ({ id: `q${i + 1}`, quantity: "indicatedCurrent", kind: "prediction", points: 2 })));
    const results = JSON.stringify({
      results: Array.from({ length: QUESTIONS }, (_, i) => ({ id: `q${i + 1}`, verdict: ["correct", "close", "mistake", "wrong", "correct"][i], ...(i === 2 ? { mistake: "prefix-slip" } : {}) })),
    });
    await sql`
      with u as (
        insert into users (email, name, password_hash)
        select 'student' || g || '@bench.example', 'Student ' || lpad(g::text, 4, '0'), null from generate_series(1, ${STUDENTS}) g
        returning id, email
      )
      insert into memberships (course_id, user_id, role, section)
      select ${course.id}, u.id, 'student', 'S' || (abs(hashtext(u.email)) % 8 + 1) from u`.execute(db);
    await sql`
      insert into labs (course_id, title, template_key, status, spec, questions, policy, counting, due_at, late_penalty_percent_per_day)
      select ${course.id}, 'Lab ' || g, 'shunt-burden', 'published', '{"template":"shunt-burden","parameters":{}}'::jsonb,
        ${questions}::jsonb, '{}'::jsonb, case when g % 2 = 0 then 'best' else 'last' end, now() - (30 - g) * interval '1 day', 10
      from generate_series(1, ${LABS}) g`.execute(db);
    await sql`
      insert into attempts (lab_id, user_id, number, idempotency_key, readings, measured, result, raw_score, max_score,
        late_days, penalty_percent, score, grader_version, lab_version)
      select l.id, m.user_id, n, 'bench-' || n, '{}'::jsonb, '{}'::jsonb, ${results}::jsonb,
        s.raw, 10, s.late, s.late * 10, round((s.raw * (1 - s.late * 0.1))::numeric, 3), 'bench', 1
      from labs l
      join memberships m on m.course_id = l.course_id and m.role = 'student'
      cross join generate_series(1, ${ATTEMPTS}) n
      cross join lateral (select (abs(hashtext(m.user_id::text || l.id::text || n)) % 11)::real as raw,
                                 (case when abs(hashtext(l.id::text || m.user_id::text)) % 10 = 0 then 1 else 0 end) as late) s
      where l.course_id = ${course.id}`.execute(db);
    // as autovacuum leaves a settled table (the visibility map lets the gradebook read attempts from its index)
    await sql`vacuum analyze`.execute(db);
    const n = await sql<{ n: number }>`select count(*)::int as n from attempts`.execute(db);
    console.log(`Seeded ${STUDENTS} students × ${LABS} labs × ${ATTEMPTS} attempts (${n.rows[0].n} attempts).`);
    return course.id;
  } finally {
    await db.destroy();
  }
}

async function signIn(base: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair.indexOf("=");
      jar.set(pair.slice(0, i), pair.slice(i + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrf = await fetch(`${base}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie() },
    body: new URLSearchParams({ csrfToken, email: EMAIL, password: PASSWORD, json: "true" }).toString(),
  });
  keep(res);
  if (![...jar.keys()].some((k) => k.endsWith("next-auth.session-token"))) throw new Error("could not sign in as the bench instructor");
  return cookie();
}

const load = () => `load average ${os.loadavg().map((x) => x.toFixed(2)).join(", ")} on ${os.cpus().length} cores`;

/** `--keep` leaves the scratch database for psql (dropped by the next run). */
async function dropScratch() {
  if (process.argv.includes("--keep")) return console.log(`Kept the database ${DB_NAME}.`);
  const admin = new pg.Client({ connectionString: databaseUrl(cfg, "postgres") });
  await admin.connect();
  await admin.query(`drop database if exists "${DB_NAME}" with (force)`).catch(() => undefined);
  await admin.end();
}

/** Prints the plan of the gradebook statement over the seeded data. */
async function explain(url: string, courseId: string) {
  const db = createDb(url, 1);
  try {
    const q = gradebookJsonQuery(courseId).compile(db);
    await sql`select 1`.execute(db); // warm the connection and the catalogue
    const plan = await db.executeQuery<{ "QUERY PLAN": string }>({ ...q, sql: `explain (analyze, buffers) ${q.sql}` });
    console.log(plan.rows.map((r) => r["QUERY PLAN"]).join("\n"));
    console.log(load());
  } finally {
    await db.destroy();
  }
}

/**
 * `--browser`: chromium opens the gradebook page of the 1,000 students and scrolls it to the bottom with
 * the mouse wheel; prints the time until the table shows every student, the time to bring the last
 * student's row into view, and the longest gap between two animation frames while scrolling.
 */
async function scrollInBrowser(base: string, courseId: string) {
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: ["--headless", "--no-sandbox", "--disable-gpu"] });
  try {
    const page = await (await browser.newContext({ baseURL: base, viewport: { width: 1400, height: 900 } })).newPage();
    await page.goto("/signin");
    await page.getByLabel("E-mail").fill(EMAIL);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((u) => !u.pathname.startsWith("/signin"), { timeout: 60_000 });
    let t0 = performance.now();
    await page.goto(`/courses/${courseId}/gradebook`, { waitUntil: "domcontentloaded", timeout: 120_000 });
    await page.getByText(`${STUDENTS} of ${STUDENTS} students`, { exact: true }).waitFor({ timeout: 120_000 });
    const shown = performance.now() - t0;
    const scroller = page.getByTestId("gradebook-scroller");
    await scroller.hover();
    // a string, not a function: tsx would add helpers to a function that the page does not have
    await page.evaluate(`(() => {
      window.gaps = [];
      let last = performance.now();
      const tick = (t) => { window.gaps.push(t - last); last = t; requestAnimationFrame(tick); };
      requestAnimationFrame(tick);
    })()`);
    t0 = performance.now();
    const last = page.getByRole("link", { name: `Student ${STUDENTS}`, exact: true });
    for (let i = 0; i < 400 && !(await last.isVisible()); i++) await page.mouse.wheel(0, 1500);
    await last.waitFor({ state: "visible", timeout: 60_000 });
    const scrolled = performance.now() - t0;
    const gaps = (await page.evaluate("window.gaps.slice(1)")) as number[];
    const rows = await scroller.locator("tbody tr[data-student]").count();
    console.log(
      `browser: table of ${STUDENTS} students shown ${shown.toFixed(0)} ms after opening the page; last row in view after ${scrolled.toFixed(0)} ms of wheel scrolling; ` +
        `longest frame ${Math.max(...gaps).toFixed(0)} ms, frames p50 ${p50(gaps).toFixed(1)} ms; ${rows} rows in the page.`,
    );
  } finally {
    await browser.close();
  }
}

async function main() {
  await ensurePostgres(cfg);
  await recreateDatabase(cfg, DB_NAME);
  const url = databaseUrl(cfg, DB_NAME);
  const courseId = await seed(url);
  if (process.argv.includes("--explain")) {
    try {
      await explain(url, courseId);
    } finally {
      await dropScratch();
    }
    return;
  }

  const env = appEnv(cfg, url);
  env.DATABASE_URL = url;
  const dist = process.env.SHUNTWISE_BENCH_DIST ?? ".next";
  await buildIfStale(dist, env);
  if (await portInUse(port)) throw new Error(`Port ${port} is in use; set SHUNTWISE_BENCH_PORT to a free port.`);
  const server = startNext({ distDir: dist, port, host: "127.0.0.1", env: { ...env, PORT: String(port), NEXTAUTH_URL: `http://127.0.0.1:${port}` }, quiet: true });
  const db = createDb(url, 4);
  try {
    const base = `http://127.0.0.1:${port}`;
    await waitForHttp(`${base}/api/health`, server);
    const cookie = await signIn(base);
    const loadBefore = load();
    const route: number[] = [];
    const alone: number[] = [];
    let bytes = 0;
    let cpuMs = 0;
    // Route and SQL alone alternate, call by call, so that a change of load on a shared machine weighs on
    // both alike; the SQL runs on one connection whose server process's CPU time is read from /proc
    // (the local cluster), a figure the load barely changes.
    const appPids = processTree(server.pid!);
    const appCpu = () => appPids.reduce((t, p) => t + cpuMsOf(p), 0);
    let appCpuMs = 0;
    const headers = { cookie, "accept-encoding": BROWSER_ACCEPT_ENCODING };
    await db.connection().execute(async (conn) => {
      const pid = (await sql<{ pid: number }>`select pg_backend_pid() as pid`.execute(conn)).rows[0].pid;
      const cpu = () => cpuMsOf(pid);
      for (let i = 0; i < WARMUP + RUNS; i++) {
        const a0 = appCpu();
        let t0 = performance.now();
        const res = await fetch(`${base}/api/courses/${courseId}/gradebook`, { headers });
        const body = await res.text();
        const routeMs = performance.now() - t0;
        if (i >= WARMUP) appCpuMs += appCpu() - a0;
        if (res.status !== 200) throw new Error(`gradebook answered ${res.status}: ${body.slice(0, 200)}`);
        if (i === 0) {
          const g = JSON.parse(body) as { labs: unknown[]; students: unknown[] };
          if (g.labs.length !== LABS || g.students.length !== STUDENTS) throw new Error("the gradebook does not have the seeded size");
        }
        bytes = body.length;
        const c0 = cpu();
        t0 = performance.now();
        const r = await gradebookJsonQuery(courseId).execute(conn);
        const sqlMs = performance.now() - t0;
        if (r.rows[0].doc.length !== bytes) throw new Error("the SQL alone returned a different document");
        if (i >= WARMUP) {
          cpuMs += cpu() - c0;
          route.push(routeMs);
          alone.push(sqlMs);
        }
      }
    });
    const a = p50(route);
    const b = p50(alone);
    const wire = await wireSize(`${base}/api/courses/${courseId}/gradebook`, headers);
    console.log(
      `${RUNS} calls each (route and SQL alone alternating) after ${WARMUP} warm-up calls; response ${(bytes / 1e6).toFixed(2)} MB, ` +
        `${(wire.bytes / 1e6).toFixed(2)} MB on the wire (${wire.encoding}).`,
    );
    console.log(
      `route min/max ${Math.min(...route).toFixed(1)}/${Math.max(...route).toFixed(1)} ms; sql min/max ${Math.min(...alone).toFixed(1)}/${Math.max(...alone).toFixed(1)} ms; ` +
        `PostgreSQL CPU per SQL call ${(cpuMs / RUNS).toFixed(1)} ms; app server CPU per route call ${(appCpuMs / RUNS).toFixed(1)} ms.`,
    );
    if (process.argv.includes("--browser")) await scrollInBrowser(base, courseId);
    console.log(`Machine: ${load()} (before the runs: ${loadBefore}).`);
    console.log(`gradebook p50 ${a.toFixed(1)} ms; sql alone p50 ${b.toFixed(1)} ms; ratio ${(a / b).toFixed(2)}`);
  } finally {
    await db.destroy();
    server.kill("SIGTERM");
    await dropScratch();
  }
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
