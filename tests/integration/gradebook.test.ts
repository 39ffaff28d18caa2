// The gradebook's numbers against real PostgreSQL: counted attempts (best, ties to the later attempt;
// last), stored late penalties, a staff change of a score, the weighted total, and the statistics.
// Every expected number is worked out by hand below (common practice, no source) and, cell by cell,
// by a separate plain SQL query written here, independent of db/queries/gradebook.ts.
import Papa from "papaparse";
import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { gradebook, gradebookStatistics, ownGrades, setLabWeights } from "@/db/queries/gradebook";
import { gradebookCsv } from "@/lib/gradebook/csv";

const DAY = 24 * 3600 * 1000;

async function person(name: string, email: string) {
  return (await db.insertInto("users").values({ name, email, password_hash: null }).returning("id").executeTakeFirstOrThrow()).id;
}

async function lab(courseId: string, title: string, o: { counting: "best" | "last"; points: number[]; due: Date | null; status?: "draft" | "published" }) {
  const questions = o.points.map((points, i) => ({ id: `q${i + 1}`, quantity: i === 0 ? "indicatedCurrent" : "burdenVoltage", kind: "prediction", points }));
  return (
    await db
      .insertInto("labs")
      .values({
        course_id: courseId,
        title,
        template_key: "shunt-burden",
        status: o.status ?? "published",
        spec: JSON.stringify({ template: "shunt-burden", parameters: {} }),
        questions: JSON.stringify(questions),
        policy: JSON.stringify({ relativeTolerance: 0.01 }),
        counting: o.counting,
        due_at: o.due,
        late_penalty_percent_per_day: 25,
      })
      .returning("id")
      .executeTakeFirstOrThrow()
  ).id;
}

let seq = 0;
async function attempt(
  labId: string,
  userId: string,
  number: number,
  a: { raw: number; max: number; lateDays?: number; penalty?: number; score: number; verdicts?: [string, string?][]; review?: boolean; answered?: Date },
) {
  const results = (a.verdicts ?? []).map(([verdict, mistake], i) => ({ id: `q${i + 1}`, verdict, ...(mistake ? { mistake } : {}) }));
  return (
    await db
      .insertInto("attempts")
      .values({
        lab_id: labId,
        user_id: userId,
        number,
        idempotency_key: `k${++seq}`,
        readings: "{}",
        measured: "{}",
        result: JSON.stringify({ results }),
        raw_score: a.raw,
        max_score: a.max,
        late_days: a.lateDays ?? 0,
        penalty_percent: a.penalty ?? 0,
        score: a.score,
        grader_version: "test",
        lab_version: 1,
        submitted_at: new Date(Date.now() - (10 - number) * 3600_000),
        review_requested_at: a.review ? new Date() : null,
        review_message: a.review ? "Please look again." : null,
        review_answered_at: a.answered ?? null,
      })
      .returning("id")
      .executeTakeFirstOrThrow()
  ).id;
}

/** A course of three students, two staff, three published labs and a draft. */
async function fixture() {
  const course = await db
    .insertInto("courses")
    .values({ code: "GB-1", title: "Gradebook course", term: "T", institution: "Fixture college", join_code: "GB-J" })
    .returning("id")
    .executeTakeFirstOrThrow();
  const courseId = course.id;
  const ada = await person("Ada Brook", "ada@test.example");
  const formula = await person("=1+1", "formula@test.example");
  const idle = await person("Idle Student", "idle@test.example");
  const ta = await person("A Teaching Assistant", "ta@test.example");
  const outsider = await person("Other Course Student", "other@test.example");
  await db
    .insertInto("memberships")
    .values([
      { course_id: courseId, user_id: ada, role: "student", section: "A" },
      { course_id: courseId, user_id: formula, role: "student", section: "B" },
      { course_id: courseId, user_id: idle, role: "student", section: "A" },
      { course_id: courseId, user_id: ta, role: "ta", section: null },
    ])
    .execute();
  const now = Date.now();
  const labA = await lab(courseId, "A: burden", { counting: "best", points: [4, 6], due: new Date(now - 5 * DAY) });
  const labB = await lab(courseId, "B: shunt", { counting: "last", points: [5], due: new Date(now - 2 * DAY) });
  const labC = await lab(courseId, "C: ranges", { counting: "best", points: [10], due: new Date(now + 5 * DAY) });
  const draft = await lab(courseId, "D: draft", { counting: "best", points: [10], due: null, status: "draft" });

  const ids: Record<string, string> = {};
  // Ada, lab A (best): 6, 8, 7 → attempt 2 counts, 8/10.
  ids.adaA1 = await attempt(labA, ada, 1, { raw: 6, max: 10, score: 6, verdicts: [["correct"], ["mistake", "prefix-slip"]] });
  ids.adaA2 = await attempt(labA, ada, 2, { raw: 8, max: 10, score: 8, verdicts: [["correct"], ["close"]] });
  ids.adaA3 = await attempt(labA, ada, 3, { raw: 7, max: 10, score: 7, verdicts: [["correct"], ["mistake", "ignored-burden"]] });
  // Ada, lab B (last): 5, then a late one: raw 4, one day late at 25 %/day → 4 × 0.75 = 3 (counts, though lower).
  ids.adaB1 = await attempt(labB, ada, 1, { raw: 5, max: 5, score: 5, verdicts: [["correct"]] });
  ids.adaB2 = await attempt(labB, ada, 2, { raw: 4, max: 5, lateDays: 1, penalty: 25, score: 3, verdicts: [["mistake", "prefix-slip"]] });
  // Ada, lab C (not yet due): 9/10 with a review request.
  ids.adaC1 = await attempt(labC, ada, 1, { raw: 9, max: 10, score: 9, verdicts: [["close"]], review: true });
  // "=1+1", lab A: 7 then 9; a staff override lifts attempt 1 to 9: tie → the later attempt (2) counts.
  ids.fA1 = await attempt(labA, formula, 1, { raw: 7, max: 10, score: 7, verdicts: [["mistake", "prefix-slip"], ["wrong"]] });
  ids.fA2 = await attempt(labA, formula, 2, { raw: 9, max: 10, score: 9, verdicts: [["correct"], ["unit"]], review: true, answered: new Date(Date.now() + 1000) });
  await db.updateTable("attempts").set({ raw_score: 9, score: 9, changed_by_staff: true }).where("id", "=", ids.fA1).execute();
  // "=1+1", lab C: 4, then a staff override lifts it to 10: it counts, marked as changed by staff.
  ids.fC1 = await attempt(labC, formula, 1, { raw: 4, max: 10, score: 4, verdicts: [["wrong"]] });
  await db.updateTable("attempts").set({ raw_score: 10, score: 10, changed_by_staff: true }).where("id", "=", ids.fC1).execute();
  // An attempt on the draft and one by a non-member never show.
  await attempt(draft, ada, 1, { raw: 10, max: 10, score: 10 });
  await attempt(labA, outsider, 1, { raw: 10, max: 10, score: 10 });
  return { courseId, ada, formula, idle, ta, labA, labB, labC, draft, ids };
}

/** The counted attempt of one student in one lab, by plain SQL written for this test. */
async function countedBySql(labId: string, userId: string) {
  const r = await sql<{ id: string; score: number; max_score: number; late_days: number; n: number; staff: boolean; review: boolean }>`
    select a.id, a.score, a.max_score, a.late_days,
      (select count(*)::int from attempts b where b.lab_id = a.lab_id and b.user_id = a.user_id) as n,
      a.changed_by_staff as staff,
      exists (select 1 from attempts b where b.lab_id = a.lab_id and b.user_id = a.user_id and b.review_requested_at is not null
              and (b.review_answered_at is null or b.review_answered_at < b.review_requested_at)) as review
    from attempts a join labs l on l.id = a.lab_id
    where a.lab_id = ${labId} and a.user_id = ${userId}
    order by case when l.counting = 'last' then a.number end desc nulls last, a.score desc, a.number desc
    limit 1`.execute(db);
  return r.rows[0] ?? null;
}

describe("the gradebook query", () => {
  it("counts best or last attempts with their late penalty, agrees with plain SQL cell by cell, and totals by points", async () => {
    const f = await fixture();
    const g = await gradebook(db, f.courseId);

    expect(g.labs.map((l) => [l.title, l.maxPoints, l.weight])).toEqual([
      ["A: burden", 10, null],
      ["B: shunt", 5, null],
      ["C: ranges", 10, null],
    ]);
    expect(g.students.map((s) => [s.name, s.section])).toEqual([
      ["=1+1", "B"],
      ["Ada Brook", "A"],
      ["Idle Student", "A"],
    ]);

    const ada = g.students.find((s) => s.userId === f.ada)!;
    expect(ada.cells[f.labA]).toEqual({ score: 8, maxScore: 10, attemptId: f.ids.adaA2, attempts: 3, late: false, changedByStaff: false, reviewOpen: false, simulated: false });
    expect(ada.cells[f.labB]).toEqual({ score: 3, maxScore: 5, attemptId: f.ids.adaB2, attempts: 2, late: true, changedByStaff: false, reviewOpen: false, simulated: false });
    expect(ada.cells[f.labC]).toMatchObject({ score: 9, attemptId: f.ids.adaC1, reviewOpen: true });
    expect(Object.keys(ada.cells)).toEqual([f.labA, f.labB, f.labC]);
    const formula = g.students.find((s) => s.userId === f.formula)!;
    // the answered review is no longer open; the overridden attempt 1 does not count (tie), so no staff marker
    expect(formula.cells[f.labA]).toMatchObject({ score: 9, attemptId: f.ids.fA2, attempts: 2, changedByStaff: false, reviewOpen: false });
    expect(formula.cells[f.labB]).toBeNull();
    expect(formula.cells[f.labC]).toMatchObject({ score: 10, attemptId: f.ids.fC1, changedByStaff: true });

    // Every cell against the plain SQL.
    for (const s of g.students) {
      for (const l of g.labs) {
        const want = await countedBySql(l.id, s.userId);
        const got = s.cells[l.id];
        if (!want) expect(got).toBeNull();
        else
          expect(got).toEqual({
            score: want.score,
            maxScore: want.max_score,
            attemptId: want.id,
            attempts: want.n,
            late: want.late_days > 0,
            changedByStaff: want.staff,
            reviewOpen: want.review,
            simulated: false,
          });
      }
    }

    // Totals weighted by points over labs past due or submitted:
    // Ada (8 + 3 + 9) / (10 + 5 + 10) = 80 %; "=1+1" (9 + 0 + 10) / (10 + 5 + 10) = 76 %; Idle 0 / 15 = 0 %.
    expect(g.students.map((s) => s.total)).toEqual([76, 80, 0]);
  });

  it("uses the instructor's weights for the total", async () => {
    const f = await fixture();
    await setLabWeights(db, f.courseId, [
      { labId: f.labA, weight: 1 },
      { labId: f.labB, weight: 3 },
    ]);
    const g = await gradebook(db, f.courseId);
    expect(g.labs.map((l) => l.weight)).toEqual([1, 3, null]);
    // Ada: (1·0.8 + 3·0.6 + 10·0.9) / (1 + 3 + 10) = 11.6 / 14 = 82.857… → 82.9 %;
    // "=1+1": (1·0.9 + 3·0 + 10·1.0) / 14 = 10.9 / 14 = 77.857… → 77.9 %.
    const byId = Object.fromEntries(g.students.map((s) => [s.userId, s.total]));
    expect(byId[f.ada]).toBe(82.9);
    expect(byId[f.formula]).toBe(77.9);
    expect(byId[f.idle]).toBe(0);
  });

  it("gives one student's own row", async () => {
    const f = await fixture();
    const g = await gradebook(db, f.courseId, f.ada);
    expect(g.students).toHaveLength(1);
    expect(g.students[0]).toMatchObject({ userId: f.ada, total: 80 });
  });

  it("leaves held grades out of the student's own row and total", async () => {
    const f = await fixture();
    await db.updateTable("labs").set({ grades_held: true }).where("id", "=", f.labC).execute();
    const own = await ownGrades(db, f.courseId, f.ada);
    expect(own.heldLabIds).toEqual([f.labC]);
    expect(own.gradebook.students[0].cells[f.labC]).toBeNull();
    // (8 + 3) / (10 + 5) = 73.33… → 73.3 %
    expect(own.gradebook.students[0].total).toBe(73.3);
    // the staff still see it
    expect((await gradebook(db, f.courseId, f.ada)).students[0].cells[f.labC]).toMatchObject({ score: 9 });
  });

  it("exports CSV that parses back to the same numbers, with a formula-like name kept as text", async () => {
    const f = await fixture();
    const g = await gradebook(db, f.courseId);
    const csv = gradebookCsv(g);
    const parsed = Papa.parse<string[]>(csv.replace(/^\uFEFF/, ""), { skipEmptyLines: true });
    expect(parsed.data[0]).toEqual(["name", "email", "section", "A: burden", "B: shunt", "C: ranges", "total"]);
    expect(parsed.data.slice(1)).toEqual([
      ["'=1+1", "formula@test.example", "B", "9", "", "10", "76"],
      ["Ada Brook", "ada@test.example", "A", "8", "3", "9", "80"],
      ["Idle Student", "idle@test.example", "A", "", "", "", "0"],
    ]);
  });

  it("computes per-lab and per-question statistics over counted attempts", async () => {
    const f = await fixture();
    const { labs, questions: qs } = await gradebookStatistics(db, f.courseId);
    // Lab A: counted 8 (Ada) and 9 ("=1+1"); Idle missing. Mean 8.5, median 8.5.
    expect(labs[0]).toEqual({ labId: f.labA, submitted: 2, missing: 1, mean: 8.5, median: 8.5, percents: [80, 90] });
    expect(labs[1]).toMatchObject({ labId: f.labB, submitted: 1, missing: 2, mean: 3, median: 3, percents: [60] });

    const a1 = qs.find((q) => q.labId === f.labA && q.questionId === "q1")!;
    const a2 = qs.find((q) => q.labId === f.labA && q.questionId === "q2")!;
    // Counted attempts of lab A: Ada #2 (correct, close), "=1+1" #2 (correct, unit → wrong); Idle missing both.
    expect(a1).toMatchObject({ correct: 2, close: 0, mistake: 0, wrong: 0, missing: 1, notSubmitted: 1, topMistake: null });
    expect(a2).toMatchObject({ correct: 0, close: 1, mistake: 0, wrong: 1, missing: 1 });
    const b1 = qs.find((q) => q.labId === f.labB)!;
    expect(b1).toMatchObject({ correct: 0, mistake: 1, missing: 2, topMistake: "prefix-slip", topMistakeCount: 1 });
  });
});
