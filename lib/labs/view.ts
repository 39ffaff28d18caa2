// JSON views of a lab for the API: a summary for lists, the full definition for staff.
import type { Lab } from "./grading";
import { closeOf } from "./policy";

export function labSummary(lab: Lab) {
  return {
    id: lab.id,
    courseId: lab.courseId,
    title: lab.title,
    templateKey: lab.templateKey,
    status: lab.status,
    opensAt: lab.opensAt,
    dueAt: lab.dueAt,
    /** when the lab stops accepting attempts (the explicit close or the default one); null: never */
    closesAt: closeOf(lab),
    attemptsAllowed: lab.attemptsAllowed,
    counting: lab.counting,
    version: lab.version,
  };
}

/** Everything a student may know about the lab itself (not the expected values). */
export function labPublic(lab: Lab) {
  return {
    ...labSummary(lab),
    questions: lab.questions.map((q) => ({ id: q.id, quantity: q.quantity, kind: q.kind, points: q.points })),
    latePenaltyPercentPerDay: lab.latePenaltyPercentPerDay,
    lateFloorPercent: lab.lateFloorPercent,
    showExpected: lab.showExpected,
    instructions: lab.instructions,
    safetyNotes: lab.safetyNotes,
    /** where students take their readings: "real", "simulated" or "either" */
    bench: lab.bench,
    /** the viewing student's own exception (its dates and attempts are already the ones above), or null */
    exception: lab.exception ? { extraAttempts: lab.exception.extraAttempts, reason: lab.exception.reason } : null,
  };
}

export function labFull(lab: Lab) {
  return { ...labPublic(lab), closesAtSet: lab.closesAt, questions: lab.questions, spec: lab.spec, policy: lab.policy, publishedAt: lab.publishedAt, updatedAt: lab.updatedAt };
}
