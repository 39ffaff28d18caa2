// What the course home pages summarise: a student's attempts per lab, and for the staff the review
// requests, submissions per lab and recomputations in progress.
import { sql, type Kysely } from "kysely";
import type { Database } from "../types";

type Db = Kysely<Database>;

/** A student's attempts in every lab of a course (scores only). */
export async function studentAttemptScores(db: Db, courseId: string, userId: string) {
  return db
    .selectFrom("attempts as a")
    .innerJoin("labs as l", "l.id", "a.lab_id")
    .select(["a.id", "a.lab_id as labId", "a.number", "a.score", "a.max_score as maxScore", "a.submitted_at as submittedAt"])
    .where("l.course_id", "=", courseId)
    .where("a.user_id", "=", userId)
    .orderBy("a.number")
    .execute();
}

/** A student's review requests in a course, newest first. */
export async function studentReviewRequests(db: Db, courseId: string, userId: string) {
  return db
    .selectFrom("attempts as a")
    .innerJoin("labs as l", "l.id", "a.lab_id")
    .select([
      "a.id as attemptId",
      "a.number",
      "l.title as labTitle",
      "a.review_requested_at as requestedAt",
      "a.review_message as message",
      "a.review_answer as answer",
      "a.review_answered_at as answeredAt",
    ])
    .where("l.course_id", "=", courseId)
    .where("a.user_id", "=", userId)
    .where("a.review_requested_at", "is not", null)
    .orderBy("a.review_requested_at", "desc")
    .limit(5)
    .execute();
}

/**
 * Attempts of current students whose review is open (asked for, and not answered since it was asked),
 * oldest first.
 */
export async function openReviewRequests(db: Db, courseId: string) {
  return db
    .selectFrom("attempts as a")
    .innerJoin("labs as l", "l.id", "a.lab_id")
    .innerJoin("users as u", "u.id", "a.user_id")
    .innerJoin("memberships as m", (j) => j.onRef("m.user_id", "=", "a.user_id").onRef("m.course_id", "=", "l.course_id"))
    .select(["a.id as attemptId", "a.number", "l.title as labTitle", "u.name as studentName", "a.review_requested_at as requestedAt"])
    .where("l.course_id", "=", courseId)
    .where("a.review_requested_at", "is not", null)
    .where((eb) => eb.or([eb("a.review_answered_at", "is", null), eb("a.review_answered_at", "<", eb.ref("a.review_requested_at"))]))
    .orderBy("a.review_requested_at", "asc")
    .execute();
}

/**
 * Published labs that have a due date or an explicit close and have not explicitly closed before `from`,
 * with how many of the course's students submitted. The caller works out each lab's close (the explicit
 * one, else the default from the late policy: lib/labs/policy.ts closeOf).
 */
export async function labsWithDates(db: Db, courseId: string, from: Date) {
  const rows = await db
    .selectFrom("labs as l")
    .select((eb) => [
      "l.id",
      "l.title",
      "l.due_at as dueAt",
      "l.closes_at as closesAt",
      "l.late_penalty_percent_per_day as latePenaltyPercentPerDay",
      "l.late_floor_percent as lateFloorPercent",
      eb
        .selectFrom("attempts as a")
        .innerJoin("memberships as m", (j) => j.onRef("m.user_id", "=", "a.user_id").on("m.role", "=", "student"))
        .whereRef("a.lab_id", "=", "l.id")
        .whereRef("m.course_id", "=", "l.course_id")
        .select(sql<string>`count(distinct a.user_id)`.as("n"))
        .as("submitted"),
      eb
        .selectFrom("memberships as m")
        .whereRef("m.course_id", "=", "l.course_id")
        .where("m.role", "=", "student")
        .select((e) => e.fn.countAll<string>().as("n"))
        .as("students"),
    ])
    .where("l.course_id", "=", courseId)
    .where("l.status", "=", "published")
    .where((eb) => eb.or([eb("l.closes_at", ">=", from), eb.and([eb("l.closes_at", "is", null), eb("l.due_at", "is not", null)])]))
    .orderBy("l.due_at")
    .execute();
  return rows.map((r) => {
    const submitted = Number(r.submitted ?? 0);
    const students = Number(r.students ?? 0);
    return {
      id: r.id,
      title: r.title,
      dueAt: r.dueAt as Date | null,
      closesAt: r.closesAt as Date | null,
      latePenaltyPercentPerDay: r.latePenaltyPercentPerDay,
      lateFloorPercent: r.lateFloorPercent,
      submitted,
      missing: Math.max(0, students - submitted),
    };
  });
}

/** Recomputations of the course's labs that are queued or running. */
export async function regradesInProgress(db: Db, courseId: string) {
  return db
    .selectFrom("lab_regrades as r")
    .innerJoin("labs as l", "l.id", "r.lab_id")
    .select(["r.id", "l.id as labId", "l.title", "r.status", "r.total", "r.done", "r.created_at as startedAt"])
    .where("l.course_id", "=", courseId)
    .where("r.status", "in", ["queued", "running"])
    .orderBy("r.created_at")
    .execute();
}

/** The course's labs still in draft, for the staff's to-do list. */
export async function draftLabs(db: Db, courseId: string) {
  return db.selectFrom("labs").select(["id", "title"]).where("course_id", "=", courseId).where("status", "=", "draft").orderBy("created_at").execute();
}
