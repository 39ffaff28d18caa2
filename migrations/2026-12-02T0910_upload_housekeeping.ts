// Indexes for upload housekeeping: the per-user storage quota sums an owner's uploads, and the sweep of
// uploads never attached to an attempt looks them up by age (lib/uploads.ts).
import type { Kysely } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.createIndex("uploads_owner_idx").on("uploads").columns(["owner_id"]).execute();
  await db.schema.createIndex("uploads_created_idx").on("uploads").columns(["created_at"]).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex("uploads_created_idx").execute();
  await db.schema.dropIndex("uploads_owner_idx").execute();
}
