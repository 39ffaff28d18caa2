// Demo review requests on the graded labs: a few still waiting for the staff, and one answered with a
// changed score (a teaching assistant's override with its reason, then the answer), so the review queue,
// the course page's count and the grade history are not empty on first start. Runs once per course.
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../../db/types";
import { answerReviewRequest, overrideQuestion } from "../../lib/labs/rescore";
import { demoLabReviews } from "./labs";

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

/**
 * Review requests on the demo labs that carry their own (scripts/seed/labs.ts `reviews`: the nanoamp,
 * microvolt, sampling and whole-chain labs), so the teaching assistants' queue shows requests on the
 * labs running now: each lab gets its open requests and its answered ones (a teaching assistant's answer,
 * after a changed score where the lab says so). Per lab and once: a lab with any request already is left
 * as it is, so a database seeded before these labs had requests gets them, and a second run changes nothing.
 */
export async function seedLabReviews(db: Kysely<Database>, courseId: string, ta: string, now = new Date()) {
  const trx = db as Transaction<Database>;
  for (const { title, reviews } of demoLabReviews()) {
    const lab = await db.selectFrom("labs").select("id").where("course_id", "=", courseId).where("title", "=", title).executeTakeFirst();
    if (!lab) continue;
    const asked = await db.selectFrom("attempts").select("id").where("lab_id", "=", lab.id).where("review_requested_at", "is not", null).executeTakeFirst();
    if (asked) continue;
    // students' first attempts submitted more than a day ago, earliest first (so every request and answer lies in the past)
    const firsts = await db
      .selectFrom("attempts")
      .select(["id", "result", "submitted_at as submittedAt"])
      .where("lab_id", "=", lab.id)
      .where("number", "=", 1)
      .where("submitted_at", "<", new Date(now.getTime() - 24 * HOUR))
      .orderBy("submitted_at")
      .orderBy("id")
      .execute();
    type Result = { id?: string; points: number; maxPoints: number; mistake?: string };
    const results = (a: (typeof firsts)[number]) => (a.result as { results: Result[] }).results;
    // the question a regrade changes: a prefix slip if the grader saw one, else any question short of its points
    const slip = (a: (typeof firsts)[number]) => results(a).findIndex((r) => r.points < r.maxPoints && r.mistake === "prefix-slip");
    const short = (a: (typeof firsts)[number]) => results(a).findIndex((r) => r.points < r.maxPoints);
    const used = new Set<string>();
    const later = (d: Date, hours: number) => new Date(new Date(d).getTime() + hours * HOUR);
    for (const item of reviews.answered) {
      const free = firsts.filter((x) => !used.has(x.id));
      const a = item.regrade ? (free.find((x) => slip(x) >= 0) ?? free.find((x) => short(x) >= 0)) : free[0];
      if (!a) continue;
      used.add(a.id);
      const i = item.regrade ? (slip(a) >= 0 ? slip(a) : short(a)) : -1;
      const text = (t: string) => t.replaceAll("{q}", String(i + 1));
      const requestedAt = later(a.submittedAt, 3);
      await db.updateTable("attempts").set({ review_requested_at: requestedAt, review_message: text(item.message) }).where("id", "=", a.id).execute();
      if (item.regrade) {
        const q = results(a)[i];
        // half the question's points back (more than the grader gave)
        let points = Math.min(q.maxPoints, Math.floor((q.points + q.maxPoints / 2) * 2) / 2);
        if (points <= q.points) points = q.maxPoints;
        await overrideQuestion(trx, a.id, { questionId: q.id ?? `q${i + 1}`, points, reason: text(item.regrade) }, ta, later(requestedAt, 4));
      }
      await answerReviewRequest(trx, a.id, text(item.answer), ta, later(requestedAt, 4.5));
    }
    for (const [k, message] of reviews.open.entries()) {
      const a = firsts.find((x) => !used.has(x.id));
      if (!a) break;
      used.add(a.id);
      await db.updateTable("attempts").set({ review_requested_at: later(a.submittedAt, 2 + k), review_message: message }).where("id", "=", a.id).execute();
    }
  }
}
