// Course creation (site admin only) and copying (instructor only) over HTTP.
import { beforeAll, describe, expect, it } from "vitest";
import { Client } from "../support/http";
import { uniqueEmail } from "../support/db";
import { clientFor, courseWithPeople } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let admin: Client;
let as: Record<"instructor" | "ta" | "student", Client>;

beforeAll(async () => {
  f = await courseWithPeople();
  admin = new Client();
  expect(await admin.signIn("admin@larkmoor-tech.example", "bench-demo-2026")).toBe(true);
  as = { instructor: await clientFor(f.people.instructor.email), ta: await clientFor(f.people.ta.email), student: await clientFor(f.people.student.email) };
});

describe("POST /api/courses", () => {
  it("only the site admin creates a course; the new instructor sees it in their courses", async () => {
    const tag = Math.random().toString(36).slice(2, 7).toUpperCase();
    const body = { code: `NEW-${tag}`, title: "New course", term: "Autumn", institution: "Test college", instructorEmail: f.people.ta.email };
    expect((await as.instructor.post("/api/courses", body)).status).toBe(403);
    expect((await new Client().post("/api/courses", body)).status).toBe(401);
    const bad = await admin.post("/api/courses", { ...body, instructorEmail: "nope" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(["instructorEmail"]);
    const r = await admin.post("/api/courses", body);
    expect(r.status).toBe(201);
    expect(r.body.instructor).toMatchObject({ email: f.people.ta.email, invited: false });
    const mine = await as.ta.json("/api/courses");
    expect(mine.body.courses).toContainEqual(expect.objectContaining({ id: r.body.course.id, role: "instructor" }));
    expect((await admin.post("/api/courses", body)).status).toBe(409);
  });

  it("creates an account for a new instructor when a name is given", async () => {
    const tag = Math.random().toString(36).slice(2, 7).toUpperCase();
    const r = await admin.post("/api/courses", { code: `INV-${tag}`, title: "Invited", term: "Autumn", institution: "Test college", instructorEmail: uniqueEmail("newinstr"), instructorName: "Nova Instructor" });
    expect(r.status).toBe(201);
    expect(r.body.instructor.invited).toBe(true);
  });
});

describe("POST /api/courses/{courseId}/copy and PATCH /api/courses/{courseId}", () => {
  it("a TA or student cannot copy or change settings (403); the instructor copies into a new term", async () => {
    const body = { code: `CP-${Math.random().toString(36).slice(2, 7)}`, term: "Autumn", shiftDays: 7 };
    expect((await as.ta.post(`/api/courses/${f.courseId}/copy`, body)).status).toBe(403);
    expect((await as.student.post(`/api/courses/${f.courseId}/copy`, body)).status).toBe(403);
    const patch = (c: Client, b: unknown) => c.json(`/api/courses/${f.courseId}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify(b) });
    expect((await patch(as.ta, { title: "Hijacked" })).status).toBe(403);
    const badShift = await as.instructor.post(`/api/courses/${f.courseId}/copy`, { ...body, shiftDays: 1.5 });
    expect(badShift.status).toBe(400);
    expect(Object.keys(badShift.body.error.fields)).toEqual(["shiftDays"]);
    const r = await as.instructor.post(`/api/courses/${f.courseId}/copy`, body);
    expect(r.status).toBe(201);
    const copied = await as.instructor.json(`/api/courses/${r.body.course.id}/members`);
    expect(copied.body.members.map((m: { email: string; role: string }) => [m.email, m.role])).toEqual([[f.people.instructor.email, "instructor"]]);

    const bad = await patch(as.instructor, { defaultLateFloorPercent: 140 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(["defaultLateFloorPercent"]);
    const ok = await patch(as.instructor, { term: "Spring (revised)", joiningOpen: false });
    expect(ok.status).toBe(200);
    expect(ok.body.course).toMatchObject({ term: "Spring (revised)", joiningOpen: false });
    const code = await as.instructor.post(`/api/courses/${f.courseId}/join-code`, {});
    expect(code.status).toBe(200);
    expect(code.body.joinCode).not.toBe(f.joinCode);
    expect((await as.ta.post(`/api/courses/${f.courseId}/join-code`, {})).status).toBe(403);
  });
});
