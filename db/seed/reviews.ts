// Demo review requests on the graded labs: a few still waiting for the staff, and one answered with a
// changed score (a teaching assistant's override with its reason, then the answer), so the review queue,
// the course page's count and the grade history are not empty on first start. Runs once per course.
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../types";
import { answerReviewRequest, overrideQuestion } from "../../lib/labs/rescore";

const HOUR = 3600_000;

const OPEN_MESSAGES = [
  "I measured the burden across the shunt terminals, not the leads. Could question 3 be checked against that?",
  "My ammeter was on the 10 mA range; I think the band for the indicated current should be wider for that range.",
  "I typed the value in microamps but forgot the prefix on one answer. The number itself is right.",
];

export async function seedReviews(db: Kysely<Database>, courseId: string, people: { studentOne: string; studentTwo: string; ta: string }) {
  const already = await db
    .selectFrom("attempts as a")
    .innerJoin("labs as l", "l.id", "a.lab_id")
    .select("a.id")
    .where("l.course_id", "=", courseId)
    .where("a.review_requested_at", "is not", null)
    .executeTakeFirst();
  if (already) return;

  // the first attempt of each student in the course's graded labs (due date passed), earliest lab first
  const firsts = await db
    .selectFrom("attempts as a")
    .innerJoin("labs as l", "l.id", "a.lab_id")
    .select(["a.id", "a.user_id as userId", "a.result", "a.submitted_at as submittedAt", "l.title"])
    .where("l.course_id", "=", courseId)
    .where("l.due_at", "<", new Date())
    .where("a.number", "=", 1)
    .orderBy("l.due_at")
    .orderBy("a.submitted_at")
    .execute();
  if (!firsts.length) return;
  const ask = async (attemptId: string, message: string, at: Date) => {
    await db.updateTable("attempts").set({ review_requested_at: at, review_message: message }).where("id", "=", attemptId).execute();
  };
  const later = (d: Date, hours: number) => new Date(new Date(d).getTime() + hours * HOUR);

  // answered, with a changed score: student two's first attempt, on a question the grader gave no points
  const answered = firsts.find(
    (a) => a.userId === people.studentTwo && (a.result as { results: { points: number; maxPoints: number }[] }).results.some((r) => r.points < r.maxPoints),
  );
  if (answered) {
    const results = (answered.result as { results: { id?: string; points: number; maxPoints: number }[] }).results;
    const i = results.findIndex((r) => r.points < r.maxPoints);
    const q = results[i];
    await ask(answered.id, `Question ${i + 1}: I used the right formula but carried one value over wrongly. Is partial credit possible?`, later(answered.submittedAt, 20));
    const trx = db as Transaction<Database>;
    // half the question's points back for the working (more than the grader gave)
    let points = Math.min(q.maxPoints, Math.floor((q.points + q.maxPoints / 2) * 2) / 2);
    if (points <= q.points) points = q.maxPoints;
    await overrideQuestion(trx, answered.id, { questionId: q.id ?? `q${i + 1}`, points, reason: "The method is right; one value was carried over wrongly. Half the points back for the working." }, people.ta, later(answered.submittedAt, 30));
    await answerReviewRequest(trx, answered.id, "Your working was right up to one value you carried over from the previous step, so I gave half of this question's points back for the method. Check each value against your handout before the final step.", people.ta, later(answered.submittedAt, 30.5));
  }

  // waiting: student one's first attempt and two other students', oldest first in the queue
  const open = [
    firsts.find((a) => a.userId === people.studentOne),
    ...firsts.filter((a) => a.userId !== people.studentOne && a.userId !== people.studentTwo).slice(0, 2),
  ].filter((a): a is (typeof firsts)[number] => Boolean(a));
  for (const [k, a] of open.entries()) await ask(a.id, OPEN_MESSAGES[k % OPEN_MESSAGES.length], later(a.submittedAt, 6 + k));
}
