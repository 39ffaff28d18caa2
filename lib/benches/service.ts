// Bench use cases: read and replace a course's arrangement. Callers authorize first (staff read, the
// instructor replaces).
import "server-only";
import { db } from "@/db";
import { listArrangement, replaceArrangement, studentsAmong } from "@/db/queries/benches";
import { lockCourse } from "@/db/queries/courses";
import { AppError, notFound } from "@/lib/errors";
import type { Benches } from "@/lib/validation/benches";

/** The arrangement with each seated member's own section (the Benches page). */
export async function arrangement(courseId: string) {
  return listArrangement(db, courseId);
}

/** The arrangement as `GET /api/courses/{courseId}/benches` answers it. */
export function arrangementJson(a: Awaited<ReturnType<typeof listArrangement>>) {
  return {
    benches: a.benches.map((b) => ({ id: b.id, name: b.name, section: b.section, members: b.members.map((m) => ({ userId: m.userId, name: m.name })) })),
    unseated: a.unseated.map((u) => ({ userId: u.userId, name: u.name, section: u.section })),
  };
}

/**
 * Replaces the arrangement in one transaction. Every member id must be a student of the course (else 400
 * naming `benches.{i}.memberIds.{j}`); the schema already refused duplicates and full benches.
 */
export async function saveArrangement(courseId: string, input: Benches) {
  await db.transaction().execute(async (trx) => {
    if (!(await lockCourse(trx, courseId))) throw notFound("That course");
    const ids = input.benches.flatMap((b) => b.memberIds);
    const students = await studentsAmong(trx, courseId, ids);
    const fields: Record<string, string[]> = {};
    input.benches.forEach((b, i) =>
      b.memberIds.forEach((id, j) => {
        if (!students.has(id)) fields[`benches.${i}.memberIds.${j}`] = ["Not a student of this course: only students sit at benches."];
      }),
    );
    if (Object.keys(fields).length) throw new AppError("bad_request", "Only students of this course sit at benches.", fields);
    await replaceArrangement(trx, courseId, input.benches);
  });
  return listArrangement(db, courseId);
}
