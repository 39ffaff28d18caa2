import { type Kysely, sql } from "kysely";

// One student's exception to a lab's rules, granted by the instructor with a reason: their own due date,
// their own close and/or extra attempts. The grading policy uses them for that student only.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("lab_exceptions")
    .addColumn("lab_id", "uuid", (c) => c.notNull().references("labs.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("due_at", "timestamptz")
    .addColumn("closes_at", "timestamptz")
    .addColumn("extra_attempts", "integer", (c) => c.notNull().defaultTo(0).check(sql`extra_attempts between 0 and 100`))
    .addColumn("reason", "text", (c) => c.notNull().check(sql`length(reason) between 1 and 500`))
    .addColumn("granted_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("granted_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("lab_exceptions_pkey", ["lab_id", "user_id"])
    .execute();
  // the grade history records granting, changing and removing an exception on the student's attempts
  await sql`alter table grade_events drop constraint grade_events_kind_check`.execute(db);
  await sql`alter table grade_events add constraint grade_events_kind_check check (kind in ('graded', 'recomputed', 'override', 'rerun', 'review_answer', 'exception'))`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  // the history is append-only: rows of the newer kind stay, unchecked
  await sql`alter table grade_events drop constraint grade_events_kind_check`.execute(db);
  await sql`alter table grade_events add constraint grade_events_kind_check check (kind in ('graded', 'recomputed', 'override', 'rerun', 'review_answer')) not valid`.execute(db);
  await db.schema.dropTable("lab_exceptions").execute();
}
