import { type Kysely, sql } from "kysely";

// Which lessons a course shows, in which order, and from when. A course without rows shows every
// lesson in the syllabus order, open at once.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("course_lessons")
    .addColumn("course_id", "uuid", (c) => c.notNull().references("courses.id").onDelete("cascade"))
    .addColumn("slug", "text", (c) => c.notNull())
    .addColumn("position", "integer", (c) => c.notNull())
    .addColumn("visible", "boolean", (c) => c.notNull().defaultTo(true))
    .addColumn("opens_at", "timestamptz")
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("course_lessons_pkey", ["course_id", "slug"])
    .execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("course_lessons").execute();
}
