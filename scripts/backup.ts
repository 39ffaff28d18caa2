// `npm run db:backup`: a pg_dump of the database (DATABASE_URL, else the local demo database) in
// PostgreSQL's custom format, into <data folder>/backups/. The last line printed is the file's path.
//
// `npm run db:restore FILE [DATABASE]`: pg_restore of such a file into DATABASE_URL's database (else the
// local demo database), or into DATABASE (a name on the same server, created when missing, or a full
// postgres:// URL). Objects the file holds are dropped and recreated; stop the app (and `npm run worker`)
// that uses the target first. Nothing else on the server is touched.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import pg from "pg";
import { serviceConfig } from "./lib/config";
import { ensurePostgresInstalled, localDatabaseUrl } from "./lib/postgres";

function tool(name: "pg_dump" | "pg_restore"): string {
  return path.join(ensurePostgresInstalled(), name);
}

function runTool(file: string, args: string[]): void {
  const r = spawnSync(file, args, { encoding: "utf8", stdio: ["ignore", "inherit", "pipe"] });
  if (r.status !== 0) throw new Error(`${path.basename(file)} failed (exit ${r.status ?? r.signal}):\n${r.stderr}`);
  if (r.stderr.trim()) process.stderr.write(r.stderr);
}

/** The database name of a postgres:// URL. */
function nameOf(url: string): string {
  return decodeURIComponent(new URL(url).pathname.replace(/^\//, "")) || "postgres";
}

async function backup(): Promise<string> {
  const cfg = serviceConfig("dev");
  const url = await localDatabaseUrl(cfg);
  const dir = path.join(cfg.dataDir, "backups");
  fs.mkdirSync(dir, { recursive: true });
  const stamp = new Date().toISOString().replace(/[:.]/g, "-");
  const file = path.join(dir, `${nameOf(url)}-${stamp}.dump`);
  runTool(tool("pg_dump"), ["--format=custom", "--no-password", `--file=${file}`, `--dbname=${url}`]);
  return file;
}

/** The target's URL: a full URL as given, or a database of that name beside `base`, created when missing. */
async function target(base: string, given: string | undefined): Promise<string> {
  if (!given) return base;
  if (/^postgres(ql)?:\/\//.test(given)) return given;
  if (!/^[A-Za-z_][A-Za-z0-9_]{0,62}$/.test(given)) throw new Error(`"${given}" is not a database name (letters, digits and _ only).`);
  const admin = new URL(base);
  admin.pathname = "/postgres";
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    const exists = await client.query("select 1 from pg_database where datname = $1", [given]);
    if (exists.rowCount === 0) await client.query(`create database "${given}"`);
  } finally {
    await client.end();
  }
  const url = new URL(base);
  url.pathname = `/${given}`;
  return url.toString();
}

async function restore(file: string | undefined, into: string | undefined): Promise<string> {
  if (!file) throw new Error("usage: npm run db:restore FILE [DATABASE]");
  if (!fs.existsSync(file)) throw new Error(`There is no backup file ${file}.`);
  const url = await target(await localDatabaseUrl(serviceConfig("dev")), into);
  runTool(tool("pg_restore"), ["--clean", "--if-exists", "--no-owner", "--exit-on-error", "--single-transaction", "--no-password", `--dbname=${url}`, file]);
  return nameOf(url);
}

async function main() {
  const [command, ...args] = process.argv.slice(2);
  if (command === "backup") {
    const file = await backup();
    console.log(`Backed up to:\n${file}`);
  } else if (command === "restore") {
    const name = await restore(args[0], args[1]);
    console.log(`Restored ${args[0]} into the database ${name}.`);
  } else {
    throw new Error("usage: tsx scripts/backup.ts backup | restore FILE [DATABASE]");
  }
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
