// Reliability drill: PostgreSQL stopped and started again in the middle of a submission burst.
//
// Starts its own PostgreSQL cluster (in <data folder>/drill, on a free port), the storage and mail
// stand-ins and the production build on a free port; seeds one course with STUDENTS students and a
// published lab; signs them in; then CONCURRENCY clients submit SUBMISSIONS attempts in all. Once a
// third of them are stored it stops PostgreSQL (`pg_ctl stop -m fast`), keeps it down OUTAGE_MS, and
// starts it again; the last third is sent only once PostgreSQL is down, so that even a short burst on a
// fast machine meets the outage. A client that gets 503 waits for its Retry-After (at most 1 s here, to keep the
// drill short) and sends the same request again with the same idempotency key, as the app's forms do.
//
// Asserts: every answer was 2xx or 503 with Retry-After (never a 500, never a dropped connection);
// at least one 503 was seen; the app answered again without a restart (same process); every key that
// got a 2xx is stored exactly once, as one attempt with its one "graded" grade event and its one
// queued e-mail (no attempt half-written); every graded e-mail reaches the SMTP stand-in (the job
// workers came back too); the app logged the outage without an uncaught exception or a stack trace.
// Prints its figures and stops everything it started, also on Ctrl-C.
//
// Run: npm run drill:db  (SHUNTWISE_DRILL_STUDENTS, _SUBMISSIONS, _CONCURRENCY, _OUTAGE_MS to change the
// size). `npm test` runs a short one after the other tiers, on the build they used (.next-test).
import { type ChildProcess, spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { hash } from "@node-rs/argon2";
import { sql } from "kysely";
import { createDb } from "../db";
import { insertLab } from "../db/queries/labs";
import { migrateToLatest } from "../db/migrator";
import { appEnv } from "../scripts/lib/app-env";
import { buildIfStale } from "../scripts/lib/build";
import { databaseUrl, serviceConfig, type ServiceConfig } from "../scripts/lib/config";
import { ensurePostgres, ensurePostgresInstalled, recreateDatabase, stopPostgres } from "../scripts/lib/postgres";
import { freePort, stopPids } from "../scripts/lib/processes";
import { startNext, waitForHttp } from "../scripts/lib/server";
import { startStandIns, type StandIns } from "../scripts/lib/standins";

const int = (name: string, fallback: number) => {
  const n = Number(process.env[name]);
  return Number.isInteger(n) && n > 0 ? n : fallback;
};
const STUDENTS = int("SHUNTWISE_DRILL_STUDENTS", 30);
const SUBMISSIONS = int("SHUNTWISE_DRILL_SUBMISSIONS", 240);
const CONCURRENCY = int("SHUNTWISE_DRILL_CONCURRENCY", 20);
const OUTAGE_MS = int("SHUNTWISE_DRILL_OUTAGE_MS", 4000);
const PASSWORD = "drill-password-1";
const DB_NAME = "shuntwise_drill";
const DAY = 24 * 3600 * 1000;

const base = serviceConfig("test");
const dataDir = path.join(base.dataDir, "drill");
const cfg: ServiceConfig = { ...base, profile: "test", dataDir, pgDir: path.join(dataDir, "pg"), databases: [DB_NAME] };

let server: ChildProcess | undefined;
let standIns: StandIns | undefined;
let pgStarted = false;
let cleaning: Promise<void> | undefined;

function cleanUp(): Promise<void> {
  cleaning ??= (async () => {
    if (server?.pid && server.exitCode === null) await stopPids([server.pid]);
    await standIns?.close();
    if (pgStarted) {
      try {
        stopPostgres(cfg);
      } catch (e) {
        console.error((e as Error).message);
      }
    }
  })();
  return cleaning;
}

function check(ok: boolean, what: string, failures: string[]) {
  console.log(`${ok ? "ok  " : "FAIL"} ${what}`);
  if (!ok) failures.push(what);
}

/** pg_ctl stop -m fast, without blocking this process (the clients keep sending meanwhile). */
function stopPostgresAsync(dir: string): Promise<void> {
  const pgctl = path.join(ensurePostgresInstalled(), "pg_ctl");
  const args = ["stop", "-D", dir, "-m", "fast", "-w"];
  const [file, argv] = process.getuid?.() === 0 ? ["runuser", ["-u", "postgres", "--", pgctl, ...args]] : [pgctl, args];
  return new Promise((resolve, reject) => {
    const child = spawn(file, argv, { stdio: "ignore" });
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`pg_ctl stop exited with ${code}`))));
  });
}


/** One course, STUDENTS students and a published shunt-and-burden lab with fixed values and many attempts. */
async function seed(url: string) {
  const db = createDb(url, 2);
  try {
    await migrateToLatest(db);
    const course = await db
      .insertInto("courses")
      .values({ code: "DRILL-1", title: "Drill course", term: "T", institution: "Drill college", join_code: "DRILL" })
      .returning("id")
      .executeTakeFirstOrThrow();
    const instructor = await db.insertInto("users").values({ email: "instructor@drill.example", name: "Drill Instructor", password_hash: null }).returning("id").executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ course_id: course.id, user_id: instructor.id, role: "instructor" }).execute();
    const passwordHash = await hash(PASSWORD);
    const emails: string[] = [];
    for (let i = 0; i < STUDENTS; i++) {
      const email = `student${i}@drill.example`;
      const u = await db.insertInto("users").values({ email, name: `Drill Student ${i + 1}`, password_hash: passwordHash }).returning("id").executeTakeFirstOrThrow();
      await db.insertInto("memberships").values({ course_id: course.id, user_id: u.id, role: "student" }).execute();
      emails.push(email);
    }
    const labId = await insertLab(
      db,
      course.id,
      instructor.id,
      {
        title: "Burden on a fixed circuit",
        templateKey: "shunt-burden",
        spec: {
          template: "shunt-burden",
          parameters: {
            supplyVoltage: { mode: "fixed", value: 3.3 },
            loadResistance: { mode: "fixed", value: 1000 },
            shuntResistance: { mode: "fixed", value: 10 },
          },
        },
        questions: [{ id: "q1", quantity: "trueCurrent", kind: "prediction", points: 2 }],
        policy: { relativeTolerance: 0.01 },
        attemptsAllowed: 1000,
        counting: "best",
        opensAt: new Date(Date.now() - DAY),
        dueAt: new Date(Date.now() + 7 * DAY),
        latePenaltyPercentPerDay: 0,
        lateFloorPercent: 0,
        showExpected: "after_attempt",
        instructions: "",
        safetyNotes: "",
      } as Parameters<typeof insertLab>[3],
      "published",
    );
    return { labId, emails };
  } finally {
    await db.destroy();
  }
}

async function main(): Promise<number> {
  const failures: string[] = [];
  const taken: number[] = [];
  const pick = async (preferred: number) => {
    const p = await freePort(preferred + 50, cfg.appHost, taken);
    taken.push(p);
    return p;
  };
  const pgInfo = await ensurePostgres(cfg, { fast: true, pickPort: pick });
  pgStarted = true;
  console.log(`Drill PostgreSQL on 127.0.0.1:${cfg.pgPort} (data in ${pgInfo.dataDir}).`);
  for (const key of ["appPort", "s3Port", "smtpPort"] as const) cfg[key] = await pick(cfg[key]);
  await recreateDatabase(cfg, DB_NAME);
  const url = databaseUrl(cfg, DB_NAME);
  const { labId, emails } = await seed(url);
  standIns = await startStandIns(cfg);
  // a mail job cut off by the outage stays "active" until it expires; a short expiry keeps the drill short
  const env = { ...appEnv(cfg, url), SHUNTWISE_PER_ADDRESS_FACTOR: "100", SHUNTWISE_MAIL_EXPIRE_SECONDS: "30", SHUNTWISE_MAIL_RETRY_DELAY: "2" };
  await buildIfStale(".next-test", env);
  server = startNext({ distDir: ".next-test", port: cfg.appPort, host: cfg.appHost, env, quiet: true, pipeErrors: true });
  // what the app logs goes on to this process's standard error, and is kept for the checks
  let appLog = "";
  server.stderr!.on("data", (d: Buffer) => {
    appLog += d.toString();
    process.stderr.write(d);
  });
  const appUrl = `http://${cfg.appHost}:${cfg.appPort}`;
  await waitForHttp(`${appUrl}/api/health`, server);
  const serverPid = server.pid;
  console.log(`App on ${appUrl}; ${STUDENTS} students, ${SUBMISSIONS} submissions, ${CONCURRENCY} at a time, PostgreSQL down for ${OUTAGE_MS} ms.`);

  process.env.SHUNTWISE_TEST_URL = appUrl;
  const { Client } = await import("../tests/support/http");
  const clients = await Promise.all(
    emails.map(async (email) => {
      const c = new Client();
      if (!(await c.signIn(email, PASSWORD))) throw new Error(`could not sign in as ${email}`);
      return c;
    }),
  );

  // the burst
  const stored = new Set<string>(); // idempotency keys answered 2xx
  const statuses = new Map<string, number>();
  let unavailable = 0;
  let withoutRetryAfter = 0;
  let networkErrors = 0;
  let next = 0;
  let finished = 0;
  const unexpected: string[] = [];
  const outage: { stoppedAt?: number; startedAt?: number; firstOkAfter?: number } = {};
  const count = (s: string) => statuses.set(s, (statuses.get(s) ?? 0) + 1);

  // the last third of the submissions waits until PostgreSQL is down (or could not be stopped)
  const held = Math.ceil((2 * SUBMISSIONS) / 3);
  let down!: () => void;
  const isDown = new Promise<void>((r) => (down = r));
  const outageDone = (async () => {
    try {
      // a third stored, or everything before the held third answered (a failing burst still ends)
      while (stored.size < SUBMISSIONS / 3 && finished < held) await new Promise((r) => setTimeout(r, 20));
      console.log(`${stored.size} stored: stopping PostgreSQL…`);
      await stopPostgresAsync(pgInfo.dataDir);
      outage.stoppedAt = Date.now();
    } finally {
      down();
    }
    await new Promise((r) => setTimeout(r, OUTAGE_MS));
    console.log("starting PostgreSQL again…");
    await ensurePostgres(cfg, { fast: true });
    outage.startedAt = Date.now();
  })();

  async function submitOne(i: number) {
    const client = clients[i % clients.length];
    const key = `drill-key-${String(i).padStart(5, "0")}`;
    const deadline = Date.now() + 120_000;
    while (Date.now() < deadline) {
      let res: Response;
      try {
        res = await client.fetch(`/api/labs/${labId}/attempts`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ idempotencyKey: key, readings: { q1: i % 2 ? "3.3 mA" : "3.2 mA" } }),
        });
      } catch {
        networkErrors++;
        count("network error");
        await new Promise((r) => setTimeout(r, 500));
        continue;
      }
      count(String(res.status));
      if (![200, 201, 503].includes(res.status) && unexpected.length < 5) unexpected.push(`${res.status} ${await res.clone().text().catch(() => "")}`);
      await res.arrayBuffer().catch(() => undefined);
      if (res.status === 200 || res.status === 201) {
        stored.add(key);
        if (outage.startedAt && !outage.firstOkAfter) outage.firstOkAfter = Date.now();
        return;
      }
      if (res.status === 503) {
        unavailable++;
        const after = Number(res.headers.get("retry-after"));
        if (!(after > 0)) withoutRetryAfter++;
        await new Promise((r) => setTimeout(r, Math.min(1000, (after || 1) * 1000)));
        continue;
      }
      return; // any other answer is a failure, counted in statuses
    }
  }

  const started = Date.now();
  await Promise.all(
    Array.from({ length: CONCURRENCY }, async () => {
      for (let i = next++; i < SUBMISSIONS; i = next++) {
        if (i >= held) await isDown;
        await submitOne(i);
        finished++;
      }
    }),
  );
  await outageDone;
  const elapsed = Date.now() - started;

  // what the database holds
  const db = createDb(url, 2);
  try {
    const rows = await db.selectFrom("attempts").select(["id", "idempotency_key as key"]).execute();
    const perKey = new Map<string, number>();
    for (const r of rows) perKey.set(r.key, (perKey.get(r.key) ?? 0) + 1);
    const events = await sql<{ n: number }>`
      select count(*)::int as n from attempts a
      where (select count(*) from grade_events g where g.attempt_id = a.id and g.kind = 'graded') <> 1
         or (select count(*) from mail_outbox o where o.key = 'graded:' || a.id::text) <> 1
         or a.result is null`.execute(db);

    console.log("");
    console.log(`answers: ${[...statuses].map(([s, n]) => `${s} × ${n}`).join(", ")}`);
    for (const u of unexpected) console.log(`  unexpected answer: ${u.slice(0, 300)}`);
    console.log(`stored ${stored.size} of ${SUBMISSIONS} in ${(elapsed / 1000).toFixed(1)} s; PostgreSQL down ${outage.startedAt && outage.stoppedAt ? ((outage.startedAt - outage.stoppedAt) / 1000).toFixed(1) : "?"} s; first stored attempt ${outage.firstOkAfter && outage.startedAt ? ((outage.firstOkAfter - outage.startedAt) / 1000).toFixed(1) : "?"} s after it was back`);
    check([...statuses.keys()].every((s) => ["200", "201", "503"].includes(s)), "every answer was 2xx or 503 (no 500, no other error, no dropped connection)", failures);
    check(unavailable > 0, `the outage was met: ${unavailable} answers were 503`, failures);
    check(withoutRetryAfter === 0, "every 503 carried Retry-After", failures);
    check(networkErrors === 0, "no request lost its connection", failures);
    check(stored.size === SUBMISSIONS, `every submission was stored in the end (${stored.size} of ${SUBMISSIONS})`, failures);
    check(server.exitCode === null && server.pid === serverPid && (await fetch(`${appUrl}/api/health`)).status === 200, "the same app process answers after the restart", failures);
    check([...stored].every((k) => perKey.get(k) === 1), "every 2xx attempt is stored exactly once", failures);
    check(rows.length === stored.size, `no attempt without a 2xx (${rows.length} rows for ${stored.size} keys)`, failures);
    check(events.rows[0].n === 0, "no attempt is half-written (each has its result, one graded event and one queued e-mail)", failures);

    // the job workers came back: every graded e-mail reaches the stand-in
    const sent = async () => Number((await sql<{ n: string }>`select count(*) as n from mail_outbox where status = 'sent'`.execute(db)).rows[0].n);
    const until = Date.now() + 240_000;
    while ((await sent()) < rows.length && Date.now() < until) await new Promise((r) => setTimeout(r, 1000));
    const delivered = fs.readdirSync(standIns.mailDir).filter((f) => f.endsWith(".eml")).length;
    const outbox = await sql<{ status: string; n: number }>`select status, count(*)::int as n from mail_outbox group by status`.execute(db);
    console.log(`outbox: ${outbox.rows.map((r) => `${r.status} × ${r.n}`).join(", ")}`);
    const mailStates = await sql<{ state: string; n: number }>`select state, count(*)::int as n from pgboss.job where name = 'mail-send' group by state`.execute(db);
    console.log(`mail jobs: ${mailStates.rows.map((r) => `${r.state} × ${r.n}`).join(", ")}`);
    check((await sent()) === rows.length && delivered === rows.length, `every graded e-mail was sent once after the restart (${delivered} messages for ${rows.length} attempts)`, failures);
    const lost = appLog.match(/^PostgreSQL connection lost/gm)?.length ?? 0;
    check(
      lost > 0 && !/uncaughtException|unhandledRejection|^\s+at /m.test(appLog),
      `the app logged the outage in ${lost} line(s), without an uncaught exception or a stack trace`,
      failures,
    );
  } finally {
    await db.destroy();
  }
  console.log(failures.length ? `drill failed: ${failures.length} check(s)` : "drill passed");
  return failures.length ? 1 : 0;
}

let interrupted = false;
for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"] as const) {
  process.on(signal, () => {
    if (interrupted) return;
    interrupted = true;
    console.error(`\nInterrupted (${signal}): stopping what the drill started…`);
    void cleanUp().finally(() => process.exit(130));
  });
}

main()
  .then(async (code) => {
    await cleanUp();
    process.exit(code);
  })
  .catch(async (e) => {
    console.error(e instanceof Error ? e.stack ?? e.message : e);
    await cleanUp();
    process.exit(1);
  });
