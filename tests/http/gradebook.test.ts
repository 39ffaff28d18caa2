// The gradebook route over HTTP: who may read and export, the JSON shape, the CSV round trip (a student
// named "=1+1" comes back as text), the weights route, and the demo course's forty students.
// Scores are set in the test server's database directly; expected values are worked out by hand here
// (common practice, no source).
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import { e2eDb } from "../support/db";
import { Client } from "../support/http";
import { clientFor, courseWithPeople } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider", Client>;
let labId: string;
let lastId: string;
let attemptIds: string[];

beforeAll(async () => {
  f = await courseWithPeople();
  const db = e2eDb();
  try {
    // The fixture's student is renamed to a formula; it has a section.
    await db.updateTable("users").set({ name: "=1+1" }).where("id", "=", f.people.student.id).execute();
    await db.updateTable("memberships").set({ section: "Tue" }).where("user_id", "=", f.people.student.id).where("course_id", "=", f.courseId).execute();
    const mk = (title: string, counting: "best" | "last", due: Date) =>
      db
        .insertInto("labs")
        .values({
          course_id: f.courseId,
          title,
          template_key: "shunt-burden",
          status: "published",
          spec: JSON.stringify({ template: "shunt-burden", parameters: {} }),
          questions: JSON.stringify([{ id: "q1", quantity: "indicatedCurrent", kind: "prediction", points: 10 }]),
          policy: JSON.stringify({ relativeTolerance: 0.01 }),
          counting,
          due_at: due,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
    labId = (await mk("Burden, best", "best", new Date(Date.now() - 3 * 864e5))).id;
    lastId = (await mk("Shunt, last", "last", new Date(Date.now() - 2 * 864e5))).id;
    const at = (lab: string, number: number, score: number, lateDays = 0) =>
      db
        .insertInto("attempts")
        .values({
          lab_id: lab,
          user_id: f.people.student.id,
          number,
          idempotency_key: `h-${lab}-${number}`,
          readings: "{}",
          measured: "{}",
          result: JSON.stringify({ results: [{ id: "q1", verdict: score === 10 ? "correct" : "wrong" }] }),
          raw_score: score,
          max_score: 10,
          late_days: lateDays,
          penalty_percent: 0,
          score,
          grader_version: "test",
          lab_version: 1,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
    // best of 4 and 7 → 7; last of 9 and 5 (late) → 5. Total by points: (7 + 5) / 20 = 60 %.
    attemptIds = [(await at(labId, 1, 4)).id, (await at(labId, 2, 7)).id, (await at(lastId, 1, 9)).id, (await at(lastId, 2, 5, 1)).id];
  } finally {
    await db.destroy();
  }
  as = {
    instructor: await clientFor(f.people.instructor.email),
    ta: await clientFor(f.people.ta.email),
    student: await clientFor(f.people.student.email),
    outsider: await clientFor(f.people.outsider.email),
  };
});

describe("GET /api/courses/{courseId}/gradebook", () => {
  it("answers staff with the labs in due order and each student's counted cells and total", async () => {
    for (const c of [as.instructor, as.ta]) {
      const r = await c.json(`/api/courses/${f.courseId}/gradebook`);
      expect(r.status).toBe(200);
      expect(r.body.labs.map((l: { id: string; title: string; maxPoints: number; weight: null }) => [l.id, l.title, l.maxPoints, l.weight])).toEqual([
        [labId, "Burden, best", 10, null],
        [lastId, "Shunt, last", 10, null],
      ]);
      expect(typeof r.body.labs[0].dueAt).toBe("string");
      expect(new Date(r.body.labs[0].dueAt).getTime()).toBeLessThan(Date.now());
      expect(r.body.students).toHaveLength(1);
      const s = r.body.students[0];
      expect(s).toMatchObject({ userId: f.people.student.id, name: "=1+1", email: f.people.student.email, section: "Tue", total: 60 });
      expect(s.cells[labId]).toEqual({ score: 7, maxScore: 10, attemptId: attemptIds[1], attempts: 2, late: false, changedByStaff: false, reviewOpen: false, simulated: false });
      expect(s.cells[lastId]).toEqual({ score: 5, maxScore: 10, attemptId: attemptIds[3], attempts: 2, late: true, changedByStaff: false, reviewOpen: false, simulated: false });
    }
  });

  it("exports CSV to the instructor that parses back to the same numbers, the formula name as text", async () => {
    const res = await as.instructor.fetch(`/api/courses/${f.courseId}/gradebook?format=csv`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename=".*\.csv"$/);
    const text = await res.text();
    const rows = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { skipEmptyLines: true }).data;
    expect(rows).toEqual([
      ["name", "email", "section", "Burden, best", "Shunt, last", "total"],
      ["'=1+1", f.people.student.email, "Tue", "7", "5", "60"],
    ]);
  });

  it("lets a TA read but not export, and refuses students (403), outsiders (404) and visitors (401)", async () => {
    expect((await as.ta.json(`/api/courses/${f.courseId}/gradebook?format=csv`)).status).toBe(403);
    const s = await as.student.json(`/api/courses/${f.courseId}/gradebook`);
    expect(s.status).toBe(403);
    expect(s.body.error.code).toBe("forbidden");
    expect((await as.student.json(`/api/courses/${f.courseId}/gradebook?format=csv`)).status).toBe(403);
    expect((await as.outsider.json(`/api/courses/${f.courseId}/gradebook`)).status).toBe(404);
    expect((await new Client().json(`/api/courses/${f.courseId}/gradebook`)).status).toBe(401);
  });

  it("names the field of a bad format", async () => {
    const r = await as.instructor.json(`/api/courses/${f.courseId}/gradebook?format=xlsx`);
    expect(r.status).toBe(400);
    expect(Object.keys(r.body.error.fields)).toEqual(["format"]);
  });

  it("refuses the gradebook page to a student with 403 and shows it to the TA", async () => {
    const page = await as.student.fetch(`/courses/${f.courseId}/gradebook`);
    expect(page.status).toBe(403);
    const ta = await as.ta.fetch(`/courses/${f.courseId}/gradebook`);
    expect(ta.status).toBe(200);
    // a row's link: one student's counted scores, for the staff only
    const row = await as.ta.fetch(`/courses/${f.courseId}/gradebook/students/${f.people.student.id}`);
    expect(row.status).toBe(200);
    const html = await row.text();
    expect(html).toContain("Counted scores");
    expect(html).toContain(`/attempts/${attemptIds[1]}`);
    expect((await as.student.fetch(`/courses/${f.courseId}/gradebook/students/${f.people.student.id}`)).status).toBe(403);
    expect((await as.outsider.fetch(`/courses/${f.courseId}/gradebook`)).status).toBe(404);
  });
});

describe("PUT /api/courses/{courseId}/gradebook/weights", () => {
  it("sets weights that the total and the export use; only the instructor; bad weights name the field", async () => {
    const bad = await as.instructor.json(`/api/courses/${f.courseId}/gradebook/weights`, {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ weights: [{ labId, weight: -1 }] }),
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(["weights.0.weight"]);
    const ta = await as.ta.json(`/api/courses/${f.courseId}/gradebook/weights`, {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ weights: [{ labId, weight: 3 }] }),
    });
    expect(ta.status).toBe(403);
    const ok = await as.instructor.json(`/api/courses/${f.courseId}/gradebook/weights`, {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ weights: [{ labId, weight: 3 }, { labId: lastId, weight: 1 }] }),
    });
    expect(ok.status).toBe(200);
    // (3 · 0.7 + 1 · 0.5) / 4 = 0.65 → 65 %.
    const g = await as.instructor.json(`/api/courses/${f.courseId}/gradebook`);
    expect(g.body.labs.map((l: { weight: number }) => l.weight)).toEqual([3, 1]);
    expect(g.body.students[0].total).toBe(65);
    const csv = await (await as.instructor.fetch(`/api/courses/${f.courseId}/gradebook?format=csv`)).text();
    expect(csv.trim().split("\r\n")[1].endsWith(",65")).toBe(true);
    // the form lives on the course settings page
    const settings = await (await as.instructor.fetch(`/courses/${f.courseId}/settings`)).text();
    expect(settings).toContain("Lab weights");
    expect(settings).toContain("Burden, best");
  });
});

describe("the demo course's gradebook", () => {
  it("shows all forty students and every published lab", async () => {
    const demo = new Client();
    expect(await demo.signIn("instructor@larkmoor-tech.example", "bench-demo-2026")).toBe(true);
    const courses = await demo.json("/api/courses");
    const elm = courses.body.courses.find((c: { code: string }) => c.code === "ELM-214");
    const r = await demo.json(`/api/courses/${elm.id}/gradebook`);
    expect(r.status).toBe(200);
    expect(r.body.students.length).toBeGreaterThanOrEqual(40);
    const labs = await demo.json(`/api/courses/${elm.id}/labs`);
    const published = labs.body.labs.filter((l: { status: string }) => l.status === "published");
    expect(r.body.labs.map((l: { id: string }) => l.id).sort()).toEqual(published.map((l: { id: string }) => l.id).sort());
    const filled = r.body.students.flatMap((s: { cells: Record<string, unknown> }) => Object.values(s.cells).filter(Boolean));
    expect(filled.length).toBeGreaterThan(40);
  });
});
