// Graded attempts. Readings, measured values and the grade are stored together in one row.
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database, StaffOverride } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

const ATTEMPT_COLUMNS = [
  "a.id",
  "a.lab_id as labId",
  "a.user_id as userId",
  "a.number",
  "a.readings",
  "a.measured",
  "a.upload_ids as uploadIds",
  "a.result",
  "a.raw_score as rawScore",
  "a.max_score as maxScore",
  "a.late_days as lateDays",
  "a.penalty_percent as penaltyPercent",
  "a.score",
  "a.grader_version as graderVersion",
  "a.lab_version as labVersion",
  "a.submitted_at as submittedAt",
  "a.graded_at as gradedAt",
  "a.review_requested_at as reviewRequestedAt",
  "a.review_message as reviewMessage",
  "a.review_answer as reviewAnswer",
  "a.review_answered_at as reviewAnsweredAt",
  "a.review_answered_by as reviewAnsweredBy",
  "a.changed_by_staff as changedByStaff",
  "a.overrides",
  "a.simulated",
] as const;

export async function findAttempt(db: Db, attemptId: string) {
  return db.selectFrom("attempts as a").select(ATTEMPT_COLUMNS).where("a.id", "=", attemptId).executeTakeFirst();
}

export type AttemptRow = NonNullable<Awaited<ReturnType<typeof findAttempt>>>;

export async function listAttempts(db: Db, labId: string, userId?: string) {
  let q = db
    .selectFrom("attempts as a")
    .innerJoin("users as u", "u.id", "a.user_id")
    .select([...ATTEMPT_COLUMNS, "u.name as studentName"])
    .where("a.lab_id", "=", labId);
  if (userId) q = q.where("a.user_id", "=", userId);
  return q.orderBy("u.name").orderBy("a.number").execute();
}

export async function countAttempts(db: Db, labId: string, userId: string): Promise<number> {
  const r = await db
    .selectFrom("attempts")
    .select(sql<number>`count(*)::int`.as("n"))
    .where("lab_id", "=", labId)
    .where("user_id", "=", userId)
    .executeTakeFirstOrThrow();
  return r.n;
}

/** Every attempt of a lab, all students together. */
export async function countLabAttempts(db: Db, labId: string): Promise<number> {
  const r = await db.selectFrom("attempts").select(sql<number>`count(*)::int`.as("n")).where("lab_id", "=", labId).executeTakeFirstOrThrow();
  return r.n;
}

/** Serialises submissions of one student to one lab for the rest of the transaction. */
export async function lockStudentLab(trx: Transaction<Database>, labId: string, userId: string) {
  await sql`select pg_advisory_xact_lock(hashtext(${labId}), hashtext(${userId}))`.execute(trx);
}

export interface AttemptWrite {
  labId: string;
  userId: string;
  number: number;
  idempotencyKey: string;
  readings: unknown;
  measured: unknown;
  uploadIds: string[];
  result: unknown;
  rawScore: number;
  maxScore: number;
  lateDays: number;
  penaltyPercent: number;
  score: number;
  graderVersion: string;
  labVersion: number;
  submittedAt: Date;
  /** the readings came from the simulated bench */
  simulated?: boolean;
}

function attemptValues(a: AttemptWrite) {
  return {
    lab_id: a.labId,
    user_id: a.userId,
    number: a.number,
    idempotency_key: a.idempotencyKey,
    readings: JSON.stringify(a.readings),
    measured: JSON.stringify(a.measured),
    upload_ids: a.uploadIds,
    result: JSON.stringify(a.result),
    raw_score: a.rawScore,
    max_score: a.maxScore,
    late_days: a.lateDays,
    penalty_percent: a.penaltyPercent,
    score: a.score,
    grader_version: a.graderVersion,
    lab_version: a.labVersion,
    submitted_at: a.submittedAt,
    graded_at: a.submittedAt,
    simulated: a.simulated ?? false,
  };
}

export async function insertAttempt(db: Db, a: AttemptWrite): Promise<string> {
  const row = await db.insertInto("attempts").values(attemptValues(a)).returning("id").executeTakeFirstOrThrow();
  return row.id;
}

/**
 * A submission's reads after its lock (lockStudentLab), in one statement: the attempt already made with
 * this idempotency key (null when none), how many attempts the student has made at the lab, their stored
 * circuit values (null until drawn), whether the lab's grades are held and whether the student takes
 * graded-attempt e-mails.
 */
export async function submissionState(trx: Transaction<Database>, labId: string, userId: string, key: string) {
  const row = await trx
    .selectFrom(sql<{ one: number }>`(values (1))`.as("one"))
    .leftJoin("attempts as a", (j) => j.on("a.lab_id", "=", labId).on("a.user_id", "=", userId).on("a.idempotency_key", "=", key))
    .select(ATTEMPT_COLUMNS)
    .select((eb) => [
      eb.selectFrom("attempts").select(sql<number>`count(*)::int`.as("n")).where("lab_id", "=", labId).where("user_id", "=", userId).as("used"),
      eb.selectFrom("lab_variants").select("params").where("lab_id", "=", labId).where("user_id", "=", userId).as("params"),
      eb.selectFrom("labs").select("grades_held").where("id", "=", labId).as("gradesHeld"),
      eb.selectFrom("users").select("grade_mail").where("id", "=", userId).as("gradeMail"),
    ])
    .executeTakeFirstOrThrow();
  const { used, params, gradesHeld, gradeMail, ...attempt } = row;
  return {
    previous: attempt.id === null ? null : (attempt as AttemptRow),
    used: used ?? 0,
    params: params ?? null,
    gradesHeld: gradesHeld ?? false,
    gradeMail: gradeMail ?? true,
  };
}

/** A new attempt and its first grade event (graded by the grader), in one statement; answers the stored attempt. */
export async function insertGradedAttempt(trx: Transaction<Database>, a: AttemptWrite): Promise<AttemptRow> {
  return trx
    .with("inserted", (db) => db.insertInto("attempts").values(attemptValues(a)).returningAll())
    .with("event", (db) =>
      db
        .insertInto("grade_events")
        .columns(["attempt_id", "kind", "points_after", "score_after", "grader_version"])
        .expression((eb) => eb.selectFrom("inserted").select(["id", sql.lit("graded").as("kind"), "raw_score", "score", "grader_version"])),
    )
    .selectFrom("inserted as a")
    .select(ATTEMPT_COLUMNS)
    .executeTakeFirstOrThrow();
}

/** The attempt, locked until the transaction ends: concurrent grade changes to one attempt run one after another. */
export async function lockAttempt(trx: Transaction<Database>, attemptId: string) {
  return trx.selectFrom("attempts as a").select(ATTEMPT_COLUMNS).where("a.id", "=", attemptId).forUpdate().executeTakeFirst();
}

export async function updateAttemptGrade(
  db: Db,
  attemptId: string,
  g: {
    result: unknown;
    rawScore: number;
    maxScore: number;
    score: number;
    graderVersion: string;
    labVersion: number;
    overrides?: Record<string, StaffOverride>;
    changedByStaff?: boolean;
  },
) {
  await db
    .updateTable("attempts")
    .set({
      result: JSON.stringify(g.result),
      raw_score: g.rawScore,
      max_score: g.maxScore,
      score: g.score,
      grader_version: g.graderVersion,
      lab_version: g.labVersion,
      graded_at: new Date(),
      ...(g.overrides ? { overrides: JSON.stringify(g.overrides) } : {}),
      ...(g.changedByStaff ? { changed_by_staff: true } : {}),
    })
    .where("id", "=", attemptId)
    .execute();
}

export async function answerReview(db: Db, attemptId: string, answer: string, byUserId: string, at: Date) {
  await db
    .updateTable("attempts")
    .set({ review_answer: answer, review_answered_at: at, review_answered_by: byUserId })
    .where("id", "=", attemptId)
    .execute();
}

export async function requestReview(db: Db, attemptId: string, message: string) {
  await db.updateTable("attempts").set({ review_requested_at: new Date(), review_message: message }).where("id", "=", attemptId).execute();
}

/** A new late penalty on an attempt (its own due date changed): late days, penalty and the score from its raw score. */
export async function setAttemptPenalty(db: Db, attemptId: string, p: { lateDays: number; penaltyPercent: number; score: number }) {
  await db.updateTable("attempts").set({ late_days: p.lateDays, penalty_percent: p.penaltyPercent, score: p.score }).where("id", "=", attemptId).execute();
}
