// Creating a course and copying one into a new term, against real PostgreSQL.
import { afterAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { boss } from "@/lib/jobs/queue";
import { changeCourseSettings, copyCourse, createCourse, regenerateJoinCode } from "@/lib/courses/admin";
import { signUpStudent } from "@/lib/courses/joining";

const DAY = 24 * 3600 * 1000;

afterAll(async () => {
  await (await boss()).stop({ graceful: false, wait: true });
});

async function person(email: string, name: string) {
  return db.insertInto("users").values({ email, name, password_hash: "x" }).returning("id").executeTakeFirstOrThrow();
}

describe("creating a course", () => {
  it("makes an existing account the first instructor, or creates one without a password", async () => {
    await person("ina.instructor@college.example", "Ina Instructor");
    const a = await createCourse({ code: "ELX-101", title: "First", term: "Spring", institution: "Test college", instructorEmail: "ina.instructor@college.example", instructorName: "" });
    expect(a.instructor.invited).toBe(false);
    expect(a.course.joinCode).toMatch(/^ELX101-[A-Z2-9]{4}$/);
    const b = await createCourse({ code: "ELX-102", title: "Second", term: "Spring", institution: "Test college", instructorEmail: "new.person@college.example", instructorName: "New Person" });
    expect(b.instructor.invited).toBe(true);
    const row = await db.selectFrom("users").select(["name", "password_hash"]).where("email", "=", "new.person@college.example").executeTakeFirstOrThrow();
    expect(row).toEqual({ name: "New Person", password_hash: null });
    // the new instructor is invited to choose a password; the existing one gets no message
    const mail = await db.selectFrom("mail_outbox").select(["to_address", "kind"]).execute();
    expect(mail).toEqual([{ to_address: "new.person@college.example", kind: "password_set" }]);
    const m = await db.selectFrom("memberships").select(["role"]).where("course_id", "=", b.course.id).execute();
    expect(m).toEqual([{ role: "instructor" }]);
  });

  it("refuses a course code in use (409 naming code) and a new instructor without a name (400 naming instructorName)", async () => {
    await createCourse({ code: "ELX-201", title: "T", term: "S", institution: "I", instructorEmail: "x.new@college.example", instructorName: "X New" });
    await expect(createCourse({ code: "elx-201", title: "T", term: "S", institution: "I", instructorEmail: "x.new@college.example", instructorName: "" })).rejects.toMatchObject({ code: "conflict", fields: { code: expect.any(Array) } });
    await expect(createCourse({ code: "ELX-202", title: "T", term: "S", institution: "I", instructorEmail: "nobody@college.example", instructorName: "" })).rejects.toMatchObject({ code: "bad_request", fields: { instructorName: expect.any(Array) } });
  });
});

describe("copying a course into a new term", () => {
  it("copies the lesson plan and labs as drafts with dates shifted, and no members, variants or attempts", async () => {
    const owner = await person("owner@college.example", "Owner");
    const student = await person("stu@college.example", "Stu");
    const { course } = await createCourse({ code: "ELX-300", title: "Source", term: "Spring 2027", institution: "Test college", instructorEmail: "owner@college.example", instructorName: "" });
    await db.insertInto("memberships").values({ course_id: course.id, user_id: student.id, role: "student" }).execute();
    const opens = new Date("2027-02-01T09:00:00Z");
    const due = new Date("2027-02-08T17:00:00Z");
    const lab = await db
      .insertInto("labs")
      .values({
        course_id: course.id,
        title: "Burden lab",
        template_key: "shunt-burden",
        status: "published",
        spec: JSON.stringify({ template: "shunt-burden", parameters: { supplyVoltage: { mode: "fixed", value: 5 } } }),
        questions: JSON.stringify([{ id: "q1", quantity: "trueCurrent", kind: "prediction", points: 3 }]),
        policy: JSON.stringify({ relativeTolerance: 0.02 }),
        attempts_allowed: 4,
        opens_at: opens,
        due_at: due,
        late_penalty_percent_per_day: 5,
        version: 3,
        published_at: new Date(),
        created_by: owner.id,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db.insertInto("lab_variants").values({ lab_id: lab.id, user_id: student.id, seed: "s", params: JSON.stringify({ supplyVoltage: 5 }) }).execute();
    await db
      .insertInto("attempts")
      .values({ lab_id: lab.id, user_id: student.id, number: 1, idempotency_key: "k1", readings: "{}", measured: "{}", result: "[]", raw_score: 1, max_score: 3, score: 1, grader_version: "t", lab_version: 3 })
      .execute();
    await db.insertInto("course_lessons").values([
      { course_id: course.id, slug: "bench-safety", position: 1, visible: true, opens_at: null },
      { course_id: course.id, slug: "burden-voltage", position: 2, visible: false, opens_at: opens },
    ]).execute();

    const copy = await copyCourse(course.id, { id: owner.id }, { code: "ELX-300-B", term: "Autumn 2027", shiftDays: 210 });
    expect(copy.labs).toBe(1);
    const shift = 210 * DAY;

    const labs = await db.selectFrom("labs").selectAll().where("course_id", "=", copy.course.id).execute();
    expect(labs).toHaveLength(1);
    expect(labs[0]).toMatchObject({
      title: "Burden lab",
      status: "draft",
      version: 1,
      published_at: null,
      attempts_allowed: 4,
      late_penalty_percent_per_day: 5,
      questions: [{ id: "q1", quantity: "trueCurrent", kind: "prediction", points: 3 }],
      policy: { relativeTolerance: 0.02 },
    });
    expect(labs[0].id).not.toBe(lab.id);
    expect(labs[0].opens_at!.getTime()).toBe(opens.getTime() + shift);
    expect(labs[0].due_at!.getTime()).toBe(due.getTime() + shift);
    expect(await db.selectFrom("attempts").select("id").where("lab_id", "=", labs[0].id).execute()).toEqual([]);
    expect(await db.selectFrom("lab_variants").select("user_id").where("lab_id", "=", labs[0].id).execute()).toEqual([]);

    const members = await db.selectFrom("memberships").select(["user_id", "role"]).where("course_id", "=", copy.course.id).execute();
    expect(members).toEqual([{ user_id: owner.id, role: "instructor" }]);
    const plan = await db.selectFrom("course_lessons").select(["slug", "position", "visible", "opens_at"]).where("course_id", "=", copy.course.id).orderBy("position").execute();
    expect(plan).toEqual([
      { slug: "bench-safety", position: 1, visible: true, opens_at: null },
      { slug: "burden-voltage", position: 2, visible: false, opens_at: new Date(opens.getTime() + shift) },
    ]);
    // the source course is untouched
    expect((await db.selectFrom("attempts").select("id").where("lab_id", "=", lab.id).execute())).toHaveLength(1);
    expect(copy.course.joinCode).not.toBe(course.joinCode);
  });
});

describe("course settings", () => {
  it("closing joining refuses the join code; a new join code replaces the old one", async () => {
    const { course } = await createCourse({ code: "ELX-400", title: "Joinable", term: "S", institution: "I", instructorEmail: "j.owner@college.example", instructorName: "J Owner" });
    await changeCourseSettings(course.id, { joiningOpen: false, defaultLatePenaltyPercentPerDay: 20 });
    const signUp = (email: string, joinCode: string) => signUpStudent({ name: "New Student", email, password: "long-enough-password", joinCode });
    await expect(signUp("s1@college.example", course.joinCode)).rejects.toMatchObject({ code: "bad_request", fields: { joinCode: expect.any(Array) } });
    await changeCourseSettings(course.id, { joiningOpen: true });
    const fresh = await regenerateJoinCode(course.id, "ELX-400");
    expect(fresh).not.toBe(course.joinCode);
    await expect(signUp("s2@college.example", course.joinCode)).rejects.toMatchObject({ code: "bad_request" });
    await expect(signUp("s3@college.example", fresh)).resolves.toMatchObject({ course: { id: course.id } });
  });
});
