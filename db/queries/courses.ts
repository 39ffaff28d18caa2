// Courses and memberships (who is in which course, with which role and section).
import { type Kysely, sql } from "kysely";
import type { Database, Role } from "../types";

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

export async function findCourse(db: Db, courseId: string) {
  return db
    .selectFrom("courses")
    .select(["id", "code", "title", "term", "institution", "join_code as joinCode"])
    .where("id", "=", courseId)
    .executeTakeFirst();
}

export async function findCourseByJoinCode(db: Db, joinCode: string) {
  return db
    .selectFrom("courses")
    .select(["id", "code", "title"])
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
