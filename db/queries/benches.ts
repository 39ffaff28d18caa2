// Benches of a course and who sits at them.
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

export interface BenchMember {
  userId: string;
  name: string;
  /** the member's own section (listArrangement only) */
  section?: string | null;
}

export interface BenchRow {
  id: string;
  name: string;
  section: string | null;
  members: BenchMember[];
}

export interface UnseatedStudent {
  userId: string;
  name: string;
  section: string | null;
}

/** Every bench of the course in the instructor's order with its members (by name), and the students at no bench. */
export async function listArrangement(db: Db, courseId: string): Promise<{ benches: BenchRow[]; unseated: UnseatedStudent[] }> {
  const [benches, seats, unseated] = await Promise.all([
    db.selectFrom("benches").select(["id", "name", "section"]).where("course_id", "=", courseId).orderBy("position").orderBy("name").execute(),
    db
      .selectFrom("bench_seats as s")
      .innerJoin("users as u", "u.id", "s.user_id")
      .innerJoin("memberships as m", (j) => j.onRef("m.course_id", "=", "s.course_id").onRef("m.user_id", "=", "s.user_id"))
      .select(["s.bench_id as benchId", "u.id as userId", "u.name", "m.section"])
      .where("s.course_id", "=", courseId)
      .orderBy("u.name")
      .execute(),
    db
      .selectFrom("memberships as m")
      .innerJoin("users as u", "u.id", "m.user_id")
      .leftJoin("bench_seats as s", (j) => j.onRef("s.course_id", "=", "m.course_id").onRef("s.user_id", "=", "m.user_id"))
      .select(["u.id as userId", "u.name", "m.section"])
      .where("m.course_id", "=", courseId)
      .where("m.role", "=", "student")
      .where("s.user_id", "is", null)
      .orderBy("m.section")
      .orderBy("u.name")
      .execute(),
  ]);
  const byBench = new Map<string, BenchMember[]>();
  for (const s of seats) {
    const list = byBench.get(s.benchId) ?? [];
    list.push({ userId: s.userId, name: s.name, section: s.section });
    byBench.set(s.benchId, list);
  }
  return { benches: benches.map((b) => ({ ...b, members: byBench.get(b.id) ?? [] })), unseated };
}

/** Of these user ids, the students of the course. */
export async function studentsAmong(db: Db, courseId: string, userIds: string[]): Promise<Set<string>> {
  if (!userIds.length) return new Set();
  const rows = await db
    .selectFrom("memberships")
    .select("user_id")
    .where("course_id", "=", courseId)
    .where("role", "=", "student")
    .where("user_id", "in", userIds)
    .execute();
  return new Set(rows.map((r) => r.user_id));
}

export interface BenchWrite {
  name: string;
  section: string | null;
  memberIds: string[];
}

/**
 * Replaces the course's arrangement (call in a transaction that locked the course): a bench keeps its id
 * when its name stays, so what was recorded at it stays with it; benches no longer named are removed.
 */
export async function replaceArrangement(trx: Transaction<Database>, courseId: string, benches: BenchWrite[]): Promise<void> {
  await trx.deleteFrom("bench_seats").where("course_id", "=", courseId).execute();
  const names = benches.map((b) => b.name);
  let del = trx.deleteFrom("benches").where("course_id", "=", courseId);
  if (names.length) del = del.where("name", "not in", names);
  await del.execute();
  if (!benches.length) return;
  const stored = await trx
    .insertInto("benches")
    .values(benches.map((b, i) => ({ course_id: courseId, name: b.name, section: b.section, position: i })))
    .onConflict((oc) => oc.constraint("benches_course_name_key").doUpdateSet({ section: sql`excluded.section`, position: sql`excluded.position` }))
    .returning(["id", "name"])
    .execute();
  const ids = new Map(stored.map((s) => [s.name, s.id]));
  const seats = benches.flatMap((b) => b.memberIds.map((userId) => ({ course_id: courseId, user_id: userId, bench_id: ids.get(b.name)! })));
  if (seats.length) await trx.insertInto("bench_seats").values(seats).execute();
}

/** Seats students at benches by name, creating a bench that does not exist yet (the roster import). */
export async function seatByName(trx: Transaction<Database>, courseId: string, seats: { userId: string; bench: string; section: string | null }[]): Promise<void> {
  if (!seats.length) return;
  const names = [...new Set(seats.map((s) => s.bench))];
  const top = await trx.selectFrom("benches").select(sql<number>`coalesce(max(position), -1)::int`.as("p")).where("course_id", "=", courseId).executeTakeFirstOrThrow();
  await trx
    .insertInto("benches")
    .values(names.map((name, i) => ({ course_id: courseId, name, section: seats.find((s) => s.bench === name)!.section, position: top.p + 1 + i })))
    .onConflict((oc) => oc.constraint("benches_course_name_key").doNothing())
    .execute();
  const rows = await trx.selectFrom("benches").select(["id", "name"]).where("course_id", "=", courseId).where("name", "in", names).execute();
  const ids = new Map(rows.map((r) => [r.name, r.id]));
  await trx
    .insertInto("bench_seats")
    .values(seats.map((s) => ({ course_id: courseId, user_id: s.userId, bench_id: ids.get(s.bench)! })))
    .onConflict((oc) => oc.columns(["course_id", "user_id"]).doUpdateSet({ bench_id: sql`excluded.bench_id` }))
    .execute();
}

/** How many sit at each bench of the course, by bench name. */
export async function seatCounts(db: Db, courseId: string): Promise<Map<string, number>> {
  const rows = await db
    .selectFrom("benches as b")
    .leftJoin("bench_seats as s", "s.bench_id", "b.id")
    .select(["b.name", sql<number>`count(s.user_id)::int`.as("n")])
    .where("b.course_id", "=", courseId)
    .groupBy("b.name")
    .execute();
  return new Map(rows.map((r) => [r.name, r.n]));
}

/** The student's bench in the course with everyone seated there (the student too), or null. */
export async function benchOf(db: Db, courseId: string, userId: string): Promise<BenchRow | null> {
  const rows = await db
    .selectFrom("bench_seats as me")
    .innerJoin("benches as b", "b.id", "me.bench_id")
    .innerJoin("bench_seats as s", "s.bench_id", "b.id")
    .innerJoin("users as u", "u.id", "s.user_id")
    .select(["b.id", "b.name", "b.section", "u.id as userId", "u.name as memberName"])
    .where("me.course_id", "=", courseId)
    .where("me.user_id", "=", userId)
    .orderBy("u.name")
    .execute();
  if (!rows.length) return null;
  return { id: rows[0].id, name: rows[0].name, section: rows[0].section, members: rows.map((r) => ({ userId: r.userId, name: r.memberName })) };
}
