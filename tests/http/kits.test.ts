// Stock and kits over HTTP: the stockroom's exact shape and its 400s, the kits of a published lab per bench
// with their totals against the shelf (a shortage shown), the CSV one row per kit line, the printable page,
// and reading none of them stores a circuit.
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import { e2eDb } from "../support/db";
import type { Client } from "../support/http";
import { addPerson, clientsOf, courseWithPeople, fixedCircuit, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider", Client>;
let partner: { id: string };
let loner: { id: string };
let labId: string;

const send = (c: Client, method: string, path: string, body?: unknown) =>
  c.json(path, { method, headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
const stored = async () => {
  const db = e2eDb();
  try {
    return (await db.selectFrom("lab_variants").select("user_id").where("lab_id", "=", labId).execute()).length;
  } finally {
    await db.destroy();
  }
};

beforeAll(async () => {
  f = await courseWithPeople();
  as = await clientsOf(f.people);
  partner = await addPerson("kit-partner", { courseId: f.courseId, role: "student", name: "Kit Partner" });
  loner = await addPerson("kit-loner", { courseId: f.courseId, role: "student", name: "Kit Loner" });
  expect((await send(as.instructor, "PUT", `/api/courses/${f.courseId}/benches`, { benches: [{ name: "Bench 07", memberIds: [f.people.student.id, partner.id] }] })).status).toBe(200);
  labId = await publishedLab(sendAs(as.instructor), f.courseId, fixedCircuitLab({ title: "Kit lab", spec: fixedCircuit({ load: 1, shunt: 5 }), safetyNotes: "Limit the supply to 20 mA." }));
  // wait for the publish job to draw the three circuits
  for (let i = 0; i < 100 && (await stored()) < 3; i++) await new Promise((ok) => setTimeout(ok, 200));
  expect(await stored()).toBe(3);
});

describe("GET|PUT /api/courses/{courseId}/stock", () => {
  it("replaces the shelf and answers it; bad lines are 400 naming the field; students 403", async () => {
    const put = await send(as.instructor, "PUT", `/api/courses/${f.courseId}/stock`, {
      items: [
        { kind: "resistor", value: 470, tolerancePercent: 1, quantity: 10 },
        { kind: "resistor", value: 10, tolerancePercent: 5, quantity: 2 },
        { kind: "capacitor", value: 1e-7, tolerancePercent: 10, quantity: 5 },
      ],
    });
    expect(put.status).toBe(200);
    expect(put.body.items).toHaveLength(3);
    expect(put.body.items[0]).toEqual({ id: expect.any(String), kind: "resistor", value: 10, tolerancePercent: 5, quantity: 2 });
    for (const [body, field] of [
      [{ items: [{ kind: "inductor", value: 1, tolerancePercent: 1, quantity: 1 }] }, "items.0.kind"],
      [{ items: [{ kind: "resistor", value: -1, tolerancePercent: 1, quantity: 1 }] }, "items.0.value"],
      [{ items: [{ kind: "resistor", value: 1, tolerancePercent: 1, quantity: 1.5 }] }, "items.0.quantity"],
      [{ items: [{ kind: "resistor", value: 1, tolerancePercent: 1, quantity: 1 }, { kind: "resistor", value: 1, tolerancePercent: 1, quantity: 2 }] }, "items.1.value"],
    ] as const) {
      const r = await send(as.instructor, "PUT", `/api/courses/${f.courseId}/stock`, body);
      expect(r.status).toBe(400);
      expect(Object.keys(r.body.error.fields)).toContain(field);
    }
    expect((await as.student.json(`/api/courses/${f.courseId}/stock`)).status).toBe(403);
    expect((await send(as.ta, "PUT", `/api/courses/${f.courseId}/stock`, { items: [] })).status).toBe(403);
    expect((await as.ta.json(`/api/courses/${f.courseId}/stock`)).body.items).toHaveLength(3);
  });
});

describe("GET /api/labs/{labId}/kits", () => {
  it("packs one bag per bench and one for the student at no bench; totals against the shelf show the shortage; nothing is drawn", async () => {
    const before = await stored();
    const r = await as.ta.json(`/api/labs/${labId}/kits`);
    expect(r.status).toBe(200);
    // fixed circuit: each student's circuit needs one 470 Ω 1 % and one 10 Ω 5 % (fixtures.ts fixedCircuit)
    expect(r.body.kits).toEqual([
      {
        bench: "Bench 07",
        student: null,
        members: expect.arrayContaining([{ userId: partner.id, name: "Kit Partner" }]),
        parts: [
          { label: "10.0 Ω", value: 10, tolerancePercent: 5, count: 2 },
          { label: "470 Ω", value: 470, tolerancePercent: 1, count: 2 },
        ],
      },
      { bench: null, student: { userId: loner.id, name: "Kit Loner" }, members: [{ userId: loner.id, name: "Kit Loner" }], parts: expect.any(Array) },
    ]);
    expect(r.body.totals).toEqual([
      { label: "10.0 Ω", value: 10, tolerancePercent: 5, needed: 3, inStock: 2 },
      { label: "470 Ω", value: 470, tolerancePercent: 1, needed: 3, inStock: 10 },
    ]);
    const csv = await as.instructor.fetch(`/api/labs/${labId}/kits?format=csv`);
    expect(csv.headers.get("content-type")).toMatch(/^text\/csv/);
    const rows = Papa.parse<Record<string, string>>(await csv.text(), { header: true, skipEmptyLines: true }).data;
    expect(rows.map((x) => [x.kit, x.value_ohm, x.count])).toEqual([
      ["Bench 07", "10", "2"],
      ["Bench 07", "470", "2"],
      ["Kit Loner", "10", "1"],
      ["Kit Loner", "470", "1"],
    ]);
    const page = await as.ta.fetch(`/labs/${labId}/kits`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("Bench 07");
    expect(html).toContain("Limit the supply to 20 mA.");
    expect(html).toContain("short by 1");
    expect((await as.student.json(`/api/labs/${labId}/kits`)).status).toBe(403);
    expect(await stored()).toBe(before);
  });
});
