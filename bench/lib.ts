// What the HTTP benchmarks share: a scratch database of their own in the project's local PostgreSQL
// (SHUNTWISE_DATA_DIR, SHUNTWISE_PG_PORT), the production build, app processes on free ports that are
// stopped at the end (also on Ctrl-C), and session cookies for seeded users.
import type { ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import { sql, type Kysely } from "kysely";
import { encode } from "next-auth/jwt";
import { createSession } from "../db/queries/sessions";
import { sessionLimits } from "../lib/auth/sessions";
import pg from "pg";
import type { Database } from "../db";
import { appEnv } from "../scripts/lib/app-env";
import { buildIfStale } from "../scripts/lib/build";
import { databaseUrl, serviceConfig } from "../scripts/lib/config";
import { ensurePostgres, recreateDatabase } from "../scripts/lib/postgres";
import { freePort } from "../scripts/lib/processes";
import { startNext, waitForHttp } from "../scripts/lib/server";

export const cfg = serviceConfig("dev");
const cleanups: (() => Promise<void> | void)[] = [];

/** Runs `fn` at the end of the benchmark, in reverse order, whether it succeeded, failed or was interrupted. */
export function atEnd(fn: () => Promise<void> | void): void {
  cleanups.push(fn);
}

async function cleanUp(): Promise<void> {
  while (cleanups.length) {
    try {
      await cleanups.pop()!();
    } catch (e) {
      console.error(`clean-up: ${(e as Error).message}`);
    }
  }
}

for (const sig of ["SIGINT", "SIGTERM"] as const) {
  process.once(sig, () => {
    void cleanUp().then(() => process.exit(130));
  });
}

/** Runs a benchmark's main function, then stops and drops everything it started. */
export function runBench(main: () => Promise<void>): void {
  main()
    .then(cleanUp, async (e) => {
      console.error(e instanceof Error ? (e.stack ?? e.message) : e);
      await cleanUp();
      process.exitCode = 1;
    })
    .finally(() => process.exit());
}

/** A fresh database in the local PostgreSQL, dropped at the end. */
export async function scratchDatabase(name: string): Promise<string> {
  await ensurePostgres(cfg);
  await recreateDatabase(cfg, name);
  atEnd(async () => {
    const c = new pg.Client({ connectionString: databaseUrl(cfg, "postgres") });
    await c.connect();
    await c.query(`drop database if exists "${name}" with (force)`).catch(() => undefined);
    await c.end();
  });
  return databaseUrl(cfg, name);
}

export type App = { base: string; port: number; process: ChildProcess; env: NodeJS.ProcessEnv };

/** The app's environment for a database; workers off unless asked (the benchmarks measure the web server). */
export function benchEnv(url: string, extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  const env = appEnv(cfg, url);
  return {
    ...env,
    DATABASE_URL: url,
    SHUNTWISE_NO_WORKERS: "1",
    // every simulated student comes from 127.0.0.1
    SHUNTWISE_PER_ADDRESS_FACTOR: "1000",
    ...extra,
  };
}

export const distDir = process.env.SHUNTWISE_BENCH_DIST ?? ".next";

export async function build(env: NodeJS.ProcessEnv): Promise<void> {
  await buildIfStale(distDir, env);
}

/** `next start` on a free port; stopped at the end. */
export async function startApp(env: NodeJS.ProcessEnv, preferred = cfg.appPort + 7): Promise<App> {
  const port = await freePort(preferred);
  const base = `http://127.0.0.1:${port}`;
  const child = startNext({ distDir, port, host: "127.0.0.1", env: { ...env, PORT: String(port), NEXTAUTH_URL: base, APP_URL: base }, quiet: true });
  atEnd(() => stopChild(child));
  await waitForHttp(`${base}/api/health`, child, 120_000);
  return { base, port, process: child, env };
}

export function stopChild(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const hard = setTimeout(() => child.kill("SIGKILL"), 10_000);
    child.once("exit", () => {
      clearTimeout(hard);
      resolve();
    });
    child.kill("SIGTERM");
  });
}

/**
 * A signed session cookie for a user with its session row, as next-auth's sign-in would make them (the
 * bench skips 500 password checks).
 */
export async function sessionCookie(db: Kysely<Database>, userId: string, secret: string): Promise<string> {
  const sid = await createSession(db, userId, "bench", sessionLimits());
  const token = await encode({ token: { sub: userId, sid }, secret });
  return `next-auth.session-token=${token}`;
}

/**
 * A round-robin TCP proxy on a free port: each new connection goes to the next backend in turn. Both the
 * one-process and the two-process runs go through it, so they pay the same extra hop. The backends are
 * set once the apps listen (the apps are told the proxy's address first, as their public address).
 */
export async function roundRobin(): Promise<{ base: string; setBackends(ports: number[]): void; close(): Promise<void> }> {
  let backends: number[] = [];
  let next = 0;
  const sockets = new Set<net.Socket>();
  const server = net.createServer((client) => {
    const target = backends[next++ % backends.length];
    const upstream = net.connect({ port: target, host: "127.0.0.1" });
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on("close", () => sockets.delete(s));
      s.on("error", () => {
        client.destroy();
        upstream.destroy();
      });
    }
    client.pipe(upstream).pipe(client);
  });
  const port = await freePort(cfg.appPort + 9);
  await new Promise<void>((resolve) => server.listen(port, "127.0.0.1", resolve));
  let closed = false;
  const close = () =>
    new Promise<void>((resolve) => {
      if (closed) return resolve();
      closed = true;
      for (const s of sockets) s.destroy();
      server.close(() => resolve());
    });
  atEnd(close);
  return { base: `http://127.0.0.1:${port}`, setBackends: (ports) => void (backends = ports), close };
}

export function percentile(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  if (s.length === 0) return NaN;
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)];
}

/** Linux's USER_HZ, the unit of the CPU times in /proc/<pid>/stat. */
const CLOCK_TICKS = 100;

function procStat(pid: number): { ppid: number; ownMs: number; childrenMs: number } | null {
  try {
    const f = fs.readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
    return { ppid: Number(f[1]), ownMs: ((Number(f[11]) + Number(f[12])) * 1000) / CLOCK_TICKS, childrenMs: ((Number(f[13]) + Number(f[14])) * 1000) / CLOCK_TICKS };
  } catch {
    return null; // the process ended meanwhile
  }
}

/**
 * CPU time (user + system, ms) used so far by a process and every process below it, read from /proc:
 * the figure a shared machine's load barely changes. Children that ended count through their parent.
 */
export function cpuMsOfTree(root: number): number {
  const parents = new Map<number, number>();
  for (const name of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    const s = procStat(Number(name));
    if (s) parents.set(Number(name), s.ppid);
  }
  let total = 0;
  for (const pid of parents.keys()) {
    let p: number | undefined = pid;
    while (p !== undefined && p > 1 && p !== root) p = parents.get(p);
    if (p !== root) continue;
    const s = procStat(pid);
    if (s) total += s.ownMs + (pid === root ? s.childrenMs : 0);
  }
  return total;
}

/** The PostgreSQL server's main process (the parent of a connection's backend). */
export async function postmasterPid(db: Kysely<Database>): Promise<number> {
  const backend = (await sql<{ pid: number }>`select pg_backend_pid() as pid`.execute(db)).rows[0].pid;
  const s = procStat(backend);
  if (!s) throw new Error("cannot read the database server's process (is it on this machine?)");
  return s.ppid;
}
