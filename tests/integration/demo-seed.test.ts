// The demo course: idempotent seeding, labs in every state, and attempts that show every recognised
// mistake, a late attempt and trace uploads (stored in the local object storage).
import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { seedDemo } from "@/scripts/seed/demo";
import { seedStorageFromEnv } from "@/scripts/seed/storage";
import { listGradeEvents } from "@/db/queries/grade-events";
import { listReviews } from "@/db/queries/reviews";
import { MISTAKE_KEYS } from "@/lib/grader";
import { findLab } from "@/db/queries/labs";
import { toLab } from "@/lib/labs/grading";
import { canStillEarn, expectedVisible } from "@/lib/labs/policy";

describe("the demo seed", () => {
  it("creates the course, its people and labs in every state, and a second run changes nothing", async () => {
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    const count = async () =>
      (
        await sql<{ users: number; labs: number; attempts: number; uploads: number }>`
          select (select count(*)::int from users) users, (select count(*)::int from labs) labs,
                 (select count(*)::int from attempts) attempts, (select count(*)::int from uploads) uploads`.execute(db)
      ).rows[0];
    const first = await count();
    expect(first.users).toBeGreaterThanOrEqual(44);
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    expect(await count()).toEqual(first);

    const roles = await sql<{ role: string; n: number }>`
      select m.role, count(*)::int n from memberships m join courses c on c.id = m.course_id where c.code = 'ELM-214' group by m.role`.execute(db);
    const byRole = Object.fromEntries(roles.rows.map((r) => [r.role, r.n]));
    expect(byRole.instructor).toBe(1);
    expect(byRole.ta).toBe(2);
    expect(byRole.student).toBeGreaterThanOrEqual(40);

    const now = new Date();
    const labs = await db.selectFrom("labs").select(["status", "opens_at", "due_at"]).execute();
    expect(labs.some((l) => l.status === "draft")).toBe(true);
    expect(labs.some((l) => l.status === "published" && l.opens_at && l.opens_at > now)).toBe(true); // upcoming
    expect(labs.some((l) => l.status === "published" && l.due_at && l.due_at < now)).toBe(true); // graded
    expect(labs.some((l) => l.status === "published" && l.opens_at! < now && l.due_at! > now)).toBe(true); // open
  });

  it("has attempts showing every recognised mistake, a late attempt and analysed traces", async () => {
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    const mistakes = await sql<{ k: string }>`
      select distinct r->>'mistake' k from attempts a, jsonb_array_elements(a.result->'results') r where r->>'mistake' is not null`.execute(db);
    expect(mistakes.rows.map((r) => r.k).sort()).toEqual([...MISTAKE_KEYS].sort());
    const late = await db.selectFrom("attempts").select(["late_days", "penalty_percent", "raw_score", "score"]).where("late_days", ">", 0).execute();
    expect(late.length).toBeGreaterThan(0);
    for (const a of late) expect(a.score).toBeCloseTo(a.raw_score * (1 - a.penalty_percent / 100), 6);
    const traces = await db.selectFrom("uploads").select(["analysis", "sha256"]).where("kind", "=", "trace").execute();
    expect(traces.length).toBeGreaterThan(0);
    for (const t of traces) expect((t.analysis as { averageCurrent: number }).averageCurrent).toBeGreaterThan(0);
  });

  it("leaves open review requests, one answered with a changed score, and a grade history for every attempt", async () => {
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    const course = await db.selectFrom("courses").select("id").where("code", "=", "ELM-214").executeTakeFirstOrThrow();
    const open = await listReviews(db, course.id, { status: "open" });
    expect(open.length).toBeGreaterThanOrEqual(3);
    // the demo's first student login has one waiting, oldest first in the queue
    expect(open.map((r) => r.student.name)).toContain("Noor Halvorsen");
    const times = open.map((r) => new Date(r.requestedAt).getTime());
    expect(times).toEqual([...times].sort((a, b) => a - b));
    // on the graded labs (due date passed), one answered with a changed score
    const graded = new Set((await db.selectFrom("labs").select("id").where("course_id", "=", course.id).where("due_at", "<", new Date()).execute()).map((l) => l.id));
    const answered = (await listReviews(db, course.id, { status: "answered" })).filter((r) => graded.has(r.labId));
    expect(answered).toHaveLength(1);
    const events = await listGradeEvents(db, answered[0].attemptId);
    expect(events.map((e) => e.kind)).toEqual(["graded", "override", "review_answer"]);
    expect(events[1].scoreAfter).toBeGreaterThan(events[1].scoreBefore!);
    expect(answered[0].score).toBe(events[1].scoreAfter);
    const without = await sql<{ n: number }>`select count(*)::int n from attempts a where not exists (select 1 from grade_events e where e.attempt_id = a.id)`.execute(db);
    expect(without.rows[0].n).toBe(0);
    // a second run adds no requests and no history
    const before = await sql<{ n: number }>`select count(*)::int n from grade_events`.execute(db);
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    expect((await sql<{ n: number }>`select count(*)::int n from grade_events`.execute(db)).rows[0].n).toBe(before.rows[0].n);
  });

  it("lets no student copy expected values for points: every attempt a student can still improve on hides them", async () => {
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    const now = new Date();
    const rows = await sql<{ lab_id: string; user_id: string; n: number }>`
      select a.lab_id, a.user_id, count(*)::int n from attempts a join labs l on l.id = a.lab_id where l.status = 'published' group by a.lab_id, a.user_id`.execute(db);
    let hidden = 0;
    let shown = 0;
    for (const r of rows.rows) {
      const lab = toLab((await findLab(db, r.lab_id))!);
      const visible = expectedVisible(lab, r.n, now);
      if (canStillEarn(lab, r.n, now)) expect(visible).toBe(false);
      if (visible) shown++;
      else hidden++;
    }
    // the demo shows both: finished labs with their answers, open labs without
    expect(shown).toBeGreaterThan(0);
    expect(hidden).toBeGreaterThan(0);
  });

  it("leaves open and answered review requests on each of labs 10 to 13 in the TA's queue, once", async () => {
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    const course = await db.selectFrom("courses").select("id").where("code", "=", "ELM-214").executeTakeFirstOrThrow();
    const labs = await db.selectFrom("labs").select(["id", "title"]).where("course_id", "=", course.id).where("title", "like", "Lab 1_ ·%").orderBy("title").execute();
    expect(labs.map((l) => l.title.slice(0, 6))).toEqual(["Lab 10", "Lab 11", "Lab 12", "Lab 13"]);
    const ta = await db.selectFrom("users").select("name").where("email", "=", "ta.one@larkmoor-tech.example").executeTakeFirstOrThrow();
    let changed = 0;
    for (const lab of labs) {
      // what GET /api/courses/{courseId}/reviews?labId= answers the TA
      const all = await listReviews(db, course.id, { status: "all", labId: lab.id });
      const open = all.filter((r) => r.status === "open");
      const answered = all.filter((r) => r.status === "answered");
      expect(open.length, lab.title).toBeGreaterThanOrEqual(1);
      expect(answered.length, lab.title).toBeGreaterThanOrEqual(1);
      for (const r of answered) {
        expect(r.answeredBy).toBe(ta.name);
        expect(new Date(r.answeredAt!).getTime()).toBeGreaterThan(new Date(r.requestedAt).getTime());
        expect(new Date(r.answeredAt!).getTime()).toBeLessThan(Date.now());
        const kinds = (await listGradeEvents(db, r.attemptId)).map((e) => e.kind);
        expect(kinds.at(-1)).toBe("review_answer");
        if (kinds.includes("override")) changed++;
      }
      for (const r of open) expect(r.message?.length ?? 0).toBeGreaterThan(20);
    }
    // one of them answered with a changed score
    expect(changed).toBeGreaterThanOrEqual(1);

    // a second run changes no request, no answer and no history
    const snapshot = () =>
      sql<{ id: string; requested: Date | null; message: string | null; answered: Date | null; answer: string | null; score: number }>`
        select id, review_requested_at requested, review_message message, review_answered_at answered, review_answer answer, score
        from attempts where review_requested_at is not null order by id`.execute(db);
    const events = () => sql<{ n: number }>`select count(*)::int n from grade_events`.execute(db);
    const [before, eventsBefore] = [(await snapshot()).rows, (await events()).rows[0].n];
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    expect((await snapshot()).rows).toEqual(before);
    expect((await events()).rows[0].n).toBe(eventsBefore);
  });

  it("gives labs 10 to 13 their review requests when the database was seeded before they had any", async () => {
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    const course = await db.selectFrom("courses").select("id").where("code", "=", "ELM-214").executeTakeFirstOrThrow();
    const lab10 = await db.selectFrom("labs").select("id").where("course_id", "=", course.id).where("title", "like", "Lab 10 ·%").executeTakeFirstOrThrow();
    // as an earlier seed left it: no request on the lab (the history rows stay: the table is append-only)
    await db.updateTable("attempts").set({ review_requested_at: null, review_message: null, review_answered_at: null, review_answer: null, review_answered_by: null }).where("lab_id", "=", lab10.id).execute();
    expect(await listReviews(db, course.id, { status: "all", labId: lab10.id })).toEqual([]);
    await seedDemo(db, { storage: seedStorageFromEnv(process.env) });
    const again = await listReviews(db, course.id, { status: "all", labId: lab10.id });
    expect(again.map((r) => r.status).sort()).toEqual(["answered", "open"]);
  });
});
