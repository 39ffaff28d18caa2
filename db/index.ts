// The one Kysely instance of the application. It connects lazily, on first use, from DATABASE_URL.
import { Kysely, PostgresDialect } from "kysely";
import { newPool, withNamedStatements } from "./pool";
import type { Database } from "./types";

export type { Database, Db } from "./types";

const globalForDb = globalThis as unknown as { shuntwiseDb?: Kysely<Database> };

export function createDb(connectionString: string, max = 10): Kysely<Database> {
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool: withNamedStatements(newPool(connectionString, max)) }) });
}

/**
 * Connections the app's pool may open (SHUNTWISE_DB_POOL_MAX, default 10). A request holds one only while
 * a statement or its transaction runs, so a pool well under the number of requests in flight suffices;
 * each app process opens its own, and PostgreSQL's max_connections (100 by default) bounds them all.
 */
export function poolMax(raw = process.env.SHUNTWISE_DB_POOL_MAX): number {
  if (raw === undefined || raw === "") return 10;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1 || n > 1000) throw new Error(`SHUNTWISE_DB_POOL_MAX must be a whole number from 1 to 1000, got "${raw}"`);
  return n;
}

function connectionString(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set (npm start and npm test set it for you).");
  return url;
}

/** The shared instance; kept on globalThis so hot reloads in development do not open new pools. */
export const db: Kysely<Database> = new Proxy({} as Kysely<Database>, {
  get(_target, prop) {
    globalForDb.shuntwiseDb ??= createDb(connectionString(), poolMax());
    const value = Reflect.get(globalForDb.shuntwiseDb, prop);
    return typeof value === "function" ? value.bind(globalForDb.shuntwiseDb) : value;
  },
});
