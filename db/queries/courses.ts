// Courses and memberships (who is in which course, with which role and section).
import { type Kysely, sql, type Transaction } from "kysely";
import type { Database, Db as DbOrTrx, Role } from "../types";

type Db = Kysely<Database>;

export interface CourseSummary {
  id: string;
  code: string;
  title: string;
  term: string;
  institution: string;
  role: Role;
  section: string | null;
}

export interface MemberRow {
  userId: string;
  name: string;
  email: string;
  role: Role;
  section: string | null;
  joinedAt: Date;
}

export async function listCoursesForUser(db: Db, userId: string): Promise<CourseSummary[]> {
  return db
    .selectFrom("memberships as m")
    .innerJoin("courses as c", "c.id", "m.course_id")
    .select(["c.id", "c.code", "c.title", "c.term", "c.institution", "m.role", "m.section"])
    .where("m.user_id", "=", userId)
    .orderBy("c.code")
    .execute();
}

const COURSE_COLUMNS = [
  "c.id",
  "c.code",
  "c.title",
  "c.term",
  "c.institution",
  "c.join_code as joinCode",
  "c.joining_open as joiningOpen",
  "c.default_late_penalty_percent_per_day as defaultLatePenaltyPercentPerDay",
  "c.default_late_floor_percent as defaultLateFloorPercent",
] as const;

export async function findCourse(db: Db, courseId: string) {
  return db.selectFrom("courses as c").select(COURSE_COLUMNS).where("c.id", "=", courseId).executeTakeFirst();
}

export type CourseRow = NonNullable<Awaited<ReturnType<typeof findCourse>>>;

/** The course and the user's membership of it (null when not a member), in one query; undefined when no such course. */
export async function findCourseForMember(db: Db, courseId: string, userId: string): Promise<{ course: CourseRow; membership: { role: Role; section: string | null } | null } | undefined> {
  const row = await db
    .selectFrom("courses as c")
    .leftJoin("memberships as m", (j) => j.onRef("m.course_id", "=", "c.id").on("m.user_id", "=", userId))
    .select([...COURSE_COLUMNS, "m.role", "m.section"])
    .where("c.id", "=", courseId)
    .executeTakeFirst();
  if (!row) return undefined;
  const { role, section, ...course } = row;
  return { course, membership: role ? { role, section } : null };
}

export async function findCourseByJoinCode(db: Db, joinCode: string) {
  return db
    .selectFrom("courses")
    .select(["id", "code", "title", "joining_open as joiningOpen"])
    .where(sql`upper(join_code)`, "=", joinCode.toUpperCase())
    .executeTakeFirst();
}

export async function findMembership(db: Db, courseId: string, userId: string) {
  return db
    .selectFrom("memberships")
    .select(["role", "section"])
    .where("course_id", "=", courseId)
    .where("user_id", "=", userId)
    .executeTakeFirst();
}

export async function listMembers(db: Db, courseId: string): Promise<MemberRow[]> {
  return db
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.id as userId", "u.name", "u.email", "m.role", "m.section", "m.created_at as joinedAt"])
    .where("m.course_id", "=", courseId)
    .orderBy(sql`case m.role when 'instructor' then 0 when 'ta' then 1 else 2 end`)
    .orderBy("u.name")
    .execute();
}

/** Adds or updates a membership (a person has one role per course). */
export async function upsertMembership(
  db: Db,
  m: { courseId: string; userId: string; role: Role; section?: string | null },
): Promise<void> {
  await db
    .insertInto("memberships")
    .values({ course_id: m.courseId, user_id: m.userId, role: m.role, section: m.section ?? null })
    .onConflict((oc) => oc.columns(["course_id", "user_id"]).doUpdateSet({ role: m.role, section: m.section ?? null }))
    .execute();
}

/** Locks the course row so that roster changes of one course run one at a time (the last-instructor rule). */
export async function lockCourse(trx: Transaction<Database>, courseId: string): Promise<boolean> {
  const row = await trx.selectFrom("courses").select("id").where("id", "=", courseId).forUpdate().executeTakeFirst();
  return !!row;
}

export async function countInstructors(db: DbOrTrx, courseId: string): Promise<number> {
  const row = await db
    .selectFrom("memberships")
    .select((eb) => eb.fn.countAll<string>().as("n"))
    .where("course_id", "=", courseId)
    .where("role", "=", "instructor")
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

export async function updateMembership(db: DbOrTrx, courseId: string, userId: string, patch: { role?: Role; section?: string | null }): Promise<void> {
  await db
    .updateTable("memberships")
    .set({ ...(patch.role !== undefined ? { role: patch.role } : {}), ...(patch.section !== undefined ? { section: patch.section } : {}) })
    .where("course_id", "=", courseId)
    .where("user_id", "=", userId)
    .execute();
}

/** Removes the membership only; the person's attempts, variants and uploads stay for when they return. */
export async function deleteMembership(db: DbOrTrx, courseId: string, userId: string): Promise<void> {
  await db.deleteFrom("memberships").where("course_id", "=", courseId).where("user_id", "=", userId).execute();
}

/** Adds a membership unless the person is already a member; true when it was added. */
export async function insertMembershipIfAbsent(db: DbOrTrx, m: { courseId: string; userId: string; role: Role; section: string | null }): Promise<boolean> {
  const r = await db
    .insertInto("memberships")
    .values({ course_id: m.courseId, user_id: m.userId, role: m.role, section: m.section })
    .onConflict((oc) => oc.columns(["course_id", "user_id"]).doNothing())
    .executeTakeFirst();
  return Number(r.numInsertedOrUpdatedRows ?? 0) > 0;
}

/** Which of these (lower-case) e-mail addresses have accounts, and which of those are members of the course. */
export async function accountsByEmail(db: DbOrTrx, courseId: string, emails: string[]) {
  if (emails.length === 0) return [];
  return db
    .selectFrom("users as u")
    .leftJoin("memberships as m", (j) => j.onRef("m.user_id", "=", "u.id").on("m.course_id", "=", courseId))
    .select(["u.id", sql<string>`lower(u.email)`.as("email"), "u.name", "m.role"])
    .where(sql`lower(u.email)`, "in", emails)
    .execute();
}

export interface CourseWrite {
  code: string;
  title: string;
  term: string;
  institution: string;
  joinCode: string;
  joiningOpen?: boolean;
  defaultLatePenaltyPercentPerDay?: number;
  defaultLateFloorPercent?: number;
  copiedFrom?: string | null;
}

export async function insertCourse(db: DbOrTrx, c: CourseWrite): Promise<string> {
  const row = await db
    .insertInto("courses")
    .values({
      code: c.code,
      title: c.title,
      term: c.term,
      institution: c.institution,
      join_code: c.joinCode,
      ...(c.joiningOpen !== undefined ? { joining_open: c.joiningOpen } : {}),
      ...(c.defaultLatePenaltyPercentPerDay !== undefined ? { default_late_penalty_percent_per_day: c.defaultLatePenaltyPercentPerDay } : {}),
      ...(c.defaultLateFloorPercent !== undefined ? { default_late_floor_percent: c.defaultLateFloorPercent } : {}),
      copied_from: c.copiedFrom ?? null,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

export async function courseCodeTaken(db: DbOrTrx, code: string): Promise<boolean> {
  return !!(await db.selectFrom("courses").select("id").where(sql`lower(code)`, "=", code.toLowerCase()).executeTakeFirst());
}

export async function updateCourseSettings(
  db: DbOrTrx,
  courseId: string,
  s: { title?: string; term?: string; joiningOpen?: boolean; defaultLatePenaltyPercentPerDay?: number; defaultLateFloorPercent?: number },
): Promise<void> {
  await db
    .updateTable("courses")
    .set({
      ...(s.title !== undefined ? { title: s.title } : {}),
      ...(s.term !== undefined ? { term: s.term } : {}),
      ...(s.joiningOpen !== undefined ? { joining_open: s.joiningOpen } : {}),
      ...(s.defaultLatePenaltyPercentPerDay !== undefined ? { default_late_penalty_percent_per_day: s.defaultLatePenaltyPercentPerDay } : {}),
      ...(s.defaultLateFloorPercent !== undefined ? { default_late_floor_percent: s.defaultLateFloorPercent } : {}),
    })
    .where("id", "=", courseId)
    .execute();
}

export async function setJoinCode(db: DbOrTrx, courseId: string, joinCode: string): Promise<void> {
  await db.updateTable("courses").set({ join_code: joinCode }).where("id", "=", courseId).execute();
}

/** Every course with its member and lab counts, for the site admin. */
export async function listAllCourses(db: DbOrTrx) {
  const rows = await db
    .selectFrom("courses as c")
    .select((eb) => [
      "c.id",
      "c.code",
      "c.title",
      "c.term",
      "c.institution",
      "c.created_at as createdAt",
      eb.selectFrom("memberships as m").whereRef("m.course_id", "=", "c.id").where("m.role", "=", "student").select((e) => e.fn.countAll<string>().as("n")).as("students"),
      eb.selectFrom("memberships as m").whereRef("m.course_id", "=", "c.id").where("m.role", "!=", "student").select((e) => e.fn.countAll<string>().as("n")).as("staff"),
      eb.selectFrom("labs as l").whereRef("l.course_id", "=", "c.id").select((e) => e.fn.countAll<string>().as("n")).as("labs"),
      eb
        .selectFrom("memberships as m")
        .innerJoin("users as u", "u.id", "m.user_id")
        .whereRef("m.course_id", "=", "c.id")
        .where("m.role", "=", "instructor")
        .select(sql<string>`string_agg(u.name, ', ' order by u.name)`.as("names"))
        .as("instructors"),
    ])
    .orderBy("c.created_at", "desc")
    .orderBy("c.code")
    .execute();
  return rows.map((r) => ({ ...r, students: Number(r.students ?? 0), staff: Number(r.staff ?? 0), labs: Number(r.labs ?? 0), instructors: r.instructors ?? "" }));
}

/** The course's students with their sections. */
export async function listStudents(db: DbOrTrx, courseId: string) {
  return db
    .selectFrom("memberships")
    .select(["user_id as userId", "section"])
    .where("course_id", "=", courseId)
    .where("role", "=", "student")
    .execute();
}
