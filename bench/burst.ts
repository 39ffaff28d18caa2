// Benchmark: a deadline burst. 500 students submit one attempt each, 50 at a time, to the production
// build served against a scratch database with a seeded course; the baseline is GET /api/health at the
// same concurrency, measured in the same run. Then the same burst against two app processes sharing the
// one PostgreSQL (connections dealt round-robin by a small proxy; the one-process run goes through the
// same proxy). Prints errors, attempts lost (2xx answers without exactly one stored attempt, counted in
// the database afterwards), p95, throughput and the ratios. Goal (issue 14): 0 errors, 0 lost, p95
// under 300 ms, at least 25 % of the health route's throughput. Run: npm run bench:burst
import autocannon, { type Request as CannonRequest } from "autocannon";
import { hash } from "@node-rs/argon2";
import { sql } from "kysely";
import { createDb } from "../db";
import { migrateToLatest } from "../db/migrator";
import { atEnd, benchEnv, build, cpuMsOfTree, percentile, postmasterPid, roundRobin, runBench, scratchDatabase, sessionCookie, startApp, stopChild, type App } from "./lib";

const STUDENTS = 500;
const CONCURRENCY = 50;
const HEALTH_SECONDS = 8;
const DB_NAME = "shuntwise_bench_burst";

type Db = ReturnType<typeof createDb>;

async function seed(db: Db): Promise<{ courseId: string; instructorId: string; students: string[] }> {
  await migrateToLatest(db);
  const course = await db
    .insertInto("courses")
    .values({ code: "BURST-1", title: "Burst course", term: "T", institution: "Bench college", join_code: "BURST" })
    .returning("id")
    .executeTakeFirstOrThrow();
  const instructor = await db
    .insertInto("users")
    .values({ email: "instructor@burst.example", name: "Burst Instructor", password_hash: await hash("bench-burst-1") })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db.insertInto("memberships").values({ course_id: course.id, user_id: instructor.id, role: "instructor" }).execute();
  const students = await sql<{ id: string }>`
    with u as (
      insert into users (email, name, password_hash)
      select 'student' || g || '@burst.example', 'Student ' || lpad(g::text, 4, '0'), null from generate_series(1, ${STUDENTS}) g
      returning id
    )
    insert into memberships (course_id, user_id, role, section) select ${course.id}, u.id, 'student', 'A' from u returning user_id as id`.execute(db);
  return { courseId: course.id, instructorId: instructor.id, students: students.rows.map((r) => r.id) };
}

/** A published lab on a fixed circuit (5 V, 470 Ω, 10 Ω): the answers below are Ohm's law by hand. */
async function createLab(app: App, instructorCookie: string, courseId: string, title: string): Promise<string> {
  const headers = { "content-type": "application/json", origin: app.base, cookie: instructorCookie };
  const res = await fetch(`${app.base}/api/courses/${courseId}/labs`, {
    method: "POST",
    headers,
    body: JSON.stringify({
      title,
      templateKey: "shunt-burden",
      spec: { template: "shunt-burden", parameters: { supplyVoltage: { mode: "fixed", value: 5 }, loadResistance: { mode: "fixed", value: 470 }, shuntResistance: { mode: "fixed", value: 10 } } },
      questions: [
        { quantity: "indicatedCurrent", kind: "prediction", points: 2 },
        { quantity: "burdenVoltage", kind: "prediction", points: 2 },
        { quantity: "trueCurrent", kind: "prediction", points: 2 },
      ],
      policy: {},
      attemptsAllowed: 3,
      counting: "best",
      opensAt: null,
      dueAt: new Date(Date.now() + 3600_000).toISOString(),
      latePenaltyPercentPerDay: 10,
      lateFloorPercent: 50,
      showExpected: "after_due",
      instructions: "Measure it.",
      safetyNotes: "Set the supply's current limit first.",
    }),
  });
  if (res.status !== 201) throw new Error(`creating the lab answered ${res.status}: ${await res.text()}`);
  const labId = ((await res.json()) as { lab: { id: string } }).lab.id;
  const pub = await fetch(`${app.base}/api/labs/${labId}`, { method: "PATCH", headers, body: JSON.stringify({ status: "published" }) });
  if (pub.status !== 200) throw new Error(`publishing the lab answered ${pub.status}`);
  return labId;
}

type Run = { ok: number; errors: number; p95: number; perSecond: number; seconds: number; statuses: Record<string, number> };
/** CPU time per request (ms) of the app processes, of PostgreSQL, and of this process (load generator and proxy). */
type Cpu = { app: number; postgres: number; generator: number };
type Outcome = { label: string; run: Run; lost: number; health: number; cpu: Cpu; healthCpu: Cpu };

/** Measures the CPU time that `work` costs each process group, per request (`requests` of them). */
async function withCpu<T>(pids: { apps: number[]; postgres: number }, work: () => Promise<T>, requests: (r: T) => number): Promise<[T, Cpu]> {
  const total = () => ({ app: pids.apps.reduce((sum, pid) => sum + cpuMsOfTree(pid), 0), postgres: cpuMsOfTree(pids.postgres) });
  const before = total();
  const mine = process.cpuUsage();
  const result = await work();
  const after = total();
  const used = process.cpuUsage(mine);
  const n = requests(result);
  return [result, { app: (after.app - before.app) / n, postgres: (after.postgres - before.postgres) / n, generator: (used.user + used.system) / 1000 / n }];
}

const cpuText = (c: Cpu) => `app ${c.app.toFixed(2)} ms, PostgreSQL ${c.postgres.toFixed(2)} ms, load generator and proxy ${c.generator.toFixed(2)} ms`;

/** `count` students (from `first`) each submit once, `CONCURRENCY` at a time, through `base`. */
async function burst(base: string, labId: string, cookies: string[], count: number, tag: string): Promise<Run> {
  // every request is built before the clock starts, so the load generator spends its time sending
  // mixed answers: right, a prefix slip (a wrong unit dimension is refused before grading, so is not used)
  const requests = Array.from({ length: count }, (_, k) => ({
    headers: { "content-type": "application/json", origin: base, cookie: cookies[k % cookies.length] },
    body: JSON.stringify({ idempotencyKey: `${tag}-${k}`, readings: { q1: k % 3 ? "10.42 mA" : "10.42 A", q2: "0.1042 V", q3: "10.6 mA" } }),
  }));
  let i = 0;
  const times: number[] = [];
  const statuses: Record<string, number> = {};
  let lastAnswer = 0;
  const instance = autocannon({
    url: base,
    connections: CONCURRENCY,
    amount: count,
    timeout: 60,
    requests: [
      {
        method: "POST",
        path: `/api/labs/${labId}/attempts`,
        setupRequest: (req: CannonRequest) => ({ ...req, ...requests[i++ % count] }),
      },
    ],
  });
  instance.on("response", (_client: unknown, status: number, _bytes: number, ms: number) => {
    statuses[status] = (statuses[status] ?? 0) + 1;
    times.push(ms);
    lastAnswer = performance.now();
  });
  const t0 = performance.now();
  const result = await instance;
  // autocannon resolves on its next one-second tick after the last answer: the burst ends at that answer
  const seconds = ((lastAnswer || performance.now()) - t0) / 1000;
  const ok = result["2xx"];
  // every request that did not end in a 2xx answer: other statuses, connection errors, time-outs
  return { ok, errors: count - ok, p95: percentile(times, 95), perSecond: count / seconds, seconds, statuses };
}

async function health(base: string): Promise<{ perSecond: number; total: number }> {
  const result = await autocannon({ url: `${base}/api/health`, connections: CONCURRENCY, duration: HEALTH_SECONDS });
  if (result.non2xx || result.errors) throw new Error(`the health route failed ${result.non2xx + result.errors} times`);
  return { perSecond: result.requests.average, total: result["2xx"] };
}

async function stored(db: Db, labId: string): Promise<{ attempts: number; students: number; halfWritten: number }> {
  const r = await sql<{ attempts: number; students: number; half: number }>`
    select count(*)::int as attempts, count(distinct user_id)::int as students,
      count(*) filter (where result is null or score is null)::int as half
    from attempts where lab_id = ${labId}`.execute(db);
  return { attempts: r.rows[0].attempts, students: r.rows[0].students, halfWritten: r.rows[0].half };
}

runBench(async () => {
  const url = await scratchDatabase(DB_NAME);
  const db = createDb(url, 2);
  atEnd(() => db.destroy());
  const { courseId, instructorId, students } = await seed(db);
  const postgres = await postmasterPid(db);
  console.log(`Seeded one course with ${students.length} students.`);

  const env = benchEnv(url);
  await build(env);
  const secret = env.NEXTAUTH_SECRET!;
  const cookies = await Promise.all(students.map((id) => sessionCookie(db, id, secret)));
  const instructorCookie = await sessionCookie(db, instructorId, secret);

  const results: Outcome[] = [];
  for (const processes of [1, 2]) {
    const proxyHolder = await roundRobin();
    const apps: App[] = [];
    for (let p = 0; p < processes; p++) apps.push(await startApp({ ...env, NEXTAUTH_URL: proxyHolder.base, APP_URL: proxyHolder.base }));
    proxyHolder.setBackends(apps.map((a) => a.port));
    const base = proxyHolder.base;
    const labId = await createLab(apps[0], instructorCookie, courseId, `Burst lab ${processes}`);
    const warmLab = await createLab(apps[0], instructorCookie, courseId, `Warm-up lab ${processes}`);
    // warm-up: each process compiles and caches its code paths and fills its connection pool
    await burst(base, warmLab, cookies.slice(0, 100), 100, `warm-${processes}`);
    const pids = { apps: apps.map((a) => a.process.pid!), postgres };
    const [h, healthCpu] = await withCpu(pids, () => health(base), (r) => r.total);
    const [run, cpu] = await withCpu(pids, () => burst(base, labId, cookies, STUDENTS, `burst-${processes}`), () => STUDENTS);
    const s = await stored(db, labId);
    // a 2xx answer whose attempt is not stored exactly once (one attempt per student, each submitted once)
    const lost = Math.max(0, run.ok - s.attempts) + (s.attempts - s.students) + s.halfWritten;
    const label = processes === 1 ? "one app process" : "two app processes";
    console.log(
      `${label}: ${STUDENTS} submissions, ${CONCURRENCY} at a time, in ${run.seconds.toFixed(1)} s; statuses ${JSON.stringify(run.statuses)}; ` +
        `stored ${s.attempts} attempts of ${s.students} students (${s.halfWritten} half-written)`,
    );
    console.log(
      `${label}: errors ${run.errors}, lost ${lost}, p95 ${run.p95.toFixed(0)} ms, throughput ${run.perSecond.toFixed(1)} submissions/s; ` +
        `health ${h.perSecond.toFixed(0)} requests/s; ratio to health ${((100 * run.perSecond) / h.perSecond).toFixed(1)} %`,
    );
    console.log(`${label}: CPU per submission: ${cpuText(cpu)}; per health request: ${cpuText(healthCpu)}`);
    results.push({ label, run, lost, health: h.perSecond, cpu, healthCpu });
    for (const a of apps) await stopChild(a.process);
    await proxyHolder.close();
  }
  const [one, two] = results;
  console.log(
    `burst: errors ${one.run.errors}, lost ${one.lost}, p95 ${one.run.p95.toFixed(0)} ms, ` +
      `${one.run.perSecond.toFixed(1)}/s = ${((100 * one.run.perSecond) / one.health).toFixed(1)} % of health (${one.health.toFixed(0)}/s); ` +
      `two processes ${two.run.perSecond.toFixed(1)}/s, ratio two/one ${(two.run.perSecond / one.run.perSecond).toFixed(2)}`,
  );
});
