import { type Kysely, sql } from "kysely";

// Server-side sessions: a row per signed-in browser (the cookie names it), so signing out ends it on the
// server and a copied cookie stops working; and accounts the site admin can disable.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("sessions")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("last_seen_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("user_agent", "text")
    .execute();
  await db.schema.createIndex("sessions_user_idx").on("sessions").column("user_id").execute();
  await db.schema.alterTable("users").addColumn("disabled_at", "timestamptz").execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("users").dropColumn("disabled_at").execute();
  await db.schema.dropTable("sessions").execute();
}
