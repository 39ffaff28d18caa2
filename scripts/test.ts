// `npm test`: the same set-up as `npm start` on a separate PostgreSQL cluster, then every test tier
// (unit, integration against real PostgreSQL, HTTP and browser tests against a production build), and
// after them a short PostgreSQL outage drill (bench/drill-db.ts) on the same build, counted as one test.
// The last line is always `summary: N passed, N failed, N skipped`.
//
// It stops everything it started, also when a test fails or the run is interrupted (Ctrl-C, SIGTERM):
// the app server, vitest, browsers, anything a test spawned (found by the run's SHUNTWISE_RUN_ID, see
// lib/processes.ts) and the test PostgreSQL when this run started it. A port that is taken (a demo, a
// second checkout's test run) is replaced by a free one.
import { type ChildProcess, spawn, spawnSync } from "node:child_process";
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { createDb } from "../db";
import { migrateToLatest } from "../db/migrator";
import { seedDemo } from "./seed/demo";
import { seedStorageFromEnv } from "./seed/storage";
import { appEnv } from "./lib/app-env";
import { buildIfStale } from "./lib/build";
import { databaseUrl, root, serviceConfig } from "./lib/config";
import { ensurePostgres, recreateDatabase, stopPostgres } from "./lib/postgres";
import { RUN_ID_VAR, alive, freePort, portTaken, stopPids, sweepRun } from "./lib/processes";
import { startNext, waitForHttp } from "./lib/server";
import { startStandIns } from "./lib/standins";

const cfg = serviceConfig("test");
const DIST = ".next-test";
const runId = crypto.randomUUID();
process.env[RUN_ID_VAR] = runId; // inherited by every process this run starts
const runFile = path.join(cfg.dataDir, "test-run.json");

/** A Debian package the tests run (chromium for the browser tests, ngspice for the circuit-simulator checks). */
function ensureDebianPackage(exe: string, pkg: string) {
  if (fs.existsSync(exe)) return;
  console.log(`${pkg} is not installed: installing Debian's ${pkg} package for the tests…`);
  const sudo = process.getuid?.() === 0 ? [] : ["sudo", "-n"];
  for (const args of [["apt-get", "update", "-qq"], ["apt-get", "install", "-y", "-qq", pkg]]) {
    const full = [...sudo, ...args];
    const r = spawnSync(full[0], full.slice(1), { stdio: "inherit", env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" } });
    if (r.status !== 0) throw new Error(`"${full.join(" ")}" failed; install ${pkg} (apt-get install ${pkg}) and run again.`);
  }
}

function ensureTestPackages() {
  ensureDebianPackage(process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", "chromium");
  ensureDebianPackage("/usr/bin/ngspice", "ngspice");
}


interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}

// What has to be undone, newest first, and by whom (the normal end or a signal, whichever comes first).
const children = new Set<ChildProcess>();
let drill: ChildProcess | undefined;
let pgStartedByUs = false;
let standIns: Awaited<ReturnType<typeof startStandIns>> | undefined;
let cleaning: Promise<void> | undefined;

function track(child: ChildProcess): ChildProcess {
  children.add(child);
  child.on("exit", () => children.delete(child));
  return child;
}

function cleanUp(): Promise<void> {
  cleaning ??= (async () => {
    // the drill stops its own PostgreSQL cluster, server and stand-ins when asked: give it the time
    if (drill?.pid && drill.exitCode === null) await stopPids([drill.pid], 30_000);
    await stopPids([...children].map((c) => c.pid!).filter(Boolean));
    await standIns?.close();
    if (pgStartedByUs) {
      try {
        stopPostgres(cfg);
      } catch (e) {
        console.error((e as Error).message);
      }
    }
    const left = await sweepRun(runId);
    if (left) console.log(`Stopped ${left} process(es) the tests had left running.`);
    fs.rmSync(runFile, { force: true });
  })();
  return cleaning;
}

/** A run killed outright (SIGKILL) cannot clean up: the next run does it from the record it left. */
async function cleanUpAfterKilledRun(): Promise<void> {
  if (!fs.existsSync(runFile)) return;
  try {
    const last = JSON.parse(fs.readFileSync(runFile, "utf8")) as { pid: number; runId: string; pgStarted: boolean };
    if (alive(last.pid)) throw new Error(`Another test run (process ${last.pid}) uses ${cfg.dataDir}; wait for it or set SHUNTWISE_DATA_DIR.`);
    if (last.pgStarted) stopPostgres(cfg);
    const left = await sweepRun(last.runId);
    if (left) console.log(`Stopped ${left} process(es) left by an earlier test run that was killed.`);
  } catch (e) {
    if (e instanceof Error && e.message.startsWith("Another test run")) throw e;
  }
  fs.rmSync(runFile, { force: true });
}

function recordRun() {
  fs.mkdirSync(cfg.dataDir, { recursive: true });
  fs.writeFileSync(runFile, JSON.stringify({ pid: process.pid, runId, pgStarted: pgStartedByUs }));
}

// Asynchronous on purpose: the storage and mail stand-ins run in this process and must keep answering.
async function runVitest(env: NodeJS.ProcessEnv, extra: string[]): Promise<Counts> {
  const out = path.join(root, "tests", ".artifacts", `vitest-${runId}.json`);
  fs.mkdirSync(path.dirname(out), { recursive: true });
  const child = track(
    spawn(
      process.execPath,
      [path.join(root, "node_modules/vitest/vitest.mjs"), "run", "--reporter=default", "--reporter=json", `--outputFile.json=${out}`, ...extra],
      { cwd: root, stdio: ["ignore", "inherit", "inherit"], env },
    ),
  );
  const r = await new Promise<{ status: number | null }>((resolve) => child.on("exit", (status) => resolve({ status })));
  if (!fs.existsSync(out)) return { passed: 0, failed: 1, skipped: 0 };
  const report = JSON.parse(fs.readFileSync(out, "utf8"));
  fs.rmSync(out, { force: true });
  const counts = {
    passed: report.numPassedTests ?? 0,
    failed: report.numFailedTests ?? 0,
    skipped: (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0),
  };
  // A file that fails to load, or an error outside any test, counts as one failure.
  if (r.status !== 0 && counts.failed === 0) counts.failed = Math.max(1, report.numFailedTestSuites ?? 0);
  return counts;
}

/** The short outage drill: sizes from the drill's own variables when set. */
const DRILL_SIZE = { SHUNTWISE_DRILL_STUDENTS: "20", SHUNTWISE_DRILL_SUBMISSIONS: "80", SHUNTWISE_DRILL_CONCURRENCY: "10", SHUNTWISE_DRILL_OUTAGE_MS: "1500" };
/** Far above its usual minute on a loaded machine; a drill that hangs must not hang the run. */
const DRILL_LIMIT_MS = 12 * 60_000;

/**
 * PostgreSQL stopped and started in the middle of a submission burst (bench/drill-db.ts): its own
 * cluster, stand-ins and server, on the build the other tiers used (up to date, so not built again).
 */
async function runDrill(): Promise<Counts> {
  console.log("\nOutage drill (bench/drill-db.ts): PostgreSQL stopped and started during a submission burst…");
  const env = { ...process.env };
  for (const [key, value] of Object.entries(DRILL_SIZE)) env[key] ||= value;
  drill = track(spawn(process.execPath, [path.join(root, "node_modules/tsx/dist/cli.mjs"), "bench/drill-db.ts"], { cwd: root, stdio: ["ignore", "inherit", "inherit"], env }));
  const child = drill;
  let overtime = false;
  const limit = setTimeout(() => {
    overtime = true;
    console.error(`The drill did not end within ${DRILL_LIMIT_MS / 60_000} minutes: stopping it.`);
    void stopPids([child.pid!], 30_000);
  }, DRILL_LIMIT_MS);
  const code = await new Promise<number | null>((resolve) => child.on("exit", (status) => resolve(status)));
  clearTimeout(limit);
  const ok = code === 0 && !overtime;
  console.log(ok ? "Outage drill passed." : "Outage drill FAILED (see its checks above).");
  return { passed: ok ? 1 : 0, failed: ok ? 0 : 1, skipped: 0 };
}

async function main(): Promise<Counts> {
  const extra = process.argv.slice(2);
  await cleanUpAfterKilledRun();
  recordRun();
  const taken: number[] = [];
  const pick = async (preferred: number) => {
    const port = await freePort(preferred, cfg.appHost, taken);
    taken.push(port);
    return port;
  };
  const pgInfo = await ensurePostgres(cfg, { fast: true, pickPort: pick });
  pgStartedByUs = pgInfo.started;
  recordRun();
  console.log(`Test PostgreSQL on 127.0.0.1:${pgInfo.port} (data in ${pgInfo.dataDir}).`);
  for (const name of cfg.databases) await recreateDatabase(cfg, name);
  const testUrl = databaseUrl(cfg, "shuntwise_test");
  const e2eUrl = databaseUrl(cfg, "shuntwise_e2e");
  ensureTestPackages();
  for (const key of ["appPort", "s3Port", "smtpPort"] as const) {
    const port = await pick(cfg[key]);
    if (port !== cfg[key]) console.log(`Port ${cfg[key]} is taken; using ${port} instead.`);
    cfg[key] = port;
  }
  // the whole suite signs in from 127.0.0.1: per-address throttles scaled up (per-account ones unchanged)
  const testEnv = () => ({ ...appEnv(cfg, e2eUrl), SHUNTWISE_PER_ADDRESS_FACTOR: process.env.SHUNTWISE_PER_ADDRESS_FACTOR ?? "100" });
  let env = testEnv();
  standIns = await startStandIns(cfg);
  for (const url of [testUrl, e2eUrl]) {
    const db = createDb(url, 2);
    try {
      await migrateToLatest(db);
      if (url === e2eUrl) await seedDemo(db, { storage: seedStorageFromEnv(env), mailDatabaseUrl: url });
    } finally {
      await db.destroy();
    }
  }
  await buildIfStale(DIST, env);
  // The build takes minutes: another run on this machine may have taken the app's port meanwhile.
  // Check it again just before starting, and start on another free port when the server cannot listen.
  let server: ChildProcess;
  for (let tries = 1; ; tries++) {
    if (await portTaken(cfg.appPort, cfg.appHost)) {
      const port = await pick(cfg.appPort);
      console.log(`Port ${cfg.appPort} was taken during the build; using ${port} instead.`);
      cfg.appPort = port;
      env = testEnv();
    }
    server = track(startNext({ distDir: DIST, port: cfg.appPort, host: cfg.appHost, env, quiet: true }));
    try {
      await waitForHttp(`http://${cfg.appHost}:${cfg.appPort}/api/health`, server);
      break;
    } catch (e) {
      if (server.exitCode === null || tries >= 5) throw e;
      taken.push(cfg.appPort);
    }
  }
  const url = `http://${cfg.appHost}:${cfg.appPort}`;
  console.log(`App under test on ${url}.`);
  const tiers = await runVitest(
    {
      ...env,
      NODE_ENV: "test",
      DATABASE_URL: testUrl,
      E2E_DATABASE_URL: e2eUrl,
      SHUNTWISE_TEST_URL: url,
      // the build under test, for a test that starts a second server on it with another environment;
      // the access matrix reads the build's server-action ids from it
      SHUNTWISE_TEST_DIST_DIR: DIST,
    },
    extra,
  );
  // a run of chosen tests (arguments after --) leaves the drill out; the whole suite ends with it, the
  // app under test stopped first to leave the machine to it
  if (extra.length > 0 || interrupted) return tiers;
  await stopPids([server.pid!]);
  const drilled = await runDrill();
  return { passed: tiers.passed + drilled.passed, failed: tiers.failed + drilled.failed, skipped: tiers.skipped };
}

function finish(c: Counts, code: number): never {
  console.log(`summary: ${c.passed} passed, ${c.failed} failed, ${c.skipped} skipped`);
  process.exit(code);
}

let interrupted = false;
for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"] as const) {
  process.on(signal, () => {
    if (interrupted) return; // already stopping
    interrupted = true;
    console.error(`\nInterrupted (${signal}): stopping everything this test run started…`);
    void cleanUp().finally(() => finish({ passed: 0, failed: 1, skipped: 0 }, 130));
  });
}

main()
  .then(async (c) => {
    if (interrupted) return; // the signal handler reports
    await cleanUp();
    finish(c, c.failed > 0 ? 1 : 0);
  })
  .catch(async (e) => {
    if (interrupted) return;
    console.error(e instanceof Error ? e.message : e);
    await cleanUp();
    finish({ passed: 0, failed: 1, skipped: 0 }, 1);
  });
