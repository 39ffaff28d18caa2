// Exceptions over HTTP: an extension lets one student submit after the due date without the late penalty
// (the attempt already made loses its penalty, with the reason in its grade history), extra attempts add to
// the lab's, everyone else is still penalised and limited, the gradebook marks the cell, removal undoes it,
// and bad bodies answer 400 naming the field.
import { beforeAll, describe, expect, it } from "vitest";
import type { Client } from "../support/http";
import { addPerson, clientFor, clientsOf, courseWithPeople, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

const DAY = 24 * 3600 * 1000;
let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider", Client>;
let peer: { id: string; email: string };
let peerClient: Client;
let labId: string;
let questions: string[];

const send = (c: Client, method: string, path: string, body?: unknown) =>
  c.json(path, { method, headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
const url = (userId: string) => `/api/labs/${labId}/exceptions/${userId}`;
const REASON = "Medical note seen by the instructor";

// Ohm's law by hand (lib/grader/PHYSICS.md §2), as in fixtures.ts attemptWithReview: 7 of 10 raw points
const submit = (c: Client, key: string) =>
  send(c, "POST", `/api/labs/${labId}/attempts`, { idempotencyKey: `${key}-${Math.random().toString(36).slice(2)}`, readings: { [questions[0]]: "10.42 mA", [questions[1]]: "20 mA", [questions[2]]: "0.1042 V" } });

beforeAll(async () => {
  f = await courseWithPeople();
  as = await clientsOf(f.people);
  peer = await addPerson("exception-peer", { courseId: f.courseId, role: "student", name: "Peer of the exception" });
  peerClient = await clientFor(peer.email);
  // due two and a half days ago: an attempt now is 3 days late, 10 % a day down to a floor of 50 %
  labId = await publishedLab(
    sendAs(as.instructor),
    f.courseId,
    fixedCircuitLab({ title: "Extension lab", attemptsAllowed: 1, opensAt: new Date(Date.now() - 5 * DAY).toISOString(), dueAt: new Date(Date.now() - 2.5 * DAY).toISOString(), latePenaltyPercentPerDay: 10, lateFloorPercent: 50 }),
  );
  const h = await as.student.json(`/api/labs/${labId}/handout`);
  questions = (h.body.handout.questions as { id: string }[]).map((q) => q.id);
});

describe("PUT and DELETE /api/labs/{labId}/exceptions/{userId}", () => {
  let firstAttempt: string;

  it("before the exception both students are 3 days late: 30 % off 7 points", async () => {
    const [a, b] = await Promise.all([submit(as.student, "s1"), submit(peerClient, "p1")]);
    expect([a.status, b.status]).toEqual([201, 201]);
    for (const r of [a, b]) expect(r.body.attempt).toMatchObject({ rawScore: 7, lateDays: 3, penaltyPercent: 30, score: 4.9 });
    firstAttempt = a.body.attempt.id;
  });

  it("refuses bad bodies with 400 naming the field, students and TAs with 403; nothing is stored", async () => {
    const cases: [unknown, string][] = [
      [{}, "reason"],
      [{ reason: "ok reason" }, "dueAt"],
      [{ reason: "ok reason", dueAt: "tomorrow-ish" }, "dueAt"],
      [{ reason: "ok reason", dueAt: new Date(Date.now() + 2 * DAY).toISOString(), closesAt: new Date(Date.now() + DAY).toISOString() }, "closesAt"],
      [{ reason: "ok reason", extraAttempts: -1 }, "extraAttempts"],
      [{ reason: "ok reason", extraAttempts: 1.5 }, "extraAttempts"],
      [{ reason: "\u0000", extraAttempts: 1 }, "reason"],
    ];
    for (const [body, field] of cases) {
      const r = await send(as.instructor, "PUT", url(f.people.student.id), body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(r.body.error.fields), JSON.stringify(body)).toContain(field);
    }
    const ok = { reason: REASON, extraAttempts: 1 };
    expect((await send(as.instructor, "PUT", url(f.people.ta.id), ok)).body.error.fields).toHaveProperty("userId");
    expect((await send(as.instructor, "PUT", url(f.people.outsider.id), ok)).status).toBe(404);
    expect((await send(as.student, "PUT", url(f.people.student.id), ok)).status).toBe(403);
    expect((await send(as.ta, "PUT", url(f.people.student.id), ok)).status).toBe(403);
    expect((await send(as.student, "DELETE", url(f.people.student.id))).status).toBe(403);
    expect((await send(as.outsider, "PUT", url(f.people.student.id), ok)).status).toBe(404);
    const tb = await as.ta.json(`/api/courses/${f.courseId}/gradebook`);
    expect(tb.body.students.every((s: { exceptions: object }) => Object.keys(s.exceptions).length === 0)).toBe(true);
  });

  it("an extension lifts the penalty of the attempt already made, with the reason in its grade history", async () => {
    const r = await send(as.instructor, "PUT", url(f.people.student.id), { dueAt: new Date(Date.now() + DAY).toISOString(), extraAttempts: 1, reason: REASON });
    expect(r.status).toBe(200);
    expect(r.body.exception).toMatchObject({ labId, userId: f.people.student.id, extraAttempts: 1, reason: REASON, closesAt: null });
    const a = await as.student.json(`/api/attempts/${firstAttempt}`);
    expect(a.body.attempt).toMatchObject({ lateDays: 0, penaltyPercent: 0, score: 7 });
    const h = await as.student.json(`/api/attempts/${firstAttempt}/history`);
    expect(h.body.events.at(-1)).toMatchObject({ kind: "exception", scoreBefore: 4.9, scoreAfter: 7, reason: `Exception: ${REASON}` });
  });

  it("the student submits after the lab's due date without penalty and gets one more attempt; the other student is still penalised and limited", async () => {
    const second = await submit(as.student, "s2");
    expect(second.status).toBe(201);
    expect(second.body.attempt).toMatchObject({ lateDays: 0, penaltyPercent: 0, score: 7 });
    expect((await submit(as.student, "s3")).status).toBe(409);
    expect((await submit(peerClient, "p2")).status).toBe(409);
    const own = await as.student.json(`/api/labs/${labId}`);
    expect(new Date(own.body.lab.dueAt).getTime()).toBeGreaterThan(Date.now());
    expect(own.body.lab.attemptsAllowed).toBe(2);
    const theirs = await peerClient.json(`/api/labs/${labId}`);
    expect(new Date(theirs.body.lab.dueAt).getTime()).toBeLessThan(Date.now());
    expect(theirs.body.lab.attemptsAllowed).toBe(1);
    const page = await (await as.student.fetch(`/labs/${labId}`)).text();
    expect(page).toContain(REASON);
  });

  it("the gradebook marks the student's cell with the reason, not the other student's", async () => {
    const g = await as.ta.json(`/api/courses/${f.courseId}/gradebook`);
    const row = (id: string) => g.body.students.find((s: { userId: string }) => s.userId === id);
    expect(row(f.people.student.id).exceptions).toEqual({ [labId]: REASON });
    expect(row(f.people.student.id).cells[labId]).toMatchObject({ score: 7, late: false });
    expect(row(peer.id).exceptions).toEqual({});
    expect(row(peer.id).cells[labId]).toMatchObject({ score: 4.9, late: true });
  });

  it("removing the exception gives the attempts the lab's own late penalty again, recorded; a second removal is 404", async () => {
    const r = await send(as.instructor, "DELETE", url(f.people.student.id));
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ removed: true });
    const a = await as.student.json(`/api/attempts/${firstAttempt}`);
    expect(a.body.attempt).toMatchObject({ lateDays: 3, penaltyPercent: 30, score: 4.9 });
    const h = await as.student.json(`/api/attempts/${firstAttempt}/history`);
    expect(h.body.events.at(-1)).toMatchObject({ kind: "exception", scoreBefore: 7, scoreAfter: 4.9 });
    expect(h.body.events.at(-1).reason).toContain(REASON);
    expect((await send(as.instructor, "DELETE", url(f.people.student.id))).status).toBe(404);
  });
});
