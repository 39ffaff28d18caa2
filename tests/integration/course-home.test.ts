// What the staff's course home counts, against real PostgreSQL: labs closing this week with submitted and
// missing students, open review requests of current students, recomputations in progress.
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { staffHome } from "@/lib/courses/home";
import { openReviewRequests, regradesInProgress, studentReviewRequests } from "@/db/queries/course-home";

const DAY = 24 * 3600 * 1000;

describe("staff course home", () => {
  it("counts submitted and missing students per lab closing this week, and lists open review requests", async () => {
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

    // (no late penalty: each lab closes at its due date) four students; two of them submitted (one twice)
    const { closing } = await staffHome(course.id, now);
    expect(closing.map((d) => [d.title, d.submitted, d.missing])).toEqual([["Due in two days", 2, 2]]);

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

  it("says a lab is closing this week by its close (the explicit one, else the due date plus the late days), not its due date", async () => {
    const now = new Date();
    const course = await db.insertInto("courses").values({ code: "H-2", title: "Closing", term: "S", institution: "I", join_code: "H-CLOSE" }).returning("id").executeTakeFirstOrThrow();
    const lab = (title: string, v: { due: number | null; close?: number; perDay?: number; floor?: number }) =>
      db
        .insertInto("labs")
        .values({
          course_id: course.id,
          title,
          template_key: "shunt-burden",
          status: "published",
          spec: "{}",
          questions: "[]",
          policy: "{}",
          due_at: v.due === null ? null : new Date(now.getTime() + v.due * DAY),
          closes_at: v.close === undefined ? null : new Date(now.getTime() + v.close * DAY),
          late_penalty_percent_per_day: v.perDay ?? 0,
          late_floor_percent: v.floor ?? 0,
        })
        .execute();
    await lab("Due soon, closes in a fortnight", { due: 2, close: 14 });
    await lab("Due last week, closes in two days", { due: -5, close: 2 });
    await lab("Due yesterday, closed this morning", { due: -1, close: -0.25 });
    await lab("Due tomorrow, no late work", { due: 1 });
    // 10 % a day down to a 50 % floor: (100 − 50) / 10 = 5 days of late work (by hand), so it closes in six days
    await lab("Due tomorrow, five late days", { due: 1, perDay: 10, floor: 50 });
    // 5 % a day down to 0: 100 / 5 = 20 late days (by hand), closing in twenty-two days
    await lab("Due in two days, twenty late days", { due: 2, perDay: 5, floor: 0 });
    await lab("No dates", { due: null });

    const home = await staffHome(course.id, now);
    expect(home.closing.map((l) => l.title)).toEqual(["Due tomorrow, no late work", "Due last week, closes in two days", "Due tomorrow, five late days"]);
    expect(home.closing[1].closesAt.getTime()).toBe(now.getTime() + 2 * DAY);
    expect(home.closing[2].closesAt.getTime()).toBe(now.getTime() + 6 * DAY);
    expect(home.nextLater).toBeNull();

    // nothing closing this week: the next lab to close later is named instead
    const later = await staffHome(course.id, new Date(now.getTime() + 6.5 * DAY));
    expect(later.closing).toEqual([]);
    expect(later.nextLater?.title).toBe("Due soon, closes in a fortnight");
  });
});
