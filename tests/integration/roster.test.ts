// Roster changes against real PostgreSQL: the CSV import's preview and confirmation, and the rule that a
// course always keeps an instructor.
import { afterAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { boss } from "@/lib/jobs/queue";
import { addMember, changeMember, importMembers, removeMember } from "@/lib/courses/roster";

async function course() {
  return db
    .insertInto("courses")
    .values({ code: "R-1", title: "Roster course", term: "Spring", institution: "Test college", join_code: "R-JOIN-1" })
    .returning("id")
    .executeTakeFirstOrThrow();
}

async function person(email: string, name: string) {
  return db.insertInto("users").values({ email, name, password_hash: "x" }).returning("id").executeTakeFirstOrThrow();
}

async function members(courseId: string) {
  const rows = await db
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.email", "m.role", "m.section"])
    .where("m.course_id", "=", courseId)
    .orderBy("u.email")
    .execute();
  return rows;
}

afterAll(async () => {
  await (await boss()).stop({ graceful: false, wait: true });
});

/** Invitations queued (one outbox row and one pg-boss job each), per address. */
async function invitations() {
  const rows = await db.selectFrom("mail_outbox").select(["to_address", "kind", "job_id"]).orderBy("to_address").execute();
  return rows.map((r) => [r.to_address, r.kind, r.job_id !== null]);
}

const CSV = [
  "name,email,section",
  "Nia Newcomer,nia.newcomer@college.example,A1",
  "Kai Known,kai.known@college.example,A2",
  "Mo Member,mo.member@college.example,A1",
  "Bad Address,mo.member(at)college.example,A1",
  "Nia Twice,NIA.NEWCOMER@college.example,A3",
  "Oli Other,oli.other@college.example,",
].join("\n");

describe("CSV import", () => {
  it("previews every row with its mark and saves nothing", async () => {
    const c = await course();
    const mo = await person("mo.member@college.example", "Mo Member");
    await person("kai.known@college.example", "Kai Known");
    await db.insertInto("memberships").values({ course_id: c.id, user_id: mo.id, role: "student", section: "A1" }).execute();
    const usersBefore = await db.selectFrom("users").select("email").execute();

    const r = await importMembers(c.id, CSV, false);
    expect(r.saved).toBe(0);
    expect(r.rows.map((x) => [x.line, x.email, x.outcome])).toEqual([
      [2, "nia.newcomer@college.example", "invite"],
      [3, "kai.known@college.example", "add"],
      [4, "mo.member@college.example", "member"],
      [5, "mo.member(at)college.example", "bad_email"],
      [6, "nia.newcomer@college.example", "duplicate"],
      [7, "oli.other@college.example", "invite"],
    ]);
    expect(r.rows[0]).toMatchObject({ name: "Nia Newcomer", section: "A1" });
    expect(r.rows[4].message).toMatch(/line 2/);
    expect(await members(c.id)).toEqual([{ email: "mo.member@college.example", role: "student", section: "A1" }]);
    expect(await db.selectFrom("users").select("email").execute()).toEqual(usersBefore);
    expect(await invitations()).toEqual([]);
  });

  it("on confirmation saves the good rows as students, creates accounts without passwords for new addresses", async () => {
    const c = await course();
    const mo = await person("mo.member@college.example", "Mo Member");
    await person("kai.known@college.example", "Kai Known");
    await db.insertInto("memberships").values({ course_id: c.id, user_id: mo.id, role: "ta", section: null }).execute();

    const r = await importMembers(c.id, CSV, true);
    expect(r.saved).toBe(3);
    expect(await members(c.id)).toEqual([
      { email: "kai.known@college.example", role: "student", section: "A2" },
      { email: "mo.member@college.example", role: "ta", section: null }, // already a member: unchanged
      { email: "nia.newcomer@college.example", role: "student", section: "A1" },
      { email: "oli.other@college.example", role: "student", section: null },
    ]);
    const created = await db
      .selectFrom("users")
      .select(["email", "name", "password_hash"])
      .where("email", "in", ["nia.newcomer@college.example", "oli.other@college.example"])
      .orderBy("email")
      .execute();
    expect(created).toEqual([
      { email: "nia.newcomer@college.example", name: "Nia Newcomer", password_hash: null },
      { email: "oli.other@college.example", name: "Oli Other", password_hash: null },
    ]);

    // one invitation per new account, none for the existing ones
    expect(await invitations()).toEqual([
      ["nia.newcomer@college.example", "password_set", true],
      ["oli.other@college.example", "password_set", true],
    ]);

    // importing the same file again adds no one and invites no one
    const again = await importMembers(c.id, CSV, true);
    expect(again.saved).toBe(0);
    expect(again.rows.filter((x) => x.outcome === "member")).toHaveLength(4);
    expect(await invitations()).toHaveLength(2);
  });

  it("refuses a file without rows, naming the field", async () => {
    const c = await course();
    await expect(importMembers(c.id, "name,email,section\n\n", false)).rejects.toMatchObject({ code: "bad_request", fields: { csv: expect.any(Array) } });
  });
});

describe("the last instructor", () => {
  it("cannot be demoted or removed; with a second instructor both work", async () => {
    const c = await course();
    const a = await person("first.instructor@college.example", "First Instructor");
    await db.insertInto("memberships").values({ course_id: c.id, user_id: a.id, role: "instructor" }).execute();

    await expect(changeMember(c.id, a.id, { role: "ta" })).rejects.toMatchObject({ code: "conflict", message: expect.stringMatching(/at least one instructor/) });
    await expect(removeMember(c.id, a.id)).rejects.toMatchObject({ code: "conflict" });
    await expect(addMember(c.id, { email: "first.instructor@college.example", role: "student", section: null })).rejects.toMatchObject({ code: "conflict" });
    // a section change alone is fine
    await expect(changeMember(c.id, a.id, { section: "Lab 3" })).resolves.toMatchObject({ role: "instructor", section: "Lab 3" });

    await person("second.instructor@college.example", "Second Instructor");
    await addMember(c.id, { email: "second.instructor@college.example", role: "instructor", section: null });
    await changeMember(c.id, a.id, { role: "ta" });
    expect((await members(c.id)).map((m) => [m.email, m.role])).toEqual([
      ["first.instructor@college.example", "ta"],
      ["second.instructor@college.example", "instructor"],
    ]);
  });

  it("two concurrent demotions of the last two instructors leave one instructor", async () => {
    const c = await course();
    const a = await person("a.instructor@college.example", "A Instructor");
    const b = await person("b.instructor@college.example", "B Instructor");
    await db.insertInto("memberships").values([
      { course_id: c.id, user_id: a.id, role: "instructor" },
      { course_id: c.id, user_id: b.id, role: "instructor" },
    ]).execute();
    const results = await Promise.allSettled([removeMember(c.id, a.id), changeMember(c.id, b.id, { role: "student" })]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect((await members(c.id)).filter((m) => m.role === "instructor")).toHaveLength(1);
  });
});
