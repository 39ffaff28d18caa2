// The append-only grade history. Rows are only ever inserted (PostgreSQL refuses UPDATE and DELETE).
import type { Db, GradeEventKind } from "../types";

export interface GradeEventWrite {
  attemptId: string;
  kind: GradeEventKind;
  questionId?: string | null;
  actorId?: string | null;
  pointsBefore?: number | null;
  pointsAfter?: number | null;
  scoreBefore?: number | null;
  scoreAfter?: number | null;
  reason?: string | null;
  graderVersion?: string | null;
  /** when it happened; the database clock by default */
  at?: Date;
}

export async function insertGradeEvent(db: Db, e: GradeEventWrite): Promise<string> {
  const row = await db
    .insertInto("grade_events")
    .values({
      attempt_id: e.attemptId,
      kind: e.kind,
      question_id: e.questionId ?? null,
      actor_id: e.actorId ?? null,
      points_before: e.pointsBefore ?? null,
      points_after: e.pointsAfter ?? null,
      score_before: e.scoreBefore ?? null,
      score_after: e.scoreAfter ?? null,
      reason: e.reason ?? null,
      grader_version: e.graderVersion ?? null,
      ...(e.at ? { created_at: e.at } : {}),
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return String(row.id);
}

/** An attempt's history in the order it happened, with the name of whoever acted (null: the grader). */
export async function listGradeEvents(db: Db, attemptId: string) {
  return db
    .selectFrom("grade_events as e")
    .leftJoin("users as u", "u.id", "e.actor_id")
    .select([
      "e.id",
      "e.attempt_id as attemptId",
      "e.question_id as questionId",
      "e.kind",
      "e.actor_id as actorId",
      "u.name as actorName",
      "e.created_at as createdAt",
      "e.points_before as pointsBefore",
      "e.points_after as pointsAfter",
      "e.score_before as scoreBefore",
      "e.score_after as scoreAfter",
      "e.reason",
      "e.grader_version as graderVersion",
    ])
    .where("e.attempt_id", "=", attemptId)
    .orderBy("e.id")
    .execute();
}

export type GradeEventRow = Awaited<ReturnType<typeof listGradeEvents>>[number];
