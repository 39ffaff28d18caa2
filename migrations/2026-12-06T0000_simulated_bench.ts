import { type Kysely, sql } from "kysely";

// The simulated bench: per lab whether readings come from the real bench, the simulated one or either, and
// per attempt whether its readings came from the simulated bench.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("labs").addColumn("bench", "text", (c) => c.notNull().defaultTo("real")).execute();
  await sql`alter table labs add constraint labs_bench_check check (bench in ('real', 'simulated', 'either'))`.execute(db);
  await db.schema.alterTable("attempts").addColumn("simulated", "boolean", (c) => c.notNull().defaultTo(false)).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("attempts").dropColumn("simulated").execute();
  await sql`alter table labs drop constraint labs_bench_check`.execute(db);
  await db.schema.alterTable("labs").dropColumn("bench").execute();
}
