// queueGradeMail: called in the transaction that stores a grade event (a first grade, a recomputation
// after a lab edit, a staff regrade or review answer, a release of held grades). It snapshots what the
// message says at that moment and queues it with queueMail under the event's key.
import type { Transaction } from "kysely";
import type { Database } from "@/db/types";
import { gradeMailContext, type GradeMailContext } from "@/db/queries/grade-mail";
import type { TemplateKey } from "@/lib/grader";
import { presentResults, type StoredResult } from "@/lib/labs/visible-results";
import { queueMail } from "./queue";
import type { GradeMailData, GradeMailKind } from "./templates/grade-mail";

export type { GradeMailKind } from "./templates/grade-mail";

/** Kinds a student may turn off in their settings; regrades by the staff are always sent. */
export const OPTIONAL_KINDS: readonly GradeMailKind[] = ["graded", "released"];

export interface GradeMailEvent {
  attemptId: string;
  /** unique per grade event, e.g. `graded:{attemptId}` or `recomputed:{attemptId}:{regradeId}` */
  eventKey: string;
  kind: GradeMailKind;
  /** for a regrade: the counted score before, and the reason given */
  change?: { scoreBefore: number; reason?: string | null; by?: string | null; actorId?: string | null };
  /** for a review answer: the staff's answer */
  answer?: string | null;
}

export type GradeMailOutcome = { queued: true; id: string } | { queued: false; why: "held" | "opted-out" | "duplicate" | "no-attempt" };

async function actorName(trx: Transaction<Database>, id: string | null | undefined): Promise<string | null> {
  if (!id) return null;
  return (await trx.selectFrom("users").select("name").where("id", "=", id).executeTakeFirst())?.name ?? null;
}

/**
 * Queues the message of one grade event in `trx`. `known` is what the message needs when the caller has
 * just read or written all of it in this transaction (a new attempt); otherwise it is read here.
 */
export async function queueGradeMail(trx: Transaction<Database>, e: GradeMailEvent, known?: GradeMailContext): Promise<GradeMailOutcome> {
  const c = known ?? (await gradeMailContext(trx, e.attemptId));
  if (!c) return { queued: false, why: "no-attempt" };
  // While a lab's grades are held nothing goes out; releasing sends each student their counted score.
  if (c.gradesHeld && e.kind !== "released") return { queued: false, why: "held" };
  if (!c.gradeMail && OPTIONAL_KINDS.includes(e.kind)) return { queued: false, why: "opted-out" };
  const stored = c.result as StoredResult;
  const data: GradeMailData = {
    kind: e.kind,
    studentName: c.studentName,
    courseCode: c.courseCode,
    courseTitle: c.courseTitle,
    labTitle: c.labTitle,
    attemptNumber: c.number,
    score: c.score,
    maxScore: c.maxScore,
    penaltyPercent: c.penaltyPercent,
    // verdicts and points only: no expected values in a message
    questions: presentResults(c.templateKey as TemplateKey, stored, false).map((q) => ({
      label: q.label,
      verdict: q.verdict,
      points: q.points,
      maxPoints: q.maxPoints,
    })),
    change: e.change ? { scoreBefore: e.change.scoreBefore, scoreAfter: c.score, reason: e.change.reason ?? null, by: e.change.by ?? (await actorName(trx, e.change.actorId)) } : undefined,
    answer: e.answer ?? null,
    attemptPath: `/attempts/${c.attemptId}`,
  };
  const r = await queueMail(trx, { key: e.eventKey, kind: e.kind, to: c.email, data: data as unknown as Record<string, unknown> });
  return r.queued ? { queued: true, id: r.id } : { queued: false, why: "duplicate" };
}
