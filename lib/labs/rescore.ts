// Every change to a stored grade, each inside the caller's transaction on a locked attempt row, and each
// writing its row of the grade history: a recomputation after a lab edit (staff points kept), a staff
// re-run of the grader, one question's points set by staff, and the staff's answer to a review request.
// Shared by the route handlers, the regrade job and the seed; no framework or session objects.
import type { Transaction } from "kysely";
import { answerReview, lockAttempt, updateAttemptGrade, type AttemptRow } from "@/db/queries/attempts";
import { insertGradeEvent } from "@/db/queries/grade-events";
import type { Database } from "@/db/types";
import { AppError, notFound } from "@/lib/errors";
import type { Params } from "@/lib/grader";
import { gradeForLab, type Lab, type StoredTrace } from "./grading";
import { applyOverrides, type Overrides } from "./overrides";
import { applyPenalty } from "./policy";
import type { StoredResult } from "./visible-results";

type Trx = Transaction<Database>;
type Stored = StoredResult & { params?: Params };

async function locked(trx: Trx, attemptId: string): Promise<AttemptRow> {
  const a = await lockAttempt(trx, attemptId);
  if (!a) throw notFound("That attempt");
  return a;
}

function questionName(lab: Lab, result: Stored, questionId: string): string {
  const i = result.results.findIndex((r, k) => (r.id ?? `q${k + 1}`) === questionId);
  const q = lab.questions.find((x) => x.id === questionId);
  return `question ${i >= 0 ? i + 1 : questionId}${q ? ` (${q.quantity})` : ""}`;
}

/**
 * Grades the attempt's stored readings again with the lab as it is now. `recomputed` (after a lab edit)
 * keeps the staff's points and says so in its history row; `rerun` (a staff action with a reason)
 * replaces them with the grader's.
 */
export async function recomputeAttempt(
  trx: Trx,
  lab: Lab,
  attemptId: string,
  traces: StoredTrace[],
  how: { kind: "recomputed"; actorId?: null; reason?: string } | { kind: "rerun"; actorId: string; reason: string },
) {
  const a = await locked(trx, attemptId);
  const stored = a.result as Stored;
  const measured = (a.measured as { values?: Params }).values ?? {};
  const graded = gradeForLab(lab, stored.params ?? {}, a.readings as Record<string, string | null>, measured, traces);
  const known = new Set(graded.results.map((r) => r.id));
  const kept: Overrides = how.kind === "recomputed" ? Object.fromEntries(Object.entries(a.overrides ?? {}).filter(([q]) => known.has(q))) : {};
  const { result, rawScore, applied } = applyOverrides({ ...graded, params: stored.params }, kept);
  // the review page says when a recomputation kept the staff's points
  const keptAt = new Date().toISOString();
  for (const r of result.results) if (r.override) r.override.keptAt = keptAt;
  const score = applyPenalty(rawScore, a.penaltyPercent);
  await updateAttemptGrade(trx, a.id, {
    result,
    rawScore,
    maxScore: graded.maxScore,
    score,
    graderVersion: graded.graderVersion,
    labVersion: lab.version,
    overrides: kept,
    changedByStaff: how.kind === "rerun",
  });
  let reason = how.reason ?? null;
  if (how.kind === "recomputed") {
    const keptText = applied.length ? ` Kept the staff's points on ${applied.map((q) => questionName(lab, result, q)).join(", ")}.` : "";
    reason = `${reason ?? `Recomputed after the lab was edited (version ${lab.version}).`}${keptText}`;
  } else if (Object.keys(a.overrides ?? {}).length) {
    reason = `${reason} (The grader's points replace the earlier staff points.)`;
  }
  const eventId = await insertGradeEvent(trx, {
    attemptId: a.id,
    kind: how.kind,
    actorId: how.actorId ?? null,
    pointsBefore: a.rawScore,
    pointsAfter: rawScore,
    scoreBefore: a.score,
    scoreAfter: score,
    reason,
    graderVersion: graded.graderVersion,
  });
  return { eventId, score, rawScore, scoreBefore: a.score, kept: applied };
}

/** Staff set one question's points (0 to its maximum, halves) with a reason; the late penalty applies as before. */
export async function overrideQuestion(trx: Trx, attemptId: string, input: { questionId: string; points: number; reason: string }, actorId: string, now = new Date()) {
  const a = await locked(trx, attemptId);
  const stored = a.result as Stored;
  const index = stored.results.findIndex((r, k) => (r.id ?? `q${k + 1}`) === input.questionId);
  if (index < 0) throw new AppError("bad_request", "This attempt has no such question.", { questionId: ["This attempt has no such question."] });
  const max = stored.results[index].maxPoints;
  if (input.points > max) {
    throw new AppError("bad_request", `This question is worth at most ${max} points.`, { points: [`Give from 0 to ${max} points.`] });
  }
  const before = stored.results[index].points;
  const overrides: Overrides = { ...(a.overrides ?? {}), [input.questionId]: { points: input.points, reason: input.reason, by: actorId, at: now.toISOString() } };
  // re-apply over the grader's points, so earlier overrides of other questions stay as they are
  const { result, rawScore } = applyOverrides(stored, overrides);
  const score = applyPenalty(rawScore, a.penaltyPercent);
  await updateAttemptGrade(trx, a.id, {
    result,
    rawScore,
    maxScore: a.maxScore,
    score,
    graderVersion: a.graderVersion,
    labVersion: a.labVersion,
    overrides,
    changedByStaff: true,
  });
  const eventId = await insertGradeEvent(trx, {
    attemptId: a.id,
    kind: "override",
    questionId: input.questionId,
    actorId,
    pointsBefore: before,
    pointsAfter: input.points,
    scoreBefore: a.score,
    scoreAfter: score,
    reason: input.reason,
    graderVersion: a.graderVersion,
    at: now,
  });
  return { eventId, score, rawScore, scoreBefore: a.score };
}

/** The staff's answer closes the student's review request; the history keeps the answer. */
export async function answerReviewRequest(trx: Trx, attemptId: string, message: string, actorId: string, now = new Date()): Promise<string> {
  const a = await locked(trx, attemptId);
  if (!a.reviewRequestedAt) throw new AppError("conflict", "The student has not asked for a review of this attempt.");
  await answerReview(trx, a.id, message, actorId, now);
  return insertGradeEvent(trx, {
    attemptId: a.id,
    kind: "review_answer",
    actorId,
    pointsBefore: a.rawScore,
    pointsAfter: a.rawScore,
    scoreBefore: a.score,
    scoreAfter: a.score,
    reason: message,
    graderVersion: a.graderVersion,
    at: now,
  });
}
