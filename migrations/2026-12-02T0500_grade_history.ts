import { type Kysely, sql } from "kysely";

// Review and regrade: the staff's answer to a review request, the staff's per-question points (kept when
// a lab edit recomputes the attempt), and one append-only history of every grading event. PostgreSQL
// itself refuses to rewrite that history: a trigger raises on every UPDATE, and on every DELETE except
// the cascade that removes an attempt (the history goes with the attempt it describes).
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable("attempts")
    .addColumn("review_answer", "text")
    .addColumn("review_answered_at", "timestamptz")
    .addColumn("review_answered_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("changed_by_staff", "boolean", (c) => c.notNull().defaultTo(false))
    // { [questionId]: { points, reason, by, at } }: points set by staff, applied over the grader's
    .addColumn("overrides", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .execute();
  await sql`create index attempts_review_requested_idx on attempts (review_requested_at) where review_requested_at is not null`.execute(db);

  await db.schema
    .createTable("grade_events")
    .addColumn("id", "bigint", (c) => c.primaryKey().generatedAlwaysAsIdentity())
    .addColumn("attempt_id", "uuid", (c) => c.notNull().references("attempts.id").onDelete("cascade"))
    .addColumn("question_id", "text")
    .addColumn("kind", "text", (c) => c.notNull().check(sql`kind in ('graded', 'recomputed', 'override', 'rerun', 'review_answer')`))
    // no cascade: an action on the history must not be rewritten when an account goes
    .addColumn("actor_id", "uuid", (c) => c.references("users.id"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`clock_timestamp()`))
    .addColumn("points_before", "real")
    .addColumn("points_after", "real")
    .addColumn("score_before", "real")
    .addColumn("score_after", "real")
    .addColumn("reason", "text")
    .addColumn("grader_version", "text")
    .execute();
  await db.schema.createIndex("grade_events_attempt_idx").on("grade_events").columns(["attempt_id", "id"]).execute();

  await sql`
    create function grade_events_append_only() returns trigger language plpgsql as $$
    begin
      if tg_op = 'DELETE' and not exists (select 1 from attempts where id = old.attempt_id) then
        return old;
      end if;
      raise exception 'grade_events is append-only: % is not allowed', tg_op using errcode = 'insufficient_privilege';
    end
    $$`.execute(db);
  await sql`
    create trigger grade_events_append_only before update or delete on grade_events
    for each row execute function grade_events_append_only()`.execute(db);

  // Attempts graded before this table existed get their first event, so every attempt has a history.
  await sql`
    insert into grade_events (attempt_id, kind, created_at, points_before, points_after, score_before, score_after, grader_version)
    select id, 'graded', submitted_at, null, raw_score, null, score, grader_version from attempts order by submitted_at`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("grade_events").execute();
  await sql`drop function grade_events_append_only()`.execute(db);
  await sql`drop index attempts_review_requested_idx`.execute(db);
  await db.schema
    .alterTable("attempts")
    .dropColumn("overrides")
    .dropColumn("changed_by_staff")
    .dropColumn("review_answered_by")
    .dropColumn("review_answered_at")
    .dropColumn("review_answer")
    .execute();
}
