// The demo seed queues a few graded e-mails (delivered by the app's worker), and seeding again adds none.
import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { DEMO_DOMAIN, seedDemo } from "@/scripts/seed/demo";

describe("the demo seed's e-mails", () => {
  it("queues graded messages for the demo student logins, each with its job, once", async () => {
    await seedDemo(db, { mailDatabaseUrl: process.env.DATABASE_URL });
    const rows = await db.selectFrom("mail_outbox").select(["id", "to_address", "kind", "job_id"]).execute();
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(new Set(rows.map((r) => r.to_address))).toEqual(new Set([`student.one@${DEMO_DOMAIN}`, `student.two@${DEMO_DOMAIN}`]));
    for (const r of rows) {
      const jobs = await sql<{ n: number }>`select count(*)::int as n from pgboss.job where data->>'outboxId' = ${r.id}`.execute(db);
      expect(jobs.rows[0].n).toBe(1);
    }
    await seedDemo(db, { mailDatabaseUrl: process.env.DATABASE_URL });
    expect(await db.selectFrom("mail_outbox").select("id").execute()).toHaveLength(rows.length);
  });
});
