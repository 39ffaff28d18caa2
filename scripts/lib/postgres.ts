// Installs (if missing), initialises and starts a private PostgreSQL cluster on 127.0.0.1.
// It listens on loopback only, which is why trust authentication is acceptable here.
import { execFileSync, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import pg from "pg";
import { type ServiceConfig, databaseUrl } from "./config";

const isRoot = process.getuid?.() === 0;

function findBinDir(): string | null {
  const base = "/usr/lib/postgresql";
  if (!fs.existsSync(base)) return null;
  const versions = fs
    .readdirSync(base)
    .filter((v) => fs.existsSync(path.join(base, v, "bin", "postgres")))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], "bin") : null;
}

function run(cmd: string, args: string[], opts: { asPostgres?: boolean; quiet?: boolean } = {}) {
  const [file, argv] = opts.asPostgres && isRoot ? ["runuser", ["-u", "postgres", "--", cmd, ...args]] : [cmd, args];
  const r = spawnSync(file, argv, { encoding: "utf8", stdio: opts.quiet ? "pipe" : ["ignore", "pipe", "pipe"] });
  return { status: r.status ?? 1, out: `${r.stdout ?? ""}${r.stderr ?? ""}` };
}

export function ensurePostgresInstalled(): string {
  let bin = findBinDir();
  if (bin) return bin;
  console.log("PostgreSQL is not installed: installing it from Debian's packages (apt-get)…");
  const apt = isRoot ? [] : ["sudo", "-n"];
  for (const args of [["apt-get", "update", "-qq"], ["apt-get", "install", "-y", "-qq", "postgresql"]]) {
    const full = [...apt, ...args];
    const r = spawnSync(full[0], full.slice(1), {
      stdio: "inherit",
      env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
    });
    if (r.status !== 0) {
      throw new Error(
        `Could not run "${full.join(" ")}". Install PostgreSQL yourself (as root: apt-get install -y postgresql) and run the command again.`,
      );
    }
  }
  bin = findBinDir();
  if (!bin) throw new Error("PostgreSQL was installed but no server binary was found under /usr/lib/postgresql.");
  return bin;
}

/** When run as root the server runs as the postgres user, which must be able to reach the folder. */
function usableDataDir(cfg: ServiceConfig): string {
  if (!isRoot) return cfg.pgDir;
  fs.mkdirSync(path.dirname(cfg.pgDir), { recursive: true });
  const probe = run("test", ["-x", path.dirname(cfg.pgDir)], { asPostgres: true, quiet: true });
  if (probe.status === 0) return cfg.pgDir;
  // A parent folder is closed to other users (for example a checkout under /root): keep the cluster
  // in a folder of its own under /var/tmp, named after the checkout so two checkouts do not share one.
  const tag = createHash("sha256").update(cfg.pgDir).digest("hex").slice(0, 12);
  return path.join("/var/tmp", `shuntwise-pg-${tag}`);
}

function socketDir(dir: string): string {
  return dir.length < 80 ? dir : "/tmp";
}

export interface RunningPostgres {
  dataDir: string;
  port: number;
  urls: Record<string, string>;
  /** True when this call started the server (false when it was already running). */
  started: boolean;
}

/** The port a running cluster listens on (line 4 of postmaster.pid), or null. */
function runningPort(dir: string): number | null {
  try {
    const port = Number(fs.readFileSync(path.join(dir, "postmaster.pid"), "utf8").split("\n")[3]);
    return Number.isInteger(port) && port > 0 ? port : null;
  } catch {
    return null;
  }
}

/**
 * Starts the cluster unless it runs already. With `pickPort`, a taken port is not an error: `pickPort`
 * gets the configured port and answers the one to use. `cfg.pgPort` is set to the port the cluster really listens on.
 */
export async function ensurePostgres(
  cfg: ServiceConfig,
  opts: { fast?: boolean; pickPort?: (preferred: number) => Promise<number> } = {},
): Promise<RunningPostgres> {
  const bin = ensurePostgresInstalled();
  const dir = usableDataDir(cfg);
  const pgctl = path.join(bin, "pg_ctl");

  if (!fs.existsSync(path.join(dir, "PG_VERSION"))) {
    console.log(`Creating a PostgreSQL cluster in ${dir}…`);
    fs.mkdirSync(dir, { recursive: true, mode: 0o700 });
    if (isRoot) execFileSync("chown", ["-R", "postgres:postgres", dir]);
    const r = run(path.join(bin, "initdb"), ["-D", dir, "-U", "postgres", "--auth=trust", "--encoding=UTF8", "--no-locale"], {
      asPostgres: true,
    });
    if (r.status !== 0) throw new Error(`initdb failed:\n${r.out}`);
  }

  const status = run(pgctl, ["status", "-D", dir], { asPostgres: true, quiet: true });
  const started = status.status !== 0;
  if (!started) cfg.pgPort = runningPort(dir) ?? cfg.pgPort;
  if (started) {
    const busy = opts.pickPort ? { status: 1 } : run(path.join(bin, "pg_isready"), ["-h", "127.0.0.1", "-p", String(cfg.pgPort)], { quiet: true });
    if (opts.pickPort) {
      const port = await opts.pickPort(cfg.pgPort);
      if (port !== cfg.pgPort) console.log(`Port ${cfg.pgPort} is taken; the test PostgreSQL uses port ${port}.`);
      cfg.pgPort = port;
    } else if (busy.status === 0) {
      throw new Error(
        `Port ${cfg.pgPort} already has a PostgreSQL server that is not this project's. Set ${
          cfg.profile === "dev" ? "SHUNTWISE_PG_PORT" : "SHUNTWISE_TEST_PG_PORT"
        } to a free port.`,
      );
    }
    const options = [`-c listen_addresses=127.0.0.1`, `-p ${cfg.pgPort}`, `-k ${socketDir(dir)}`];
    if (opts.fast) options.push("-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off");
    const r = run(pgctl, ["start", "-D", dir, "-w", "-t", "60", "-l", path.join(dir, "server.log"), "-o", options.join(" ")], {
      asPostgres: true,
    });
    if (r.status !== 0) throw new Error(`PostgreSQL did not start:\n${r.out}\nSee ${path.join(dir, "server.log")}.`);
  }

  // Wait until it accepts connections, then create the databases that are missing.
  const admin = new pg.Client({ connectionString: databaseUrl(cfg, "postgres") });
  for (let i = 0; ; i++) {
    try {
      await admin.connect();
      break;
    } catch (e) {
      if (i > 60) throw new Error(`PostgreSQL on port ${cfg.pgPort} does not accept connections: ${(e as Error).message}`);
      await new Promise((res) => setTimeout(res, 500));
    }
  }
  try {
    for (const name of cfg.databases) {
      const found = await admin.query("select 1 from pg_database where datname = $1", [name]);
      if (found.rowCount === 0) await admin.query(`create database "${name}"`);
    }
  } finally {
    await admin.end();
  }
  return {
    dataDir: dir,
    port: cfg.pgPort,
    urls: Object.fromEntries(cfg.databases.map((d) => [d, databaseUrl(cfg, d)])),
    started,
  };
}

/** Drops a database of the local PostgreSQL (if it exists) and creates it empty, so a run starts from nothing. */
export async function recreateDatabase(cfg: ServiceConfig, name: string): Promise<void> {
  const admin = new pg.Client({ connectionString: databaseUrl(cfg, "postgres") });
  await admin.connect();
  try {
    await admin.query(`drop database if exists "${name}" with (force)`);
    await admin.query(`create database "${name}"`);
  } finally {
    await admin.end();
  }
}

export function stopPostgres(cfg: ServiceConfig): boolean {
  const bin = findBinDir();
  if (!bin) return false;
  const dir = usableDataDir(cfg);
  if (!fs.existsSync(path.join(dir, "PG_VERSION"))) return false;
  const status = run(path.join(bin, "pg_ctl"), ["status", "-D", dir], { asPostgres: true, quiet: true });
  if (status.status !== 0) return false;
  const r = run(path.join(bin, "pg_ctl"), ["stop", "-D", dir, "-m", "fast", "-w"], { asPostgres: true });
  if (r.status !== 0) throw new Error(`pg_ctl stop failed:\n${r.out}`);
  return true;
}

/** DATABASE_URL when set; otherwise the project's own demo database, started if need be. */
export async function localDatabaseUrl(cfg: ServiceConfig): Promise<string> {
  if (process.env.DATABASE_URL) return process.env.DATABASE_URL;
  await ensurePostgres(cfg);
  return databaseUrl(cfg, cfg.databases[0]);
}
