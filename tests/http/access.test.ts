// Every API route answers anonymous callers 401, members without the role 403 and outsiders 404.
import { beforeAll, describe, expect, it } from "vitest";
import { Client } from "../support/http";
import { clientsOf, courseWithPeople, PASSWORD } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider", Client>;
const anon = new Client();

beforeAll(async () => {
  f = await courseWithPeople();
  as = await clientsOf(f.people);
});

describe("GET /api/health", () => {
  it("reports the database as reachable", async () => {
    const r = await anon.json("/api/health");
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ status: "ok", database: "reachable" });
  });
});

describe("GET /api/courses", () => {
  it("is 401 for anonymous callers with the JSON error shape", async () => {
    const r = await anon.json("/api/courses");
    expect(r.status).toBe(401);
    expect(r.body.error.code).toBe("unauthorized");
    expect(typeof r.body.error.message).toBe("string");
  });

  it("lists my courses with my role in each", async () => {
    const r = await as.ta.json("/api/courses");
    expect(r.status).toBe(200);
    expect(r.body.courses).toEqual([expect.objectContaining({ id: f.courseId, role: "ta" })]);
    const none = await as.outsider.json("/api/courses");
    expect(none.body.courses).toEqual([]);
  });
});

describe("GET /api/courses/{courseId}/members", () => {
  const path = () => `/api/courses/${f.courseId}/members`;
  it("is 401 anonymous, 403 for a student, 404 for an outsider", async () => {
    expect((await anon.json(path())).status).toBe(401);
    const s = await as.student.json(path());
    expect(s.status).toBe(403);
    expect(s.body.error.code).toBe("forbidden");
    const o = await as.outsider.json(path());
    expect(o.status).toBe(404);
    expect(o.body.error.code).toBe("not_found");
  });

  it("is 404 (not 500) for a course id that is not a uuid or does not exist", async () => {
    expect((await as.instructor.json("/api/courses/not-a-uuid/members")).status).toBe(404);
    expect((await as.instructor.json("/api/courses/00000000-0000-4000-8000-000000000000/members")).status).toBe(404);
  });

  it("lists members with roles for the course staff", async () => {
    const r = await as.ta.json(path());
    expect(r.status).toBe(200);
    const roles = Object.fromEntries(r.body.members.map((m: { email: string; role: string }) => [m.email, m.role]));
    expect(roles).toEqual({
      [f.people.instructor.email]: "instructor",
      [f.people.ta.email]: "ta",
      [f.people.student.email]: "student",
    });
  });
});

describe("POST /api/courses/{courseId}/members", () => {
  const path = () => `/api/courses/${f.courseId}/members`;
  it("is 401 anonymous, 403 for a student and a TA, 404 for an outsider", async () => {
    const body = { email: f.people.outsider.email, role: "student" };
    expect((await anon.post(path(), body)).status).toBe(401);
    expect((await as.student.post(path(), body)).status).toBe(403);
    expect((await as.ta.post(path(), body)).status).toBe(403);
    expect((await as.outsider.post(path(), body)).status).toBe(404);
  });

  it("lets the instructor add an account by e-mail with a role", async () => {
    const r = await as.instructor.post(path(), { email: f.people.outsider.email.toUpperCase(), role: "ta", section: "C" });
    expect(r.status).toBe(201);
    expect(r.body.member).toMatchObject({ email: f.people.outsider.email, role: "ta", section: "C" });
    const courses = await as.outsider.json("/api/courses");
    expect(courses.body.courses).toEqual([expect.objectContaining({ id: f.courseId, role: "ta" })]);
  });

  it("answers bad input with 400 naming the field, and keeps existing members", async () => {
    const r = await as.instructor.post(path(), { email: "not-an-address", role: "dean" });
    expect(r.status).toBe(400);
    expect(Object.keys(r.body.error.fields).sort()).toEqual(["email", "role"]);
    const notJson = await as.instructor.json(path(), { method: "POST", headers: { "content-type": "application/json" }, body: "{" });
    expect(notJson.status).toBe(400);
    expect(notJson.body.error.message).toMatch(/JSON/);
    const members = await as.instructor.json(path());
    expect(members.body.members.length).toBeGreaterThanOrEqual(3);
  });

  it("answers an unknown e-mail with 404 naming the field", async () => {
    const r = await as.instructor.post(path(), { email: "nobody.here@test.example", role: "student" });
    expect(r.status).toBe(404);
    expect(r.body.error.fields).toHaveProperty("email");
  });
});

describe("sign-in", () => {
  it("refuses a wrong password and an unknown e-mail alike", async () => {
    const wrong = new Client();
    expect(await wrong.signIn(f.people.student.email, "not-the-password")).toBe(false);
    const unknown = new Client();
    expect(await unknown.signIn("nobody.at.all@test.example", PASSWORD)).toBe(false);
  });
});

describe("password hashes never leave the server", () => {
  it("appear in no API response or page", async () => {
    const bodies = [
      (await as.instructor.json("/api/courses")).text,
      (await as.instructor.json(`/api/courses/${f.courseId}/members`)).text,
      (await as.instructor.json("/api/auth/session")).text,
      await (await as.instructor.fetch(`/courses/${f.courseId}/roster`)).text(),
      await (await as.instructor.fetch(`/courses/${f.courseId}`)).text(),
      await (await as.instructor.fetch(`/`)).text(),
    ];
    for (const b of bodies) {
      expect(b).not.toMatch(/argon2/i);
      expect(b).not.toMatch(/password_?hash/i);
    }
  });
});
