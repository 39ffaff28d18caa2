// What the staff's course home counts, against real PostgreSQL: labs due this week with submitted and
// missing students, open review requests of current students, recomputations in progress.
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { labsDueBetween, openReviewRequests, regradesInProgress, studentReviewRequests } from "@/db/queries/course-home";

const DAY = 24 * 3600 * 1000;

describe("staff course home", () => {
  it("counts submitted and missing students per lab due this week, and lists open review requests", async () => {
    const now = new Date();
    const course = await db.insertInto("courses").values({ code: "H-1", title: "Home", term: "S", institution: "I", join_code: "H-JOIN" }).returning("id").executeTakeFirstOrThrow();
    const people = [];
    for (const [i, role] of (["student", "student", "student", "student", "ta"] as const).entries()) {
      const u = await db.insertInto("users").values({ email: `home${i}@college.example`, name: `Person ${i}`, password_hash: "x" }).returning("id").executeTakeFirstOrThrow();
      await db.insertInto("memberships").values({ course_id: course.id, user_id: u.id, role }).execute();
      people.push(u.id);
    }
    const lab = (title: string, dueAt: Date, status: "draft" | "published" = "published") =>
      db
        .insertInto("labs")
        .values({ course_id: course.id, title, template_key: "shunt-burden", status, spec: "{}", questions: "[]", policy: "{}", due_at: dueAt })
        .returning("id")
        .executeTakeFirstOrThrow();
    const soon = await lab("Due in two days", new Date(now.getTime() + 2 * DAY));
    await lab("Due in ten days", new Date(now.getTime() + 10 * DAY));
    await lab("Due yesterday", new Date(now.getTime() - DAY));
    await lab("Draft due tomorrow", new Date(now.getTime() + DAY), "draft");
    const attempt = (userId: string, number: number, review = false) =>
      db
        .insertInto("attempts")
        .values({
          lab_id: soon.id,
          user_id: userId,
          number,
          idempotency_key: `k${userId}${number}`,
          readings: "{}",
          measured: "{}",
          result: "[]",
          raw_score: 1,
          max_score: 2,
          score: 1,
          grader_version: "t",
          lab_version: 1,
          review_requested_at: review ? new Date() : null,
          review_message: review ? "Please look again" : null,
        })
        .execute();
    await attempt(people[0], 1);
    await attempt(people[0], 2, true);
    await attempt(people[1], 1);
    await attempt(people[4], 1); // the TA tried it: not a student's submission

    const due = await labsDueBetween(db, course.id, now, new Date(now.getTime() + 7 * DAY));
    // four students; two of them submitted (one twice)
    expect(due.map((d) => [d.title, d.submitted, d.missing])).toEqual([["Due in two days", 2, 2]]);

    const reviews = await openReviewRequests(db, course.id);
    expect(reviews.map((r) => [r.studentName, r.number])).toEqual([["Person 0", 2]]);
    // answered after it was asked: no longer open; asked again after the answer: open again
    const asked = await db.selectFrom("attempts").select(["id", "review_requested_at"]).where("review_requested_at", "is not", null).executeTakeFirstOrThrow();
    await db.updateTable("attempts").set({ review_answer: "Checked: the grade stands.", review_answered_at: new Date(asked.review_requested_at!.getTime() + 60_000) }).where("id", "=", asked.id).execute();
    expect(await openReviewRequests(db, course.id)).toEqual([]);
    const mine = await studentReviewRequests(db, course.id, people[0]);
    expect(mine.map((r) => [r.number, r.answer])).toEqual([[2, "Checked: the grade stands."]]);
    await db.updateTable("attempts").set({ review_requested_at: new Date(asked.review_requested_at!.getTime() + 120_000) }).where("id", "=", asked.id).execute();
    expect((await openReviewRequests(db, course.id)).map((r) => r.number)).toEqual([2]);
    // a student who left the course no longer shows in the queue
    await db.deleteFrom("memberships").where("user_id", "=", people[0]).execute();
    expect(await openReviewRequests(db, course.id)).toEqual([]);

    await db.insertInto("lab_regrades").values({ lab_id: soon.id, lab_version: 2, status: "running", total: 3, done: 1 }).execute();
    await db.insertInto("lab_regrades").values({ lab_id: soon.id, lab_version: 1, status: "done", total: 3, done: 3 }).execute();
    expect((await regradesInProgress(db, course.id)).map((r) => [r.title, r.status, r.done, r.total])).toEqual([["Due in two days", "running", 1, 3]]);
  });
});
