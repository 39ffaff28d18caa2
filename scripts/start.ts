// `npm start`: PostgreSQL, migrations, demo data, build, local mail and storage, then the app on
// http://127.0.0.1:3000. Ctrl-C stops the app and the stand-ins; `npm run db:stop` stops the database.
import fs from "node:fs";
import path from "node:path";
import { createDb } from "../db";
import { migrateToLatest } from "../db/migrator";
import { DEMO_PASSWORD, demoLogins, seedDemo } from "./seed/demo";
import { seedStorageFromEnv } from "./seed/storage";
import { appEnv } from "./lib/app-env";
import { buildIfStale } from "./lib/build";
import { databaseUrl, serviceConfig } from "./lib/config";
import { ensurePostgres } from "./lib/postgres";
import { portInUse, startNext, waitForHttp } from "./lib/server";
import { startStandIns } from "./lib/standins";

const cfg = serviceConfig("dev");
const pidFile = path.join(cfg.dataDir, "app.pid");

function alreadyRunning(): number | null {
  if (!fs.existsSync(pidFile)) return null;
  const pid = Number(fs.readFileSync(pidFile, "utf8"));
  try {
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

async function main() {
  const url = `http://${cfg.appHost}:${cfg.appPort}`;
  const running = alreadyRunning();
  if (running) {
    console.error(`Shuntwise is already running (process ${running}) at ${url}. Stop it with Ctrl-C in its terminal first.`);
    process.exit(1);
  }
  if (await portInUse(cfg.appPort)) {
    console.error(`Port ${cfg.appPort} is already in use by another program. Set PORT to a free port, e.g. PORT=3001 npm start.`);
    process.exit(1);
  }
  fs.mkdirSync(cfg.dataDir, { recursive: true });
  fs.writeFileSync(pidFile, String(process.pid));
  const cleanup = () => fs.rmSync(pidFile, { force: true });
  process.on("exit", cleanup);

  const pg = await ensurePostgres(cfg);
  const dbUrl = process.env.DATABASE_URL ?? databaseUrl(cfg, cfg.databases[0]);
  console.log(`PostgreSQL is running on 127.0.0.1:${pg.port} (data in ${pg.dataDir}).`);
  const env = appEnv(cfg, dbUrl);
  const standIns = await startStandIns(cfg);
  console.log(`Local mail server: ${standIns.smtpUrl} (messages kept in ${standIns.mailDir}).`);
  console.log(`Local object storage: ${standIns.s3Endpoint}.`);
  const db = createDb(dbUrl, 2);
  try {
    const applied = await migrateToLatest(db);
    console.log(applied.length ? `Applied ${applied.length} migration(s).` : "Database schema is up to date.");
    await seedDemo(db, { storage: seedStorageFromEnv(env), mailDatabaseUrl: dbUrl });
    console.log("Demo course is in place.");
  } finally {
    await db.destroy();
  }

  try {
    await buildIfStale(".next", env);
  } catch (e) {
    await standIns.close();
    throw e;
  }

  const next = startNext({ distDir: ".next", port: cfg.appPort, host: cfg.appHost, env });
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    console.log("\nStopping Shuntwise (the database keeps running; `npm run db:stop` stops it)…");
    next.kill("SIGTERM");
    await standIns.close();
    cleanup();
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
  next.on("exit", (code) => {
    if (!stopping) {
      console.error(`The app server stopped (exit code ${code}).`);
      void standIns.close().then(() => process.exit(code ?? 1));
    }
  });

  await waitForHttp(`${url}/api/health`, next);
  console.log(`\nShuntwise is ready at ${url}\n`);
  console.log("Demo logins (password for every one: " + DEMO_PASSWORD + "):");
  for (const l of demoLogins) console.log(`  ${l.role.padEnd(11)} ${l.email}`);
  console.log("\nPress Ctrl-C to stop.");
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  fs.rmSync(pidFile, { force: true });
  process.exit(1);
});
