// Creates a course with an instructor, a TA, a student and an outsider in the test server's database, and
// labs and attempts in it through the API (shared by the HTTP and browser tests).
import { readFileSync } from "node:fs";
import path from "node:path";
import { hash } from "@node-rs/argon2";
import { expect } from "vitest";
import { e2eDb, uniqueEmail } from "../support/db";
import { Client } from "../support/http";

export const PASSWORD = "fixture-password-1";

export async function courseWithPeople() {
  const db = e2eDb();
  try {
    const passwordHash = await hash(PASSWORD);
    const tag = Math.random().toString(36).slice(2, 8).toUpperCase();
    const course = await db
      .insertInto("courses")
      .values({ code: `T-${tag}`, title: `Fixture course ${tag}`, term: "T", institution: "Fixture college", join_code: `J-${tag}` })
      .returning(["id", "join_code"])
      .executeTakeFirstOrThrow();
    const people: Record<"instructor" | "ta" | "student" | "outsider", { id: string; email: string }> = {} as never;
    for (const role of ["instructor", "ta", "student", "outsider"] as const) {
      const email = uniqueEmail(role);
      const u = await db.insertInto("users").values({ email, name: `Fixture ${role}`, password_hash: passwordHash }).returning("id").executeTakeFirstOrThrow();
      people[role] = { id: u.id, email };
      if (role !== "outsider") await db.insertInto("memberships").values({ course_id: course.id, user_id: u.id, role }).execute();
    }
    return { courseId: course.id, joinCode: course.join_code, people };
  } finally {
    await db.destroy();
  }
}

export async function clientFor(email: string): Promise<Client> {
  const c = new Client();
  const ok = await c.signIn(email, PASSWORD);
  if (!ok) throw new Error(`could not sign in as ${email}`);
  return c;
}

/** One more account with the fixture password: a member of `courseId` with `role`, or a site admin. */
export async function addPerson(
  tag: string,
  opts: { courseId?: string; role?: "student" | "ta" | "instructor"; section?: string; name?: string; isAdmin?: boolean } = {},
) {
  const db = e2eDb();
  try {
    const email = uniqueEmail(tag);
    const u = await db
      .insertInto("users")
      .values({ email, name: opts.name ?? `Fixture ${tag}`, password_hash: await hash(PASSWORD), is_admin: opts.isAdmin ?? false })
      .returning("id")
      .executeTakeFirstOrThrow();
    if (opts.courseId) await db.insertInto("memberships").values({ course_id: opts.courseId, user_id: u.id, role: opts.role ?? "student", section: opts.section ?? null }).execute();
    return { id: u.id, email };
  } finally {
    await db.destroy();
  }
}

/** The build's server-action ids by "file#export" (e.g. "components/lesson/check-question-action.ts#checkAnswer"), from Next.js's manifest. */
export function serverActionIds(): Record<string, string> {
  const dist = path.resolve(import.meta.dirname, "../..", process.env.SHUNTWISE_TEST_DIST_DIR ?? ".next-test");
  const manifest = JSON.parse(readFileSync(path.join(dist, "server", "server-reference-manifest.json"), "utf8")) as {
    node: Record<string, { filename?: string; exportedName?: string }>;
  };
  const out: Record<string, string> = {};
  for (const [id, a] of Object.entries(manifest.node)) if (a.filename && a.exportedName) out[`${a.filename.replace(/^\.\//, "")}#${a.exportedName}`] = id;
  return out;
}

/** A signed-in client for each of the fixture course's people. */
export async function clientsOf(people: Awaited<ReturnType<typeof courseWithPeople>>["people"]) {
  return {
    instructor: await clientFor(people.instructor.email),
    ta: await clientFor(people.ta.email),
    student: await clientFor(people.student.email),
    outsider: await clientFor(people.outsider.email),
  };
}

/** One API call as someone: a test Client (sendAs) or a browser context's request (tests/browser). */
export type Send = (method: "GET" | "POST" | "PATCH", url: string, body?: unknown) => Promise<{ status: number; body: any }>;

export function sendAs(c: Client): Send {
  return (method, url, body) =>
    c.json(url, body === undefined ? { method } : { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
}

const DAY = 24 * 3600 * 1000;

/** The fixed circuit: 5 V supply, 470 Ω load, 10 Ω shunt, with the resistors' tolerances when given. */
export function fixedCircuit(tolerancePercent: { load?: number; shunt?: number } = {}) {
  const tol = (t: number | undefined) => (t === undefined ? {} : { tolerancePercent: t });
  return {
    template: "shunt-burden",
    parameters: {
      supplyVoltage: { mode: "fixed", value: 5 },
      loadResistance: { mode: "fixed", value: 470, ...tol(tolerancePercent.load) },
      shuntResistance: { mode: "fixed", value: 10, ...tol(tolerancePercent.shunt) },
    },
  };
}

/**
 * A lab's JSON input on the fixed circuit with three predictions (indicated current 4 points, true current
 * 3, burden voltage 3), open since yesterday and due in a week, no late penalty; `over` replaces whole fields.
 */
export function fixedCircuitLab(over: Record<string, unknown> = {}) {
  return {
    title: "Burden on a fixed circuit",
    templateKey: "shunt-burden",
    spec: fixedCircuit(),
    questions: [
      { quantity: "indicatedCurrent", kind: "prediction", points: 4 },
      { quantity: "trueCurrent", kind: "prediction", points: 3 },
      { quantity: "burdenVoltage", kind: "prediction", points: 3 },
    ],
    policy: { relativeTolerance: 0.01 },
    attemptsAllowed: 3,
    counting: "best",
    opensAt: new Date(Date.now() - DAY).toISOString(),
    dueAt: new Date(Date.now() + 7 * DAY).toISOString(),
    latePenaltyPercentPerDay: 0,
    lateFloorPercent: 0,
    showExpected: "after_attempt",
    instructions: "Measure it.",
    safetyNotes: "Set the supply's current limit first.",
    ...over,
  };
}

/** Creates the lab as staff and publishes it; returns its id. */
export async function publishedLab(staff: Send, courseId: string, input: object): Promise<string> {
  const created = await staff("POST", `/api/courses/${courseId}/labs`, input);
  expect(created.status).toBe(201);
  const id = created.body.lab.id as string;
  expect((await staff("PATCH", `/api/labs/${id}`, { status: "published" })).status).toBe(200);
  return id;
}

/**
 * A student's attempt at a fixedCircuitLab with a review request; returns the attempt's id. Ohm's law by
 * hand (lib/grader/PHYSICS.md §2): indicated current 5/480 A = 10.4167 mA (10.42 mA is right, 4 points),
 * true current 5/470 A = 10.64 mA (20 mA is wrong, 0 of 3), burden 10.4167 mA × 10 Ω = 0.10417 V (right,
 * 3): 7 of 10.
 */
export async function attemptWithReview(student: Send, labId: string, message: string): Promise<string> {
  const h = await student("GET", `/api/labs/${labId}/handout`);
  expect(h.status).toBe(200);
  const ids = (h.body.handout.questions as { id: string }[]).map((q) => q.id);
  const sub = await student("POST", `/api/labs/${labId}/attempts`, {
    idempotencyKey: `rv-${Date.now()}-${Math.random().toString(36).slice(2)}`,
    readings: { [ids[0]]: "10.42 mA", [ids[1]]: "20 mA", [ids[2]]: "0.1042 V" },
  });
  expect(sub.status).toBe(201);
  expect(sub.body.attempt.score).toBe(7);
  const attemptId = sub.body.attempt.id as string;
  expect((await student("POST", `/api/attempts/${attemptId}/review`, { message })).status).toBe(201);
  return attemptId;
}
