// The bench parts list over HTTP: staff only, JSON and CSV with the same counts.
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import type { Client } from "../support/http";
import { clientFor, courseWithPeople, fixedCircuit, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

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

describe("GET /api/labs/{labId}/parts", () => {
  it("is refused to a student; a TA gets one 470 Ω and one 10 Ω per student", async () => {
    expect((await as.student.json(`/api/labs/${labId}/parts`)).status).toBe(403);
    const r = await as.ta.json(`/api/labs/${labId}/parts`);
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
});
