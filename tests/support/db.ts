// Test databases: DATABASE_URL is the integration database (emptied between tests); E2E_DATABASE_URL
// is the seeded database that the test server uses.
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/types";

export function integrationDb(): Kysely<Database> {
  return createDb(process.env.DATABASE_URL!, 4);
}

export function e2eDb(): Kysely<Database> {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error("E2E_DATABASE_URL is not set: run the tests with npm test");
  return createDb(url, 4);
}

/** Empties every application table (not the migration bookkeeping). */
export async function emptyTables(db: Kysely<Database>): Promise<void> {
  const tables = await sql<{ tablename: string }>`
    select tablename from pg_tables where schemaname = 'public' and tablename not like 'kysely_%'`.execute(db);
  if (tables.rows.length === 0) return;
  const list = tables.rows.map((t) => `"${t.tablename}"`).join(", ");
  await sql.raw(`truncate ${list} restart identity cascade`).execute(db);
}

let counter = 0;
/** A unique e-mail address for data a test creates in a shared database. */
export function uniqueEmail(tag: string): string {
  counter++;
  return `${tag}.${Date.now().toString(36)}${counter}${Math.random().toString(36).slice(2, 6)}@test.example`;
}
