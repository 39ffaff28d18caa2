import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { findMembership } from "@/db/queries/courses";
import { signUpStudent } from "@/lib/courses/joining";
import { AppError } from "@/lib/errors";
import { signUpSchema } from "@/lib/validation/auth";

async function course(joinCode = "BENCH-1") {
  return db
    .insertInto("courses")
    .values({ code: `C-${joinCode}`, title: "Test course", term: "T1", institution: "Test college", join_code: joinCode })
    .returning("id")
    .executeTakeFirstOrThrow();
}

const input = (over: Partial<Record<string, string>> = {}) =>
  signUpSchema.parse({ name: "Wren Calder", email: "Wren.Calder@Test.Example", password: "long enough pw", joinCode: "bench-1", ...over });

describe("sign-up with a join code", () => {
  it("creates the account and a student membership of that course", async () => {
    const { id: courseId } = await course();
    const { user } = await signUpStudent(input());
    expect(user.email).toBe("wren.calder@test.example");
    const m = await findMembership(db, courseId, user.id);
    expect(m?.role).toBe("student");
    const stored = await db.selectFrom("users").select("password_hash").where("id", "=", user.id).executeTakeFirstOrThrow();
    expect(stored.password_hash).toMatch(/^\$argon2id\$/);
    expect(stored.password_hash).not.toContain("long enough pw");
  });

  it("refuses a wrong join code, names the field, and creates nothing", async () => {
    await course();
    const err = await signUpStudent(input({ joinCode: "NOPE-9" })).catch((e) => e);
    expect(err).toBeInstanceOf(AppError);
    expect(err.status).toBe(400);
    expect(err.fields).toHaveProperty("joinCode");
    const users = await db.selectFrom("users").select("id").execute();
    expect(users).toHaveLength(0);
  });

  it("refuses a second account for the same e-mail in another case", async () => {
    await course();
    await signUpStudent(input());
    const err = await signUpStudent(input({ email: "WREN.calder@test.example" })).catch((e) => e);
    expect(err).toBeInstanceOf(AppError);
    expect(err.status).toBe(409);
    expect(err.fields).toHaveProperty("email");
  });

  it("keeps e-mails unique whatever their case at the database level too", async () => {
    await db.insertInto("users").values({ email: "a@test.example", name: "A", password_hash: null }).execute();
    await expect(
      sql`insert into users (email, name) values ('A@TEST.EXAMPLE', 'B')`.execute(db),
    ).rejects.toThrow(/users_email_lower_key/);
  });

  it("rejects a short password in the shared schema with a message for that field", () => {
    const r = signUpSchema.safeParse({ name: "x", email: "x@test.example", password: "short", joinCode: "A" });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].path).toEqual(["password"]);
  });
});
