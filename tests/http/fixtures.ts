// Creates a course with an instructor, a TA, a student and an outsider in the test server's database.
import { readFileSync } from "node:fs";
import path from "node:path";
import { hash } from "@node-rs/argon2";
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
export async function addPerson(tag: string, opts: { courseId?: string; role?: "student" | "ta" | "instructor"; name?: string; isAdmin?: boolean } = {}) {
  const db = e2eDb();
  try {
    const email = uniqueEmail(tag);
    const u = await db
      .insertInto("users")
      .values({ email, name: opts.name ?? `Fixture ${tag}`, password_hash: await hash(PASSWORD), is_admin: opts.isAdmin ?? false })
      .returning("id")
      .executeTakeFirstOrThrow();
    if (opts.courseId) await db.insertInto("memberships").values({ course_id: opts.courseId, user_id: u.id, role: opts.role ?? "student" }).execute();
    return { id: u.id, email };
  } finally {
    await db.destroy();
  }
}

/** The build's server-action ids by "file#export" (e.g. "app/lessons/actions.ts#checkAnswer"), from Next.js's manifest. */
export function serverActionIds(): Record<string, string> {
  const dist = path.resolve(import.meta.dirname, "../..", process.env.SHUNTWISE_TEST_DIST_DIR ?? ".next-test");
  const manifest = JSON.parse(readFileSync(path.join(dist, "server", "server-reference-manifest.json"), "utf8")) as {
    node: Record<string, { filename?: string; exportedName?: string }>;
  };
  const out: Record<string, string> = {};
  for (const [id, a] of Object.entries(manifest.node)) if (a.filename && a.exportedName) out[`${a.filename.replace(/^\.\//, "")}#${a.exportedName}`] = id;
  return out;
}
