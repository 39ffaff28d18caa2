import { type Kysely, sql } from "kysely";

// The benches of a course (a name such as "Bench 07", optionally a section) and who sits at them: each
// student at most one bench per course. A seat goes with the membership (removing a member unseats them)
// and with its bench.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("benches")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("course_id", "uuid", (c) => c.notNull().references("courses.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull().check(sql`length(name) between 1 and 40`))
    .addColumn("section", "text")
    .addColumn("position", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("benches_course_name_key", ["course_id", "name"])
    .execute();
  await db.schema
    .createTable("bench_seats")
    .addColumn("course_id", "uuid", (c) => c.notNull())
    .addColumn("user_id", "uuid", (c) => c.notNull())
    .addColumn("bench_id", "uuid", (c) => c.notNull().references("benches.id").onDelete("cascade"))
    .addPrimaryKeyConstraint("bench_seats_pkey", ["course_id", "user_id"])
    .addForeignKeyConstraint("bench_seats_membership_fkey", ["course_id", "user_id"], "memberships", ["course_id", "user_id"], (c) => c.onDelete("cascade"))
    .execute();
  await db.schema.createIndex("bench_seats_bench_idx").on("bench_seats").column("bench_id").execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("bench_seats").execute();
  await db.schema.dropTable("benches").execute();
}
