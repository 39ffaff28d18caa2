// A course's lesson plan: which lessons it shows, in which order, from when.
import type { Kysely } from "kysely";
import type { Database, Db } from "../types";

export async function listCourseLessons(db: Db, courseId: string) {
  return db
    .selectFrom("course_lessons")
    .select(["slug", "position", "visible", "opens_at as opensAt"])
    .where("course_id", "=", courseId)
    .orderBy("position")
    .execute();
}

/** Replaces the course's plan with the given rows, in one transaction. */
export async function replaceCourseLessons(
  db: Kysely<Database>,
  courseId: string,
  rows: { slug: string; position: number; visible: boolean; opensAt: Date | null }[],
) {
  await db.transaction().execute(async (trx) => {
    await trx.deleteFrom("course_lessons").where("course_id", "=", courseId).execute();
    if (rows.length === 0) return;
    await trx
      .insertInto("course_lessons")
      .values(rows.map((r) => ({ course_id: courseId, slug: r.slug, position: r.position, visible: r.visible, opens_at: r.opensAt })))
      .execute();
  });
}

/** Copies a course's lesson plan into another course, moving every opening date by `shiftMs`. */
export async function copyCourseLessons(db: Db, fromCourseId: string, toCourseId: string, shiftMs: number) {
  const rows = await listCourseLessons(db, fromCourseId);
  if (rows.length === 0) return;
  await db
    .insertInto("course_lessons")
    .values(rows.map((r) => ({ course_id: toCourseId, slug: r.slug, position: r.position, visible: r.visible, opens_at: r.opensAt ? new Date(r.opensAt.getTime() + shiftMs) : null })))
    .execute();
}
