import type { Kysely } from "kysely";

// The explicit close of a lab: late attempts are accepted until then. Null means the default close, the
// due date plus the days the late penalty takes to reach its floor (lib/labs/policy.ts `closeOf`), so the
// default follows the due date and the late rule when they change.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("labs").addColumn("closes_at", "timestamptz").execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("labs").dropColumn("closes_at").execute();
}
