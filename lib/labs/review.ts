// Review and regrade use cases for route handlers and pages: the course's review queue, one question's
// points or a re-run of the grader, the answer to a review request, and an attempt's grade history.
// Every function checks who is asking; every grade change runs in one transaction on the locked attempt.
import "server-only";
import { readJson } from "@/lib/http/route";
import { db } from "@/db";
import { findAttempt } from "@/db/queries/attempts";
import { listGradeEvents, type GradeEventRow } from "@/db/queries/grade-events";
import { countOpenReviews, listReviews } from "@/db/queries/reviews";
import { findUploads } from "@/db/queries/uploads";
import { assertRole, isStaff, requireCourseRole, STAFF, type CourseAccess } from "@/lib/auth/access";
import { templates } from "@/lib/grader";
import { queueGradeMail } from "@/lib/mail/grade";
import { parseRegrade, reviewAnswerSchema, reviewQuerySchema } from "@/lib/validation/reviews";
import { invalid, parseOr400 } from "@/lib/validation/zod-errors";
import type { Lab, StoredTrace } from "./grading";
import { answerReviewRequest, overrideQuestion, recomputeAttempt } from "./rescore";
import { attemptAccess, attemptsUsed, HELD_NOTICE, presentAttempt } from "./attempts";

/** The course's review requests for its staff (students 403, outsiders 404). */
export async function reviewQueue(courseId: string, search: URLSearchParams) {
  const access = await requireCourseRole(courseId, STAFF);
  const query = parseOr400(reviewQuerySchema, Object.fromEntries(search));
  return { access, reviews: await listReviews(db, access.course.id, query) };
}

/** The number of open review requests, for the course page (staff only; 0 for students). */
export async function openReviewCount(access: CourseAccess): Promise<number> {
  return isStaff(access.role) ? countOpenReviews(db, access.course.id) : 0;
}

/** One attempt for its course's staff: the owner gets 403, anyone outside the course 404. */
export async function staffAttemptAccess(attemptId: string) {
  const found = await attemptAccess(attemptId);
  assertRole(found.access, STAFF);
  return found;
}

async function tracesOf(uploadIds: string[]): Promise<StoredTrace[]> {
  if (!uploadIds.length) return [];
  return (await findUploads(db, uploadIds)).filter((u) => u.kind === "trace" && u.analysis).map((u) => u.analysis as StoredTrace);
}

/** The JSON body, read after the caller is authorized (so a refusal never depends on the body). */
export function bodyOf(req: Request): () => Promise<unknown> {
  return () => readJson(req);
}

/** `{ questionId, points, reason }` sets one question's points; `{ rerun: true, reason }` re-runs the grader. */
export async function regradeAttempt(attemptId: string, readBody: () => Promise<unknown>) {
  const { attempt, lab, access } = await staffAttemptAccess(attemptId);
  const parsed = parseRegrade(await readBody());
  if (!parsed.success) throw invalid(parsed.error);
  const input = parsed.data;
  const traces = "rerun" in input ? await tracesOf(attempt.uploadIds) : [];
  // the grade, its history row and the student's message commit together
  await db.transaction().execute(async (trx) => {
    const kind = "rerun" in input ? ("rerun" as const) : ("override" as const);
    const r =
      kind === "rerun"
        ? await recomputeAttempt(trx, lab, attempt.id, traces, { kind: "rerun", actorId: access.user.id, reason: input.reason })
        : await overrideQuestion(trx, attempt.id, input as Exclude<typeof input, { rerun: true }>, access.user.id);
    await queueGradeMail(trx, { attemptId: attempt.id, eventKey: `${kind}:${r.eventId}`, kind, change: { scoreBefore: r.scoreBefore, reason: input.reason, by: access.user.name } });
  });
  const after = (await findAttempt(db, attempt.id))!;
  return presentAttempt(after, lab, true, await attemptsUsed(after));
}

/** The staff's answer to the student's review request; it closes the request. */
export async function answerReview(attemptId: string, readBody: () => Promise<unknown>) {
  const { attempt, access } = await staffAttemptAccess(attemptId);
  const { message } = parseOr400(reviewAnswerSchema, await readBody());
  const at = new Date();
  await db.transaction().execute(async (trx) => {
    const eventId = await answerReviewRequest(trx, attempt.id, message, access.user.id, at);
    await queueGradeMail(trx, { attemptId: attempt.id, eventKey: `review_answer:${eventId}`, kind: "review_answer", answer: message });
  });
  return { attemptId: attempt.id, answer: message, answeredAt: at, answeredBy: access.user.name, status: "answered" as const };
}

function questionLabel(lab: Lab, questionId: string | null): string | null {
  if (!questionId) return null;
  const i = lab.questions.findIndex((q) => q.id === questionId);
  if (i < 0) return questionId;
  const q = lab.questions[i];
  const label = templates[lab.templateKey]?.quantities.find((x) => x.key === q.quantity)?.label ?? q.quantity;
  return `${i + 1}. ${label}`;
}

export function presentEvent(e: GradeEventRow, lab: Lab) {
  return {
    id: e.id,
    kind: e.kind,
    questionId: e.questionId,
    question: questionLabel(lab, e.questionId),
    actor: e.actorId ? { id: e.actorId, name: e.actorName } : null,
    at: e.createdAt,
    pointsBefore: e.pointsBefore,
    pointsAfter: e.pointsAfter,
    scoreBefore: e.scoreBefore,
    scoreAfter: e.scoreAfter,
    reason: e.reason,
    graderVersion: e.graderVersion,
  };
}

export type PresentedEvent = ReturnType<typeof presentEvent>;

/**
 * The attempt's grade history, oldest first: the owner and the course staff (anyone else 404). While the
 * lab's grades are held its student gets no events (every one carries points), only the held notice.
 */
export async function attemptHistory(attemptId: string): Promise<{ events: PresentedEvent[]; status?: "held"; notice?: string }> {
  const { attempt, lab, access } = await attemptAccess(attemptId);
  if (lab.gradesHeld && !isStaff(access.role)) return { events: [], status: "held", notice: HELD_NOTICE };
  const rows = await listGradeEvents(db, attempt.id);
  return { events: rows.map((e) => presentEvent(e, lab)) };
}
