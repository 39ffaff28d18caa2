// Exceptions to a lab's rules for one student: the instructor grants their own due date, close and/or
// extra attempts with a reason, changes or removes them. The student's attempts already made are given
// the late penalty of their own due date at once, each change with a row in the grade history.
import "server-only";
import type { Transaction } from "kysely";
import { db } from "@/db";
import { listAttempts, setAttemptPenalty } from "@/db/queries/attempts";
import { findMembership } from "@/db/queries/courses";
import { deleteException, findException, upsertException, type ExceptionRow } from "@/db/queries/exceptions";
import { insertGradeEvent } from "@/db/queries/grade-events";
import type { Database } from "@/db/types";
import { AppError, notFound } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import type { ExceptionData } from "@/lib/validation/exceptions";
import { forStudent, type Lab } from "./grading";
import { applyPenalty, latePenaltyPercent, lateDays, type LabException } from "./policy";

export function exceptionJson(e: ExceptionRow) {
  return { labId: e.labId, userId: e.userId, dueAt: e.dueAt, closesAt: e.closesAt, extraAttempts: e.extraAttempts, reason: e.reason, grantedBy: e.grantedBy, grantedAt: e.grantedAt };
}

async function studentOf(lab: Lab, userId: string) {
  if (!uuidSchema.safeParse(userId).success) throw notFound("That student");
  const m = await findMembership(db, lab.courseId, userId);
  if (!m) throw notFound("That student");
  if (m.role !== "student") throw new AppError("bad_request", "Exceptions are for students of the course.", { userId: ["Not a student of this course."] });
}

/** Gives the student's attempts the late penalty of their own due date; one history row per attempt whose score changes. */
async function repenalize(trx: Transaction<Database>, lab: Lab, userId: string, exception: LabException | null, actorId: string, reason: string) {
  const rules = forStudent(lab, exception);
  for (const a of await listAttempts(trx, lab.id, userId)) {
    const days = lateDays(rules, new Date(a.submittedAt));
    const penalty = latePenaltyPercent(rules, days);
    if (days === a.lateDays && penalty === a.penaltyPercent) continue;
    const score = applyPenalty(a.rawScore, penalty);
    await setAttemptPenalty(trx, a.id, { lateDays: days, penaltyPercent: penalty, score });
    await insertGradeEvent(trx, { attemptId: a.id, kind: "exception", actorId, pointsBefore: a.rawScore, pointsAfter: a.rawScore, scoreBefore: a.score, scoreAfter: score, reason });
  }
}

export async function grantException(lab: Lab, userId: string, input: ExceptionData, actorId: string) {
  await studentOf(lab, userId);
  if (input.closesAt && !input.dueAt && lab.dueAt && input.closesAt < lab.dueAt) {
    throw new AppError("bad_request", "The student's close cannot come before the lab's due date.", { closesAt: ["The close cannot come before the due date."] });
  }
  return db.transaction().execute(async (trx) => {
    const row = await upsertException(trx, { labId: lab.id, userId, dueAt: input.dueAt, closesAt: input.closesAt, extraAttempts: input.extraAttempts, reason: input.reason, grantedBy: actorId });
    await repenalize(trx, lab, userId, input, actorId, `Exception: ${input.reason}`);
    return row;
  });
}

export async function removeException(lab: Lab, userId: string, actorId: string): Promise<boolean> {
  if (!uuidSchema.safeParse(userId).success) throw notFound("That student");
  return db.transaction().execute(async (trx) => {
    const before = await findException(trx, lab.id, userId);
    if (!before || !(await deleteException(trx, lab.id, userId))) throw notFound("That exception");
    await repenalize(trx, lab, userId, null, actorId, `Exception removed (it said: ${before.reason})`);
    return true;
  });
}
