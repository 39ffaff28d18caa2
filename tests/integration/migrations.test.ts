import { describe, expect, it } from "vitest";
import { createDb } from "@/db";
import { migrator } from "@/db/migrator";

describe("migrations", () => {
  it("undo and redo cleanly (every up has a working down)", async () => {
    // A private database so the shared integration schema is not disturbed.
    const admin = createDb(process.env.DATABASE_URL!.replace(/\/[^/]+$/, "/postgres"), 1);
    const name = `shuntwise_migrations_${process.pid}`;
    const { sql } = await import("kysely");
    await sql.raw(`drop database if exists ${name} with (force)`).execute(admin);
    await sql.raw(`create database ${name}`).execute(admin);
    const db = createDb(process.env.DATABASE_URL!.replace(/\/[^/]+$/, `/${name}`), 1);
    try {
      const m = migrator(db);
      const up = await m.migrateToLatest();
      expect(up.error).toBeUndefined();
      const all = await m.getMigrations();
      for (let i = 0; i < all.length; i++) expect((await m.migrateDown()).error).toBeUndefined();
      const tables = await sql<{ n: number }>`select count(*)::int as n from pg_tables where schemaname = 'public' and tablename not like 'kysely_%'`.execute(db);
      expect(tables.rows[0].n).toBe(0);
      expect((await m.migrateToLatest()).error).toBeUndefined();
    } finally {
      await db.destroy();
      await sql.raw(`drop database if exists ${name} with (force)`).execute(admin);
      await admin.destroy();
    }
  });
});
