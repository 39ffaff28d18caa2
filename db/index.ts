// The one Kysely instance of the application. It connects lazily, on first use, from DATABASE_URL.
import { Kysely, PostgresDialect } from "kysely";
import { newPool } from "./pool";
import type { Database } from "./types";

export type { Database } from "./types";

const globalForDb = globalThis as unknown as { shuntwiseDb?: Kysely<Database> };

export function createDb(connectionString: string, max = 10): Kysely<Database> {
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool: newPool(connectionString, max) }) });
}

function connectionString(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set (npm start and npm test set it for you).");
  return url;
}

/** The shared instance; kept on globalThis so hot reloads in development do not open new pools. */
export const db: Kysely<Database> = new Proxy({} as Kysely<Database>, {
  get(_target, prop) {
    globalForDb.shuntwiseDb ??= createDb(connectionString());
    const value = Reflect.get(globalForDb.shuntwiseDb, prop);
    return typeof value === "function" ? value.bind(globalForDb.shuntwiseDb) : value;
  },
});
