import { type Kysely, sql } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("labs")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("course_id", "uuid", (c) => c.notNull().references("courses.id").onDelete("cascade"))
    .addColumn("title", "text", (c) => c.notNull())
    .addColumn("template_key", "text", (c) => c.notNull())
    .addColumn("status", "text", (c) => c.notNull().defaultTo("draft").check(sql`status in ('draft', 'published')`))
    // the parameter draw spec, the questions and the grading policy, as the grader's zod schemas define them
    .addColumn("spec", "jsonb", (c) => c.notNull())
    .addColumn("questions", "jsonb", (c) => c.notNull())
    .addColumn("policy", "jsonb", (c) => c.notNull())
    .addColumn("attempts_allowed", "integer", (c) => c.notNull().defaultTo(3))
    .addColumn("counting", "text", (c) => c.notNull().defaultTo("best").check(sql`counting in ('best', 'last')`))
    .addColumn("opens_at", "timestamptz")
    .addColumn("due_at", "timestamptz")
    .addColumn("late_penalty_percent_per_day", "real", (c) => c.notNull().defaultTo(0))
    .addColumn("late_floor_percent", "real", (c) => c.notNull().defaultTo(0))
    .addColumn("show_expected", "text", (c) =>
      c.notNull().defaultTo("after_due").check(sql`show_expected in ('after_attempt', 'after_due', 'never')`),
    )
    .addColumn("instructions", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("safety_notes", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("version", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("published_at", "timestamptz")
    .execute();
  await db.schema.createIndex("labs_course_idx").on("labs").column("course_id").execute();

  // Each student's own circuit values, drawn once from the lab's spec with the seed `${labId}:${userId}`.
  await db.schema
    .createTable("lab_variants")
    .addColumn("lab_id", "uuid", (c) => c.notNull().references("labs.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("seed", "text", (c) => c.notNull())
    .addColumn("params", "jsonb", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("lab_variants_pkey", ["lab_id", "user_id"])
    .execute();

  await db.schema
    .createTable("uploads")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("owner_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("course_id", "uuid", (c) => c.notNull().references("courses.id").onDelete("cascade"))
    .addColumn("lab_id", "uuid", (c) => c.references("labs.id").onDelete("cascade"))
    .addColumn("kind", "text", (c) => c.notNull().check(sql`kind in ('image', 'trace')`))
    .addColumn("content_type", "text", (c) => c.notNull())
    .addColumn("size", "integer", (c) => c.notNull())
    .addColumn("sha256", "text", (c) => c.notNull())
    .addColumn("storage_key", "text", (c) => c.notNull().unique())
    .addColumn("original_name", "text", (c) => c.notNull())
    .addColumn("analysis", "jsonb")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable("attempts")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("lab_id", "uuid", (c) => c.notNull().references("labs.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("number", "integer", (c) => c.notNull())
    .addColumn("idempotency_key", "text", (c) => c.notNull())
    .addColumn("readings", "jsonb", (c) => c.notNull())
    .addColumn("measured", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("upload_ids", sql`uuid[]`, (c) => c.notNull().defaultTo(sql`'{}'::uuid[]`))
    .addColumn("result", "jsonb", (c) => c.notNull())
    .addColumn("raw_score", "real", (c) => c.notNull())
    .addColumn("max_score", "real", (c) => c.notNull())
    .addColumn("late_days", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("penalty_percent", "real", (c) => c.notNull().defaultTo(0))
    .addColumn("score", "real", (c) => c.notNull())
    .addColumn("grader_version", "text", (c) => c.notNull())
    .addColumn("lab_version", "integer", (c) => c.notNull())
    .addColumn("submitted_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("graded_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("review_requested_at", "timestamptz")
    .addColumn("review_message", "text")
    .addUniqueConstraint("attempts_idempotency_key", ["lab_id", "user_id", "idempotency_key"])
    .addUniqueConstraint("attempts_number_key", ["lab_id", "user_id", "number"])
    .execute();
  await db.schema.createIndex("attempts_lab_user_idx").on("attempts").columns(["lab_id", "user_id"]).execute();

  // Recomputing every attempt after a published lab changes runs as a background job; this row is its progress.
  await db.schema
    .createTable("lab_regrades")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("lab_id", "uuid", (c) => c.notNull().references("labs.id").onDelete("cascade"))
    .addColumn("lab_version", "integer", (c) => c.notNull())
    .addColumn("status", "text", (c) => c.notNull().defaultTo("queued").check(sql`status in ('queued', 'running', 'done', 'failed')`))
    .addColumn("total", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("done", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("finished_at", "timestamptz")
    .execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("lab_regrades").execute();
  await db.schema.dropTable("attempts").execute();
  await db.schema.dropTable("uploads").execute();
  await db.schema.dropTable("lab_variants").execute();
  await db.schema.dropTable("labs").execute();
}
