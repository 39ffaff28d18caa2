// `npm test`: the same set-up as `npm start` on a separate PostgreSQL cluster, then every test tier
// (unit, integration against real PostgreSQL, HTTP and browser tests against a production build).
// The last line is always `summary: N passed, N failed, N skipped`.
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import pg from "pg";
import { createDb } from "../db";
import { migrateToLatest } from "../db/migrator";
import { seedDemo } from "../db/seed/demo";
import { seedStorageFromEnv } from "../db/seed/storage";
import { appEnv } from "./lib/app-env";
import { buildIfStale } from "./lib/build";
import { databaseUrl, root, serviceConfig } from "./lib/config";
import { ensurePostgres } from "./lib/postgres";
import { portInUse, startNext, waitForHttp } from "./lib/server";
import { startStandIns } from "./lib/standins";

const cfg = serviceConfig("test");
const DIST = ".next-test";

function ensureChromium() {
  const exe = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
  if (fs.existsSync(exe)) return;
  console.log("Chromium is not installed: installing Debian's chromium package for the browser tests…");
  const sudo = process.getuid?.() === 0 ? [] : ["sudo", "-n"];
  for (const args of [["apt-get", "update", "-qq"], ["apt-get", "install", "-y", "-qq", "chromium"]]) {
    const full = [...sudo, ...args];
    const r = spawnSync(full[0], full.slice(1), { stdio: "inherit", env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" } });
    if (r.status !== 0) throw new Error(`"${full.join(" ")}" failed; install chromium (apt-get install chromium) and run again.`);
  }
}

/** Drops and recreates a database so every run starts from the same state. */
async function recreate(name: string) {
  const admin = new pg.Client({ connectionString: databaseUrl(cfg, "postgres") });
  await admin.connect();
  try {
    await admin.query(`drop database if exists "${name}" with (force)`);
    await admin.query(`create database "${name}"`);
  } finally {
    await admin.end();
  }
}

interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}

// Asynchronous on purpose: the storage and mail stand-ins run in this process and must keep answering.
async function runVitest(env: NodeJS.ProcessEnv, extra: string[]): Promise<Counts> {
  const out = path.join(root, "tests", ".artifacts", "vitest.json");
  fs.mkdirSync(path.dirname(out), { recursive: true });
  fs.rmSync(out, { force: true });
  const child = spawn(
    process.execPath,
    [path.join(root, "node_modules/vitest/vitest.mjs"), "run", "--reporter=default", "--reporter=json", `--outputFile.json=${out}`, ...extra],
    { cwd: root, stdio: "inherit", env },
  );
  const r = await new Promise<{ status: number | null }>((resolve) => child.on("exit", (status) => resolve({ status })));
  if (!fs.existsSync(out)) return { passed: 0, failed: 1, skipped: 0 };
  const report = JSON.parse(fs.readFileSync(out, "utf8"));
  const counts = {
    passed: report.numPassedTests ?? 0,
    failed: report.numFailedTests ?? 0,
    skipped: (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0),
  };
  // A file that fails to load, or an error outside any test, counts as one failure.
  if (r.status !== 0 && counts.failed === 0) counts.failed = Math.max(1, report.numFailedTestSuites ?? 0);
  return counts;
}

async function main(): Promise<Counts> {
  const extra = process.argv.slice(2);
  const pgInfo = await ensurePostgres(cfg, { fast: true });
  console.log(`Test PostgreSQL on 127.0.0.1:${pgInfo.port} (data in ${pgInfo.dataDir}).`);
  for (const name of cfg.databases) await recreate(name);
  const testUrl = databaseUrl(cfg, "shuntwise_test");
  const e2eUrl = databaseUrl(cfg, "shuntwise_e2e");
  ensureChromium();
  if (await portInUse(cfg.appPort)) throw new Error(`Port ${cfg.appPort} is in use (another test run?); set SHUNTWISE_TEST_APP_PORT to a free port.`);
  const env = appEnv(cfg, e2eUrl);
  const standIns = await startStandIns(cfg);
  let server: ReturnType<typeof startNext> | undefined;
  try {
    for (const url of [testUrl, e2eUrl]) {
      const db = createDb(url, 2);
      try {
        await migrateToLatest(db);
        if (url === e2eUrl) await seedDemo(db, { storage: seedStorageFromEnv(env) });
      } finally {
        await db.destroy();
      }
    }
    buildIfStale(DIST, env);
    server = startNext({ distDir: DIST, port: cfg.appPort, host: cfg.appHost, env, quiet: true });
    const url = `http://${cfg.appHost}:${cfg.appPort}`;
    await waitForHttp(`${url}/api/health`, server);
    return await runVitest(
      {
        ...env,
        NODE_ENV: "test",
        DATABASE_URL: testUrl,
        E2E_DATABASE_URL: e2eUrl,
        SHUNTWISE_TEST_URL: url,
      },
      extra,
    );
  } finally {
    server?.kill("SIGTERM");
    await standIns.close();
  }
}

main()
  .then((c) => {
    console.log(`summary: ${c.passed} passed, ${c.failed} failed, ${c.skipped} skipped`);
    process.exit(c.failed > 0 ? 1 : 0);
  })
  .catch((e) => {
    console.error(e instanceof Error ? e.message : e);
    console.log("summary: 0 passed, 1 failed, 0 skipped");
    process.exit(1);
  });
