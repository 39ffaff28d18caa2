// The demo's benches, two extensions and the circuits publishing draws: the forty students of ELM-214
// sit in twenty pairs by section (section A at Bench 01 to 10, section B at Bench 11 to 20); two students
// have their own dates on a lab running now; every published lab has each student's circuit drawn, as
// publishing does in the app. Idempotent: a course already seated, an exception already granted and a
// circuit already drawn are kept.
import type { Kysely, Transaction } from "kysely";
import { listArrangement, replaceArrangement } from "../../db/queries/benches";
import { upsertException } from "../../db/queries/exceptions";
import { storeVariants, studentsWithoutVariant } from "../../db/queries/labs";
import type { Database } from "../../db/types";
import { drawVariant, type VariantSpec } from "../../lib/grader";

const DAY = 24 * 3600 * 1000;

export async function seedBenches(trx: Transaction<Database>, courseId: string): Promise<void> {
  const { benches, unseated } = await listArrangement(trx, courseId);
  if (benches.length) return;
  const plan: { name: string; section: string | null; memberIds: string[] }[] = [];
  for (const section of ["A", "B"]) {
    // partners in the order of the section's list (by name); an odd one out joins the last pair
    const ids = unseated.filter((s) => s.section === section).map((s) => s.userId);
    const groups: string[][] = [];
    for (let i = 0; i < ids.length; i += 2) groups.push(ids.slice(i, i + 2));
    if (groups.length > 1 && groups[groups.length - 1].length === 1) groups[groups.length - 2].push(...groups.pop()!);
    for (const memberIds of groups) plan.push({ name: `Bench ${String(plan.length + 1).padStart(2, "0")}`, section, memberIds });
  }
  await replaceArrangement(trx, courseId, plan);
}

/** Two extensions on the first lab running now: the demo's first student (two more days and an extra attempt) and another student. */
export async function seedExceptions(db: Kysely<Database>, courseId: string, students: string[], instructorId: string): Promise<void> {
  const lab = await db
    .selectFrom("labs")
    .select(["id", "due_at"])
    .where("course_id", "=", courseId)
    .where("status", "=", "published")
    .where("due_at", ">", new Date())
    .orderBy("due_at")
    .executeTakeFirst();
  if (!lab?.due_at) return;
  const due = new Date(lab.due_at).getTime();
  const reasons = ["Away for a college sports fixture; arranged in advance.", "Medical note seen by the instructor."];
  for (const [i, userId] of students.slice(0, 2).entries()) {
    const had = await db.selectFrom("lab_exceptions").select("user_id").where("lab_id", "=", lab.id).where("user_id", "=", userId).executeTakeFirst();
    if (had) continue;
    await upsertException(db, { labId: lab.id, userId, dueAt: new Date(due + (2 + i) * DAY), closesAt: null, extraAttempts: i === 0 ? 1 : 0, reason: reasons[i], grantedBy: instructorId });
  }
}

/** Every published lab's circuits, drawn for each student without one (what the publish job does). */
export async function seedDraws(db: Kysely<Database>, courseId: string): Promise<void> {
  const labs = await db.selectFrom("labs").select(["id", "spec"]).where("course_id", "=", courseId).where("status", "=", "published").execute();
  for (const lab of labs) {
    const missing = await studentsWithoutVariant(db, lab.id, courseId);
    await storeVariants(
      db,
      lab.id,
      missing.map((userId) => ({ userId, seed: `${lab.id}:${userId}`, params: drawVariant(lab.spec as VariantSpec, `${lab.id}:${userId}`) })),
    );
  }
}
