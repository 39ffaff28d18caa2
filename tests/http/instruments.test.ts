// Instrument profiles over HTTP: the built-in library, a course's instruments (it starts with the teaching
// meter), copying and editing one, bad profiles refused naming the field with nothing changed, who may do
// what, and no deleting an instrument a published lab uses.
import { beforeAll, describe, expect, it } from "vitest";
import type { Client } from "../support/http";
import { e2eDb } from "../support/db";
import { clientsOf, courseWithPeople, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider", Client>;
const send = (c: Client, method: "POST" | "PATCH" | "DELETE", path: string, body?: unknown) =>
  c.json(path, body === undefined ? { method } : { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const list = () => `/api/courses/${f.courseId}/instruments`;

beforeAll(async () => {
  f = await courseWithPeople();
  as = await clientsOf(f.people);
});

describe("GET /api/instruments/library", () => {
  it("lists the four built-in profiles to anyone signed in, and no one else", async () => {
    const r = await as.outsider.json("/api/instruments/library");
    expect(r.status).toBe(200);
    expect(r.body.instruments.map((i: { libraryKey: string }) => i.libraryKey)).toEqual(["teaching-meter", "handheld-multimeter", "bench-multimeter", "feedback-ammeter"]);
    expect(r.body.instruments[0]).toMatchObject({ name: "Teaching meter", kind: "sampling-meter", offset: { volts: 1.25 } });
  });
});

describe("a course's instruments", () => {
  it("a new course starts with the teaching meter, which every member can read", async () => {
    for (const who of ["student", "ta", "instructor"] as const) {
      const r = await as[who].json(list());
      expect(r.status, who).toBe(200);
      expect(r.body.instruments).toHaveLength(1);
      const [m] = r.body.instruments;
      expect(Object.keys(m).sort()).toEqual(["autoRange", "description", "id", "kind", "name", "offset", "ranges"]);
      expect(m.ranges.map((x: { label: string }) => x.label)).toEqual(["5 µA", "500 µA", "50 mA", "1 A"]);
    }
    expect((await as.outsider.json(list())).status).toBe(404);
  });

  it("the instructor copies a built-in profile and edits it; the edit is what the course reads", async () => {
    const made = await send(as.instructor, "POST", list(), { copyOf: "handheld-multimeter", name: "Bench 3 handheld" });
    expect(made.status).toBe(201);
    const id = made.body.instrument.id;
    expect(made.body.instrument).toMatchObject({ name: "Bench 3 handheld", kind: "multimeter" });
    const ranges = made.body.instrument.ranges;
    ranges[0].burdenAtFullScale = 0.12;
    const patched = await send(as.instructor, "PATCH", `/api/instruments/${id}`, { ranges });
    expect(patched.status).toBe(200);
    expect(patched.body.instrument.ranges[0].burdenAtFullScale).toBe(0.12);
    const r = await as.student.json(list());
    expect(r.body.instruments.find((i: { id: string }) => i.id === id).ranges[0].burdenAtFullScale).toBe(0.12);
  });

  it("refuses bad profiles with a 400 naming the field, and keeps what was saved", async () => {
    const lib = (await as.instructor.json("/api/instruments/library")).body.instruments;
    const meter = structuredClone(lib[0]);
    delete meter.libraryKey;
    const cases: [string, (m: typeof meter) => void][] = [
      ["ranges.1.fullScale", (m) => (m.ranges[1].fullScale = 1e-6)], // overlapping ranges
      ["ranges.0.accuracy.percentOfReading", (m) => (m.ranges[0].accuracy.percentOfReading = -0.5)], // negative accuracy
      ["ranges.2.shuntOhms", (m) => (m.ranges[2].shuntOhms = 100)], // 100 Ω × 50 mA = 5 V burden > 2.5 V output
      ["ranges.0.burdenAtFullScale", (m) => (m.ranges[0].burdenAtFullScale = 3)], // a stated burden above the output
      ["autoRange.downAtFractionOfFullScale", (m) => (m.autoRange.downAtFractionOfFullScale = 0.01)], // no hysteresis
      ["name", (m) => (m.name = "Meter\u0007")],
      ["kind", (m) => (m.kind = "oscilloscope")],
    ];
    for (const [field, spoil] of cases) {
      const bad = structuredClone(meter);
      spoil(bad);
      const r = await send(as.instructor, "POST", list(), bad);
      expect(r.status, field).toBe(400);
      expect(Object.keys(r.body.error.fields), field).toContain(field);
    }
    const copy = await send(as.instructor, "POST", list(), { copyOf: "no-such-meter" });
    expect(copy.status).toBe(400);
    expect(Object.keys(copy.body.error.fields)).toContain("copyOf");

    const teaching = (await as.instructor.json(list())).body.instruments[0];
    const ranges = structuredClone(teaching.ranges);
    ranges[3].fullScale = 0.01; // below the 50 mA range
    const p = await send(as.instructor, "PATCH", `/api/instruments/${teaching.id}`, { ranges });
    expect(p.status).toBe(400);
    expect(Object.keys(p.body.error.fields)).toContain("ranges.3.fullScale");
    const after = (await as.instructor.json(list())).body.instruments[0];
    expect(after).toEqual(teaching);
  });

  it("students and TAs cannot create, edit or delete instruments (403); outsiders see no such instrument (404)", async () => {
    const teaching = (await as.instructor.json(list())).body.instruments[0];
    for (const who of ["student", "ta"] as const) {
      expect((await send(as[who], "POST", list(), { copyOf: "bench-multimeter" })).status, who).toBe(403);
      expect((await send(as[who], "PATCH", `/api/instruments/${teaching.id}`, { name: "Mine" })).status, who).toBe(403);
      expect((await send(as[who], "DELETE", `/api/instruments/${teaching.id}`)).status, who).toBe(403);
    }
    expect((await send(as.outsider, "PATCH", `/api/instruments/${teaching.id}`, { name: "Mine" })).status).toBe(404);
    expect((await send(as.outsider, "DELETE", `/api/instruments/${teaching.id}`)).status).toBe(404);
    expect((await send(as.instructor, "DELETE", "/api/instruments/not-a-uuid")).status).toBe(404);
    expect((await as.instructor.json(list())).body.instruments[0]).toEqual(teaching);
  });

  it("an instrument a published lab uses cannot be deleted (409); once unused it can", async () => {
    const made = await send(as.instructor, "POST", list(), { copyOf: "feedback-ammeter" });
    const id = made.body.instrument.id;
    const labId = await publishedLab(sendAs(as.instructor), f.courseId, fixedCircuitLab({ title: "Uses the picoammeter" }));
    const db = e2eDb();
    try {
      await db.updateTable("labs").set({ instrument_id: id }).where("id", "=", labId).execute();
      const refused = await send(as.instructor, "DELETE", `/api/instruments/${id}`);
      expect(refused.status).toBe(409);
      expect(refused.body.error.message).toMatch(/Uses the picoammeter/);
      await db.updateTable("labs").set({ instrument_id: null }).where("id", "=", labId).execute();
    } finally {
      await db.destroy();
    }
    expect((await send(as.instructor, "DELETE", `/api/instruments/${id}`)).status).toBe(200);
    expect((await as.instructor.json(list())).body.instruments.map((i: { id: string }) => i.id)).not.toContain(id);
  });
});
