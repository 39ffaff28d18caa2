import { type Kysely, sql } from "kysely";

// E-mail: one outbox row per mail event (unique key, so an event is queued and sent once), one-time
// password tokens, held grades per lab and the student's choice about graded e-mails.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("mail_outbox")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("key", "text", (c) => c.notNull().unique())
    .addColumn("kind", "text", (c) => c.notNull())
    .addColumn("to_address", "text", (c) => c.notNull())
    .addColumn("subject", "text")
    .addColumn("data", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("status", "text", (c) => c.notNull().defaultTo("queued").check(sql`status in ('queued', 'sent', 'failed')`))
    .addColumn("tries", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("last_error", "text")
    .addColumn("message_id", "text")
    .addColumn("job_id", "uuid")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("sent_at", "timestamptz")
    .addColumn("failed_at", "timestamptz")
    .execute();
  await db.schema.createIndex("mail_outbox_created_idx").on("mail_outbox").column("created_at").execute();
  await db.schema.createIndex("mail_outbox_to_idx").on("mail_outbox").column("to_address").execute();

  await db.schema
    .createTable("password_tokens")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("purpose", "text", (c) => c.notNull().check(sql`purpose in ('reset', 'set')`))
    .addColumn("expires_at", "timestamptz", (c) => c.notNull())
    .addColumn("used_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .alterTable("labs")
    .addColumn("grades_held", "boolean", (c) => c.notNull().defaultTo(false))
    .addColumn("grades_released_at", "timestamptz")
    .execute();
  await db.schema.alterTable("users").addColumn("grade_mail", "boolean", (c) => c.notNull().defaultTo(true)).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("users").dropColumn("grade_mail").execute();
  await db.schema.alterTable("labs").dropColumn("grades_held").dropColumn("grades_released_at").execute();
  await db.schema.dropTable("password_tokens").execute();
  await db.schema.dropTable("mail_outbox").execute();
}
