import { type Kysely, sql } from "kysely";

// Course settings: whether the join code still admits students, and the late policy new labs start with.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable("courses")
    .addColumn("joining_open", "boolean", (c) => c.notNull().defaultTo(true))
    .addColumn("default_late_penalty_percent_per_day", "real", (c) => c.notNull().defaultTo(10))
    .addColumn("default_late_floor_percent", "real", (c) => c.notNull().defaultTo(50))
    .addColumn("copied_from", "uuid", (c) => c.references("courses.id").onDelete("set null"))
    .execute();
  await sql`alter table courses add constraint courses_default_late_check
    check (default_late_penalty_percent_per_day between 0 and 100 and default_late_floor_percent between 0 and 100)`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table courses drop constraint courses_default_late_check`.execute(db);
  await db.schema
    .alterTable("courses")
    .dropColumn("copied_from")
    .dropColumn("default_late_floor_percent")
    .dropColumn("default_late_penalty_percent_per_day")
    .dropColumn("joining_open")
    .execute();
}
