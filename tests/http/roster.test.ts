// Roster routes over HTTP: who may change the roster, the last-instructor rule as a 409 with a message,
// and a removed student's attempts coming back when they are added again.
import { beforeAll, describe, expect, it } from "vitest";
import type { Client } from "../support/http";
import { clientsOf, courseWithPeople, fixedCircuit, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider", Client>;

const send = (c: Client, method: string, path: string, body?: unknown) =>
  c.json(path, { method, headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });

beforeAll(async () => {
  f = await courseWithPeople();
  as = await clientsOf(f.people);
});

describe("PATCH and DELETE /api/courses/{courseId}/members/{userId}", () => {
  const member = (id: string) => `/api/courses/${f.courseId}/members/${id}`;

  it("a TA cannot change the roster (403), a student neither, an outsider gets 404", async () => {
    const who = f.people.student.id;
    for (const [c, status] of [[as.ta, 403], [as.student, 403], [as.outsider, 404]] as const) {
      expect((await send(c, "PATCH", member(who), { section: "X" })).status).toBe(status);
      expect((await send(c, "DELETE", member(who))).status).toBe(status);
      expect((await send(c, "POST", `/api/courses/${f.courseId}/members/import`, { csv: "A,a@college.example,1", confirm: false })).status).toBe(status);
    }
  });

  it("the last instructor cannot be demoted or removed: 409 with a message", async () => {
    const demote = await send(as.instructor, "PATCH", member(f.people.instructor.id), { role: "ta" });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toMatch(/at least one instructor/);
    const remove = await send(as.instructor, "DELETE", member(f.people.instructor.id));
    expect(remove.status).toBe(409);
    expect(remove.body.error.code).toBe("conflict");
  });

  it("names the bad field, and 404 for someone who is not a member", async () => {
    const bad = await send(as.instructor, "PATCH", member(f.people.student.id), { role: "dean" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toContain("role");
    expect((await send(as.instructor, "PATCH", member(f.people.outsider.id), { section: "A" })).status).toBe(404);
    expect((await send(as.instructor, "DELETE", member("not-a-uuid"))).status).toBe(404);
  });

  it("changes a section and role; a removed student's attempts show again when they return", async () => {
    const labId = await publishedLab(
      sendAs(as.instructor),
      f.courseId,
      fixedCircuitLab({
        title: "Roster lab",
        spec: fixedCircuit({ load: 1, shunt: 1 }),
        questions: [{ quantity: "trueCurrent", kind: "prediction", points: 2 }],
        latePenaltyPercentPerDay: 10,
        lateFloorPercent: 50,
      }),
    );
    const handout = await as.student.json(`/api/labs/${labId}/handout`);
    const q = handout.body.handout.questions[0].id;
    // I = V / (RL + Rsh) = 5 / 480 = 10.4 mA (Ohm's law)
    const sub = await as.student.post(`/api/labs/${labId}/attempts`, { idempotencyKey: "roster-1", readings: { [q]: "10.4 mA" } });
    expect(sub.status).toBe(201);

    const sec = await send(as.instructor, "PATCH", member(f.people.student.id), { section: "B2" });
    expect(sec.status).toBe(200);
    expect(sec.body.member).toMatchObject({ role: "student", section: "B2" });

    expect((await send(as.instructor, "DELETE", member(f.people.student.id))).status).toBe(200);
    expect((await as.student.json(`/api/labs/${labId}/attempts`)).status).toBe(404);
    const roster = await as.instructor.json(`/api/courses/${f.courseId}/members`);
    expect(roster.body.members.map((m: { email: string }) => m.email)).not.toContain(f.people.student.email);

    const back = await as.instructor.post(`/api/courses/${f.courseId}/members`, { email: f.people.student.email, role: "student" });
    expect(back.status).toBe(201);
    const mine = await as.student.json(`/api/labs/${labId}/attempts`);
    expect(mine.status).toBe(200);
    expect(mine.body.attempts).toHaveLength(1);
    expect(mine.body.attempts[0].id).toBe(sub.body.attempt.id);
  });
});
