// Uploads sent straight to object storage in parts (issue 26). A row exists from the moment the upload is
// asked for ("pending", its size the size claimed, which the quota counts), is "analysing" once the
// parts are completed and checked (size and type read back from storage), and "ready" when the job has
// written its results, or "failed" with the reason. `multipart_id` is the store's id of the open
// multipart upload; `samples` locates the compact binary copy of a trace's samples (for zooming).
import { sql, type Kysely } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable("uploads")
    .addColumn("status", "text", (c) => c.notNull().defaultTo("ready").check(sql`status in ('pending', 'completing', 'analysing', 'ready', 'failed')`))
    .addColumn("multipart_id", "text")
    .addColumn("progress", "real")
    .addColumn("failure", "text")
    .addColumn("samples", "jsonb")
    .execute();
  await db.schema.alterTable("uploads").alterColumn("sha256", (c) => c.dropNotNull()).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.deleteFrom("uploads").where("sha256", "is", null).execute();
  await db.schema.alterTable("uploads").alterColumn("sha256", (c) => c.setNotNull()).execute();
  await db.schema.alterTable("uploads").dropColumn("samples").dropColumn("failure").dropColumn("progress").dropColumn("multipart_id").dropColumn("status").execute();
}
