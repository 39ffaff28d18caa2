import { type Kysely, sql } from "kysely";

// The gradebook reads every attempt of a course's labs: per (lab, student) the count, whether a review is
// open and the counted attempt. This index carries those columns, so PostgreSQL finds a lab's attempts in
// the index and reads them from it alone (an index-only scan once the table is vacuumed) instead of
// scanning the whole attempts table of every course. It starts with (lab_id, user_id), so it replaces
// attempts_lab_user_idx (and attempts_number_key, unique on the same three columns, stays the constraint).
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index attempts_gradebook_idx on attempts (lab_id, user_id, number)
    include (score, max_score, late_days, changed_by_staff, review_requested_at, review_answered_at, id)`.execute(db);
  await sql`drop index attempts_lab_user_idx`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.createIndex("attempts_lab_user_idx").on("attempts").columns(["lab_id", "user_id"]).execute();
  await sql`drop index attempts_gradebook_idx`.execute(db);
}
