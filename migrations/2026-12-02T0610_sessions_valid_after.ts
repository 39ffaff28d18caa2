import { type Kysely } from "kysely";

// A per-user time before which every session is void: choosing a new password through an e-mailed link
// signs out every session that was open.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("users").addColumn("sessions_valid_after", "timestamptz").execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("users").dropColumn("sessions_valid_after").execute();
}
