// Review and regrade over HTTP against the test server and its real PostgreSQL: the review queue, one
// question's points with a reason, a re-run of the grader, the answer to the student, the grade history,
// and who may do each.
//
// The circuit is fixed (5 V, 470 Ω load, 10 Ω shunt), so the expected values are Ohm's law done by hand
// (lib/grader/PHYSICS.md §2): indicated current 5/480 A = 10.4167 mA, burden 10.4167 mA × 10 Ω = 0.10417 V.
import { beforeAll, describe, expect, it } from "vitest";
import type { Client } from "../support/http";
import { e2eDb } from "../support/db";
import { addPerson, clientsOf, attemptWithReview, clientFor, courseWithPeople, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

const lab = fixedCircuitLab();

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let other: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "student2" | "outsider" | "otherTa", Client>;
let labId: string;
let attemptId: string;

beforeAll(async () => {
  f = await courseWithPeople();
  other = await courseWithPeople();
  const email = (await addPerson("student2", { courseId: f.courseId, name: "Second student", section: "B" })).email;
  const db = e2eDb();
  await db.updateTable("memberships").set({ section: "A" }).where("course_id", "=", f.courseId).where("user_id", "=", f.people.student.id).execute();
  await db.destroy();
  as = { ...(await clientsOf(f.people)), student2: await clientFor(email), otherTa: await clientFor(other.people.ta.email) };
  labId = await publishedLab(sendAs(as.instructor), f.courseId, lab);
  attemptId = await attemptWithReview(sendAs(as.student), labId, "I think question 2 used the right method.");
});

describe("who may use the review routes", () => {
  it("a student gets 403 on the queue and on both POST routes", async () => {
    expect((await as.student.json(`/api/courses/${f.courseId}/reviews`)).status).toBe(403);
    expect((await as.student.post(`/api/attempts/${attemptId}/regrades`, { questionId: "q2", points: 3, reason: "I deserve it" })).status).toBe(403);
    expect((await as.student.post(`/api/attempts/${attemptId}/review/answer`, { message: "Answering myself" })).status).toBe(403);
  });

  it("a TA of another course gets 404 everywhere", async () => {
    expect((await as.otherTa.json(`/api/courses/${f.courseId}/reviews`)).status).toBe(404);
    expect((await as.otherTa.post(`/api/attempts/${attemptId}/regrades`, { questionId: "q2", points: 3, reason: "Not my course" })).status).toBe(404);
    expect((await as.otherTa.post(`/api/attempts/${attemptId}/review/answer`, { message: "Not my course" })).status).toBe(404);
    expect((await as.otherTa.json(`/api/attempts/${attemptId}/history`)).status).toBe(404);
    expect((await as.outsider.json(`/api/attempts/${attemptId}/history`)).status).toBe(404);
  });

  it("the owner reads the history; another student of the course gets 404", async () => {
    const mine = await as.student.json(`/api/attempts/${attemptId}/history`);
    expect(mine.status).toBe(200);
    expect(mine.body.events[0]).toMatchObject({ kind: "graded", actor: null, scoreAfter: 7 });
    expect((await as.student2.json(`/api/attempts/${attemptId}/history`)).status).toBe(404);
  });
});

describe("the review queue, a regrade and the answer", () => {
  it("lists the open request with the student's message and section, and filters", async () => {
    const r = await as.ta.json(`/api/courses/${f.courseId}/reviews?status=open`);
    expect(r.status).toBe(200);
    const item = r.body.reviews.find((x: { attemptId: string }) => x.attemptId === attemptId);
    expect(item).toMatchObject({
      labId,
      labTitle: lab.title,
      student: { id: f.people.student.id, name: "Fixture student", section: "A" },
      message: "I think question 2 used the right method.",
      status: "open",
      answeredAt: null,
      answeredBy: null,
      score: 7,
      maxScore: 10,
    });
    expect(typeof item.requestedAt).toBe("string");
    expect((await as.ta.json(`/api/courses/${f.courseId}/reviews?section=B`)).body.reviews).toEqual([]);
    expect((await as.ta.json(`/api/courses/${f.courseId}/reviews?status=answered`)).body.reviews).toEqual([]);
    const bad = await as.ta.json(`/api/courses/${f.courseId}/reviews?status=closed&labId=nope`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["labId", "status"]);
  });

  it("refuses a regrade without a reason, off the half steps or above the maximum, naming the field", async () => {
    const noReason = await as.ta.post(`/api/attempts/${attemptId}/regrades`, { questionId: "q2", points: 2 });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty("reason");
    const short = await as.ta.post(`/api/attempts/${attemptId}/regrades`, { questionId: "q2", points: 2, reason: "ok" });
    expect(short.body.error.fields).toHaveProperty("reason");
    const third = await as.ta.post(`/api/attempts/${attemptId}/regrades`, { questionId: "q2", points: 1.3, reason: "A third of a point" });
    expect(third.status).toBe(400);
    expect(third.body.error.fields).toHaveProperty("points");
    const tooMany = await as.ta.post(`/api/attempts/${attemptId}/regrades`, { questionId: "q2", points: 3.5, reason: "More than it is worth" });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fields).toHaveProperty("points");
    const noQuestion = await as.ta.post(`/api/attempts/${attemptId}/regrades`, { questionId: "q9", points: 1, reason: "No such question" });
    expect(noQuestion.body.error.fields).toHaveProperty("questionId");
  });

  it("changes one question's points, answers the student, and the student sees both", async () => {
    const rg = await as.ta.post(`/api/attempts/${attemptId}/regrades`, { questionId: "q2", points: 1.5, reason: "Right method, the wrong resistor value" });
    expect(rg.status).toBe(201);
    expect(rg.body.attempt).toMatchObject({ id: attemptId, score: 8.5, rawScore: 8.5, maxScore: 10, changedByStaff: true });
    const q2 = rg.body.attempt.results.find((x: { questionId: string }) => x.questionId === "q2");
    expect(q2).toMatchObject({ points: 1.5, override: { points: 1.5, graderPoints: 0, reason: "Right method, the wrong resistor value" } });

    const ans = await as.ta.post(`/api/attempts/${attemptId}/review/answer`, { message: "Half the points back for question 2: the method was right." });
    expect(ans.status).toBe(201);
    expect(ans.body.review).toMatchObject({ attemptId, status: "answered", answeredBy: "Fixture ta" });

    const seen = await as.student.json(`/api/attempts/${attemptId}`);
    expect(seen.body.attempt).toMatchObject({ score: 8.5, reviewAnswer: "Half the points back for question 2: the method was right.", reviewOpen: false });

    const hist = await as.student.json(`/api/attempts/${attemptId}/history`);
    expect(hist.body.events.map((e: { kind: string }) => e.kind)).toEqual(["graded", "override", "review_answer"]);
    expect(hist.body.events[1]).toMatchObject({
      questionId: "q2",
      actor: { id: f.people.ta.id, name: "Fixture ta" },
      pointsBefore: 0,
      pointsAfter: 1.5,
      scoreBefore: 7,
      scoreAfter: 8.5,
      reason: "Right method, the wrong resistor value",
    });

    // the student's messages were queued with the changes (one per event)
    const db = e2eDb();
    try {
      const mails = await db.selectFrom("mail_outbox").select(["kind", "data"]).where("to_address", "=", f.people.student.email).orderBy("created_at").execute();
      expect(mails.map((m) => m.kind)).toEqual(expect.arrayContaining(["override", "review_answer"]));
      const override = mails.find((m) => m.kind === "override")!.data as { change: { scoreBefore: number; scoreAfter: number; reason: string } };
      expect(override.change).toMatchObject({ scoreBefore: 7, scoreAfter: 8.5, reason: "Right method, the wrong resistor value" });
    } finally {
      await db.destroy();
    }

    const answered = await as.ta.json(`/api/courses/${f.courseId}/reviews?status=answered`);
    expect(answered.body.reviews.map((x: { attemptId: string }) => x.attemptId)).toEqual([attemptId]);
    expect(answered.body.reviews[0]).toMatchObject({ status: "answered", answeredBy: "Fixture ta", score: 8.5 });
    expect((await as.ta.json(`/api/courses/${f.courseId}/reviews?status=open`)).body.reviews).toEqual([]);
    expect((await as.ta.json(`/api/courses/${f.courseId}/reviews?changed=true`)).body.reviews).toHaveLength(1);
    expect((await as.ta.json(`/api/courses/${f.courseId}/reviews?changed=false`)).body.reviews).toHaveLength(0);
  });

  it("re-runs the grader on the stored readings, replacing the staff's points, with a reason", async () => {
    const rr = await as.instructor.post(`/api/attempts/${attemptId}/regrades`, { rerun: true, reason: "Back to the grader's points" });
    expect(rr.status).toBe(201);
    expect(rr.body.attempt.score).toBe(7);
    const hist = await as.ta.json(`/api/attempts/${attemptId}/history`);
    expect(hist.body.events.at(-1)).toMatchObject({ kind: "rerun", scoreBefore: 8.5, scoreAfter: 7, actor: { id: f.people.instructor.id } });
    const noReason = await as.instructor.post(`/api/attempts/${attemptId}/regrades`, { rerun: true });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty("reason");
  });
});
