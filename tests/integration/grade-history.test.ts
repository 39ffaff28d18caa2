// The grade history against real PostgreSQL: the table refuses UPDATE and DELETE, a staff override writes
// one row and survives a lab edit's recomputation (which writes its own row), and two overrides of one
// attempt at the same time are both kept, in order.
//
// The circuit is fixed: 5 V, 470 Ω load, 10 Ω shunt. Ohm's law (lib/grader/PHYSICS.md §2, I = Vs/(RL + Rsh)) gives the
// indicated current 5/480 A = 10.4167 mA and the burden V = I·Rsh = 0.10417 V, computed here by hand.
import { sql } from "kysely";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db";
import { findAttempt } from "@/db/queries/attempts";
import { listGradeEvents } from "@/db/queries/grade-events";
import { findLab, insertLab, updateLab } from "@/db/queries/labs";
import type { CourseAccess } from "@/lib/auth/access";
import { toLab } from "@/lib/labs/grading";
import { runRegrade, startRegrade } from "@/lib/labs/regrade";
import { answerReviewRequest, overrideQuestion } from "@/lib/labs/rescore";
import { submitAttempt } from "@/lib/labs/attempts";

const DAY = 24 * 3600 * 1000;

function burdenLab(points = [4, 3, 3]) {
  return {
    title: "Burden on a fixed circuit",
    templateKey: "shunt-burden",
    spec: {
      template: "shunt-burden",
      parameters: {
        supplyVoltage: { mode: "fixed", value: 5 },
        loadResistance: { mode: "fixed", value: 470 },
        shuntResistance: { mode: "fixed", value: 10 },
      },
    },
    questions: [
      { id: "q1", quantity: "indicatedCurrent", kind: "prediction", points: points[0] },
      { id: "q2", quantity: "trueCurrent", kind: "prediction", points: points[1] },
      { id: "q3", quantity: "burdenVoltage", kind: "prediction", points: points[2] },
    ],
    policy: { relativeTolerance: 0.01 },
    attemptsAllowed: 3,
    counting: "best" as const,
    opensAt: new Date(Date.now() - DAY),
    dueAt: new Date(Date.now() + 7 * DAY),
    latePenaltyPercentPerDay: 0,
    lateFloorPercent: 0,
    showExpected: "after_attempt" as const,
    instructions: "",
    safetyNotes: "",
  };
}

let people: { student: string; ta: string; ta2: string };
let courseId: string;

async function user(name: string) {
  return (await db.insertInto("users").values({ email: `${name}@test.example`, name, password_hash: null }).returning("id").executeTakeFirstOrThrow()).id;
}

beforeEach(async () => {
  const course = await db
    .insertInto("courses")
    .values({ code: "T-1", title: "History course", term: "T", institution: "Fixture college", join_code: "J-HIST" })
    .returning(["id", "code", "title", "term", "institution", "join_code as joinCode"])
    .executeTakeFirstOrThrow();
  courseId = course.id;
  people = { student: await user("Student Hist"), ta: await user("Assistant One"), ta2: await user("Assistant Two") };
  await db.insertInto("memberships").values({ course_id: courseId, user_id: people.student, role: "student" }).execute();
});

/** A published lab and one graded attempt: indicated current right (4), true current wrong (0 of 3), burden right (3). */
async function gradedAttempt() {
  const labId = await insertLab(db, courseId, people.ta, burdenLab() as never, "published");
  const lab = toLab((await findLab(db, labId))!);
  const course = await db.selectFrom("courses").selectAll().where("id", "=", courseId).executeTakeFirstOrThrow();
  const access = {
    user: { id: people.student, name: "Student Hist", email: "student@test.example", isAdmin: false },
    course: { ...course, joinCode: course.join_code },
    role: "student",
    section: null,
  } as unknown as CourseAccess;
  const { attemptId } = await submitAttempt(lab, access, {
    idempotencyKey: "k1",
    readings: { q1: "10.42 mA", q2: "20 mA", q3: "0.1042 V" },
    measured: {},
    uploadIds: [],
  });
  return { labId, attemptId };
}

describe("the grade history table", () => {
  it("refuses UPDATE and DELETE from the application's database user", async () => {
    const { attemptId } = await gradedAttempt();
    const events = await listGradeEvents(db, attemptId);
    expect(events.map((e) => e.kind)).toEqual(["graded"]);
    await expect(sql`update grade_events set reason = 'rewritten' where attempt_id = ${attemptId}`.execute(db)).rejects.toThrow(/append-only/);
    await expect(sql`update grade_events set score_after = 0`.execute(db)).rejects.toThrow(/append-only/);
    await expect(sql`delete from grade_events where attempt_id = ${attemptId}`.execute(db)).rejects.toThrow(/append-only/);
    await expect(sql`delete from grade_events`.execute(db)).rejects.toThrow(/append-only/);
    const after = await listGradeEvents(db, attemptId);
    expect(after).toHaveLength(1);
    expect(after[0].reason).toBeNull();
    expect(after[0].scoreAfter).toBe(7);
  });

  it("goes with its attempt when the attempt itself is deleted", async () => {
    const { attemptId } = await gradedAttempt();
    await db.deleteFrom("attempts").where("id", "=", attemptId).execute();
    expect(await listGradeEvents(db, attemptId)).toHaveLength(0);
  });
});

describe("a staff override", () => {
  it("writes exactly one history row with the points and score before and after", async () => {
    const { attemptId } = await gradedAttempt();
    expect((await findAttempt(db, attemptId))!.score).toBe(7);
    await db.transaction().execute((trx) => overrideQuestion(trx, attemptId, { questionId: "q2", points: 2.5, reason: "Right method, slipped a digit" }, people.ta));
    const events = await listGradeEvents(db, attemptId);
    expect(events.map((e) => e.kind)).toEqual(["graded", "override"]);
    const o = events[1];
    expect(o).toMatchObject({ questionId: "q2", actorId: people.ta, actorName: "Assistant One", pointsBefore: 0, pointsAfter: 2.5, scoreBefore: 7, scoreAfter: 9.5, reason: "Right method, slipped a digit" });
    const a = (await findAttempt(db, attemptId))!;
    expect(a.score).toBe(9.5);
    expect(a.changedByStaff).toBe(true);
  });

  it("is kept when a lab edit recomputes the attempt, which adds its own row saying so", async () => {
    const { labId, attemptId } = await gradedAttempt();
    await db.transaction().execute((trx) => overrideQuestion(trx, attemptId, { questionId: "q2", points: 2.5, reason: "Right method, slipped a digit" }, people.ta));
    // the instructor makes the first question worth 5 points instead of 4
    await updateLab(db, labId, { questions: burdenLab([5, 3, 3]).questions } as never, true);
    const job = await startRegrade(labId, 2, 1);
    await runRegrade(job.id);
    const a = (await findAttempt(db, attemptId))!;
    expect(a.rawScore).toBe(10.5); // 5 + 2.5 (kept) + 3
    expect(a.score).toBe(10.5);
    expect(a.overrides.q2.points).toBe(2.5);
    const events = await listGradeEvents(db, attemptId);
    expect(events.map((e) => e.kind)).toEqual(["graded", "override", "recomputed"]);
    expect(events[2]).toMatchObject({ actorId: null, scoreBefore: 9.5, scoreAfter: 10.5 });
    expect(events[2].reason).toMatch(/Kept the staff's points on question 2/);
    const q2 = (a.result as { results: { id: string; points: number; graderPoints?: number }[] }).results.find((r) => r.id === "q2")!;
    expect(q2).toMatchObject({ points: 2.5, graderPoints: 0, override: { points: 2.5, keptAt: expect.any(String) } });
  });

  it("refuses points above the question's maximum or off the half steps, naming the field", async () => {
    const { attemptId } = await gradedAttempt();
    await expect(db.transaction().execute((trx) => overrideQuestion(trx, attemptId, { questionId: "q2", points: 3.5, reason: "too many" }, people.ta))).rejects.toMatchObject({ code: "bad_request", fields: { points: expect.any(Array) } });
    await expect(db.transaction().execute((trx) => overrideQuestion(trx, attemptId, { questionId: "q9", points: 1, reason: "no such" }, people.ta))).rejects.toMatchObject({ code: "bad_request", fields: { questionId: expect.any(Array) } });
    expect(await listGradeEvents(db, attemptId)).toHaveLength(1);
  });
});

describe("two staff changing one attempt at once", () => {
  it("records both changes in order and the later one counts, without losing the earlier", async () => {
    const { attemptId } = await gradedAttempt();
    let releaseFirst!: () => void;
    const firstHolds = new Promise<void>((r) => (releaseFirst = r));
    let firstLocked!: () => void;
    const locked = new Promise<void>((r) => (firstLocked = r));
    // the first TA's change holds the attempt's lock while the second TA's change arrives
    const first = db.transaction().execute(async (trx) => {
      await overrideQuestion(trx, attemptId, { questionId: "q2", points: 1, reason: "Partial credit for the method" }, people.ta);
      firstLocked();
      await firstHolds;
    });
    await locked;
    const second = db.transaction().execute((trx) => overrideQuestion(trx, attemptId, { questionId: "q3", points: 1.5, reason: "Burden read off the wrong range" }, people.ta2));
    await new Promise((r) => setTimeout(r, 200));
    releaseFirst();
    await Promise.all([first, second]);

    const events = (await listGradeEvents(db, attemptId)).filter((e) => e.kind === "override");
    expect(events.map((e) => [e.actorName, e.questionId])).toEqual([
      ["Assistant One", "q2"],
      ["Assistant Two", "q3"],
    ]);
    // 4 + 1 + 3 after the first; the second starts from that: 4 + 1 + 1.5
    expect(events[0]).toMatchObject({ scoreBefore: 7, scoreAfter: 8 });
    expect(events[1]).toMatchObject({ scoreBefore: 8, scoreAfter: 6.5 });
    const a = (await findAttempt(db, attemptId))!;
    expect(a.score).toBe(events[1].scoreAfter);
    expect(Object.keys(a.overrides).sort()).toEqual(["q2", "q3"]);
  });
});

describe("answering a review request", () => {
  it("closes the request and keeps the answer in the history", async () => {
    const { attemptId } = await gradedAttempt();
    await expect(db.transaction().execute((trx) => answerReviewRequest(trx, attemptId, "Nothing was asked", people.ta))).rejects.toMatchObject({ code: "conflict" });
    await db.updateTable("attempts").set({ review_requested_at: new Date(Date.now() - 60_000), review_message: "Please look at question 2" }).where("id", "=", attemptId).execute();
    await db.transaction().execute((trx) => answerReviewRequest(trx, attemptId, "Your reading was ten times too large; the points stand.", people.ta));
    const a = (await findAttempt(db, attemptId))!;
    expect(a.reviewAnswer).toBe("Your reading was ten times too large; the points stand.");
    expect(a.reviewAnsweredBy).toBe(people.ta);
    const events = await listGradeEvents(db, attemptId);
    expect(events.at(-1)).toMatchObject({ kind: "review_answer", actorId: people.ta, scoreBefore: 7, scoreAfter: 7 });
  });
});
