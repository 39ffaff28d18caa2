// The review queue: attempts whose student asked for a review, in one course. "Open" means asked and not
// answered since (a student may ask again after an answer).
import { sql } from "kysely";
import type { Db } from "../types";

export interface ReviewFilters {
  status: "open" | "answered" | "all";
  labId?: string;
  section?: string;
  /** at least one recognised mistake among the verdicts */
  mistake?: boolean;
  late?: boolean;
  changed?: boolean;
}

const isOpen = sql<boolean>`(a.review_answered_at is null or a.review_answered_at < a.review_requested_at)`;

export async function listReviews(db: Db, courseId: string, f: ReviewFilters) {
  let q = db
    .selectFrom("attempts as a")
    .innerJoin("labs as l", "l.id", "a.lab_id")
    .innerJoin("users as u", "u.id", "a.user_id")
    .leftJoin("memberships as m", (j) => j.onRef("m.course_id", "=", "l.course_id").onRef("m.user_id", "=", "a.user_id"))
    .leftJoin("users as ans", "ans.id", "a.review_answered_by")
    .select([
      "a.id as attemptId",
      "a.lab_id as labId",
      "l.title as labTitle",
      "u.id as studentId",
      "u.name as studentName",
      "m.section as section",
      "a.review_message as message",
      "a.review_requested_at as requestedAt",
      isOpen.as("open"),
      "a.review_answered_at as answeredAt",
      "ans.name as answeredBy",
      "a.score",
      "a.max_score as maxScore",
    ])
    .where("l.course_id", "=", courseId)
    .where("a.review_requested_at", "is not", null);
  if (f.status === "open") q = q.where(isOpen);
  if (f.status === "answered") q = q.where(sql<boolean>`not ${isOpen}`);
  if (f.labId) q = q.where("a.lab_id", "=", f.labId);
  if (f.section) q = q.where("m.section", "=", f.section);
  const hasMistake = sql<boolean>`jsonb_path_exists(a.result, '$.results[*] ? (@.verdict == "mistake")')`;
  if (f.mistake !== undefined) q = q.where(f.mistake ? hasMistake : sql<boolean>`not ${hasMistake}`);
  if (f.late !== undefined) q = q.where("a.late_days", f.late ? ">" : "=", 0);
  if (f.changed !== undefined) q = q.where("a.changed_by_staff", "=", f.changed);
  // open first, oldest request first; then answered, most recently answered first
  const rows = await q
    .orderBy(sql`case when ${isOpen} then 0 else 1 end`)
    .orderBy(sql`case when ${isOpen} then a.review_requested_at end`, "asc")
    .orderBy("a.review_answered_at", "desc")
    .orderBy("a.id")
    .execute();
  return rows.map((r) => ({
    attemptId: r.attemptId,
    labId: r.labId,
    labTitle: r.labTitle,
    student: { id: r.studentId, name: r.studentName, section: r.section },
    message: r.message,
    requestedAt: r.requestedAt as Date,
    status: r.open ? ("open" as const) : ("answered" as const),
    answeredAt: r.open ? null : r.answeredAt,
    answeredBy: r.open ? null : r.answeredBy,
    score: r.score,
    maxScore: r.maxScore,
  }));
}

export type ReviewItem = Awaited<ReturnType<typeof listReviews>>[number];

export async function countOpenReviews(db: Db, courseId: string): Promise<number> {
  const r = await db
    .selectFrom("attempts as a")
    .innerJoin("labs as l", "l.id", "a.lab_id")
    .select(sql<number>`count(*)::int`.as("n"))
    .where("l.course_id", "=", courseId)
    .where("a.review_requested_at", "is not", null)
    .where(isOpen)
    .executeTakeFirstOrThrow();
  return r.n;
}

/** The sections of a course's students, for the queue's section filter. */
export async function listSections(db: Db, courseId: string): Promise<string[]> {
  const rows = await db
    .selectFrom("memberships")
    .select("section")
    .distinct()
    .where("course_id", "=", courseId)
    .where("section", "is not", null)
    .orderBy("section")
    .execute();
  return rows.map((r) => r.section as string);
}
