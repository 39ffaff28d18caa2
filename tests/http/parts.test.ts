// The bench parts list over HTTP: staff only, JSON and CSV with the same counts.
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import type { Client } from "../support/http";
import { e2eDb } from "../support/db";
import { addPerson, clientFor, courseWithPeople, fixedCircuit, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student", Client>;
let labId: string;

beforeAll(async () => {
  f = await courseWithPeople();
  as = { instructor: await clientFor(f.people.instructor.email), ta: await clientFor(f.people.ta.email), student: await clientFor(f.people.student.email) };
  labId = await publishedLab(
    sendAs(as.instructor),
    f.courseId,
    fixedCircuitLab({
      title: "Parts lab",
      spec: fixedCircuit({ load: 1, shunt: 5 }),
      questions: [{ quantity: "trueCurrent", kind: "prediction", points: 1 }],
      attemptsAllowed: 1,
      opensAt: null,
      dueAt: null,
    }),
  );
});

/** The list once the publish job has drawn every student's circuit (it runs in the server's job worker). */
async function partsWhenDrawn(c: Client) {
  for (let i = 0; i < 100; i++) {
    const r = await c.json(`/api/labs/${labId}/parts`);
    if (r.status !== 200 || r.body.drawn === r.body.students) return r;
    await new Promise((ok) => setTimeout(ok, 200));
  }
  throw new Error("the publish job did not draw every circuit within 20 s");
}

describe("GET /api/labs/{labId}/parts", () => {
  it("is refused to a student; a TA gets one 470 Ω and one 10 Ω per student once publishing drew the circuits", async () => {
    expect((await as.student.json(`/api/labs/${labId}/parts`)).status).toBe(403);
    const r = await partsWhenDrawn(as.ta);
    expect(r.body.drawn).toBe(1);
    expect(r.status).toBe(200);
    // the fixture course has one student; fixed values: every circuit needs exactly these two parts
    expect(r.body.students).toBe(1);
    expect(r.body.parts.map((p: { value: number; tolerancePercent: number; total: number }) => [p.value, p.tolerancePercent, p.total])).toEqual([
      [10, 5, 1],
      [470, 1, 1],
    ]);
  });

  it("answers the same list as a CSV download", async () => {
    const res = await as.instructor.fetch(`/api/labs/${labId}/parts?format=csv`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="parts-parts-lab.csv"');
    const rows = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true }).data;
    expect(rows.map((r) => [r.value_ohm, r.total, r["section no section"]])).toEqual([
      ["10", "1", "1"],
      ["470", "1", "1"],
    ]);
  });

  it("reading the parts list, its CSV, its page and the gradebook stores no circuit; a later joiner is drawn on first open", async () => {
    await partsWhenDrawn(as.ta);
    const late = await addPerson("parts-late-joiner", { courseId: f.courseId, role: "student" });
    const stored = async () => {
      const db = e2eDb();
      try {
        return (await db.selectFrom("lab_variants").select("user_id").where("lab_id", "=", labId).execute()).length;
      } finally {
        await db.destroy();
      }
    };
    const before = await stored();
    expect(before).toBe(1);
    const reads = await Promise.all([
      as.ta.json(`/api/labs/${labId}/parts`),
      as.instructor.fetch(`/api/labs/${labId}/parts?format=csv`),
      as.ta.fetch(`/labs/${labId}/parts`),
      as.ta.json(`/api/courses/${f.courseId}/gradebook`),
      as.instructor.fetch(`/courses/${f.courseId}/gradebook`),
    ]);
    expect(reads.map((r) => r.status)).toEqual([200, 200, 200, 200, 200]);
    expect(reads[0].body).toMatchObject({ students: 2, drawn: 1 });
    expect(await stored()).toBe(before);
    const joiner = await clientFor(late.email);
    expect((await joiner.json(`/api/labs/${labId}/handout`)).status).toBe(200);
    expect(await stored()).toBe(before + 1);
  });
});
