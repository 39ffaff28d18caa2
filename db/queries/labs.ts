// Labs and the per-student circuit values drawn for them.
import type { Insertable, Kysely, Transaction, Updateable } from "kysely";
import type { Database, LabStatus, LabsTable, ShowExpected } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

const LAB_COLUMNS = [
  "id",
  "course_id as courseId",
  "title",
  "template_key as templateKey",
  "status",
  "spec",
  "questions",
  "policy",
  "attempts_allowed as attemptsAllowed",
  "counting",
  "opens_at as opensAt",
  "due_at as dueAt",
  "closes_at as closesAt",
  "late_penalty_percent_per_day as latePenaltyPercentPerDay",
  "late_floor_percent as lateFloorPercent",
  "show_expected as showExpected",
  "instructions",
  "safety_notes as safetyNotes",
  "version",
  "created_at as createdAt",
  "updated_at as updatedAt",
  "published_at as publishedAt",
  "grades_held as gradesHeld",
] as const;

export type LabRow = Awaited<ReturnType<typeof findLab>> & {};

export async function findLab(db: Db, labId: string) {
  return db.selectFrom("labs").select(LAB_COLUMNS).where("id", "=", labId).executeTakeFirst();
}

export async function listLabs(db: Db, courseId: string, opts: { publishedOnly: boolean }) {
  let q = db.selectFrom("labs").select(LAB_COLUMNS).where("course_id", "=", courseId);
  if (opts.publishedOnly) q = q.where("status", "=", "published");
  return q.orderBy("due_at", "asc").orderBy("created_at", "asc").execute();
}

export interface LabWrite {
  title: string;
  templateKey: string;
  spec: unknown;
  questions: unknown;
  policy: unknown;
  attemptsAllowed: number;
  counting: "best" | "last";
  opensAt: Date | null;
  dueAt: Date | null;
  closesAt?: Date | null;
  latePenaltyPercentPerDay: number;
  lateFloorPercent: number;
  showExpected: ShowExpected;
  instructions: string;
  safetyNotes: string;
}

function columns(l: Partial<LabWrite>) {
  const out: Record<string, unknown> = {};
  if (l.title !== undefined) out.title = l.title;
  if (l.templateKey !== undefined) out.template_key = l.templateKey;
  if (l.spec !== undefined) out.spec = JSON.stringify(l.spec);
  if (l.questions !== undefined) out.questions = JSON.stringify(l.questions);
  if (l.policy !== undefined) out.policy = JSON.stringify(l.policy);
  if (l.attemptsAllowed !== undefined) out.attempts_allowed = l.attemptsAllowed;
  if (l.counting !== undefined) out.counting = l.counting;
  if (l.opensAt !== undefined) out.opens_at = l.opensAt;
  if (l.dueAt !== undefined) out.due_at = l.dueAt;
  if (l.closesAt !== undefined) out.closes_at = l.closesAt;
  if (l.latePenaltyPercentPerDay !== undefined) out.late_penalty_percent_per_day = l.latePenaltyPercentPerDay;
  if (l.lateFloorPercent !== undefined) out.late_floor_percent = l.lateFloorPercent;
  if (l.showExpected !== undefined) out.show_expected = l.showExpected;
  if (l.instructions !== undefined) out.instructions = l.instructions;
  if (l.safetyNotes !== undefined) out.safety_notes = l.safetyNotes;
  return out;
}

export async function insertLab(db: Db, courseId: string, createdBy: string, lab: LabWrite, status: LabStatus = "draft") {
  const row = await db
    .insertInto("labs")
    .values({
      ...columns(lab),
      course_id: courseId,
      created_by: createdBy,
      status,
      published_at: status === "published" ? new Date() : null,
    } as Insertable<LabsTable>)
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/** Updates the given fields; a change to what grading depends on bumps the lab's version. */
export async function updateLab(db: Db, labId: string, patch: Partial<LabWrite> & { status?: LabStatus }, bumpVersion: boolean) {
  const values: Record<string, unknown> = { ...columns(patch), updated_at: new Date() };
  if (patch.status) {
    values.status = patch.status;
    if (patch.status === "published") values.published_at = new Date();
  }
  await db
    .updateTable("labs")
    .set((eb) => ({ ...(values as Updateable<LabsTable>), ...(bumpVersion ? { version: eb("version", "+", 1) } : {}) }))
    .where("id", "=", labId)
    .execute();
}

export async function findVariant(db: Db, labId: string, userId: string) {
  return db
    .selectFrom("lab_variants")
    .select(["seed", "params"])
    .where("lab_id", "=", labId)
    .where("user_id", "=", userId)
    .executeTakeFirst();
}

/** Stores the drawn values unless another request stored them first; returns what is stored. */
export async function storeVariant(db: Db, labId: string, userId: string, seed: string, params: unknown) {
  await db
    .insertInto("lab_variants")
    .values({ lab_id: labId, user_id: userId, seed, params: JSON.stringify(params) })
    .onConflict((oc) => oc.columns(["lab_id", "user_id"]).doNothing())
    .execute();
  return (await findVariant(db, labId, userId))!;
}

export async function deleteVariants(db: Db, labId: string) {
  await db.deleteFrom("lab_variants").where("lab_id", "=", labId).execute();
}

// Columns a copied lab starts afresh rather than copying.
const FRESH = new Set(["id", "course_id", "status", "version", "created_by", "created_at", "updated_at", "published_at", "grades_released_at"]);

/**
 * Copies every lab of a course into another as drafts, moving each date column (opens, due, close…) by
 * `shiftMs`. Reads whole rows so that columns added later are copied too; JSON values are written back
 * as JSON. Variants, attempts and regrades are not copied.
 */
export async function copyLabs(db: Db, fromCourseId: string, toCourseId: string, createdBy: string, shiftMs: number): Promise<number> {
  const rows = await db.selectFrom("labs").selectAll().where("course_id", "=", fromCourseId).orderBy("created_at").execute();
  for (const row of rows) {
    const values: Record<string, unknown> = { course_id: toCourseId, status: "draft", created_by: createdBy };
    for (const [k, v] of Object.entries(row)) {
      if (FRESH.has(k)) continue;
      if (v instanceof Date) values[k] = new Date(v.getTime() + shiftMs);
      else if (v !== null && typeof v === "object") values[k] = JSON.stringify(v);
      else values[k] = v;
    }
    await db.insertInto("labs").values(values as Insertable<LabsTable>).execute();
  }
  return rows.length;
}

/** Every stored circuit of a lab. */
export async function listVariants(db: Db, labId: string) {
  return db.selectFrom("lab_variants").select(["user_id as userId", "params"]).where("lab_id", "=", labId).execute();
}

/** Locks the lab's row for the rest of the transaction and reads whether its grades are held. */
export async function lockLabHold(db: Transaction<Database>, labId: string) {
  return db.selectFrom("labs").select(["id", "grades_held as gradesHeld", "counting"]).where("id", "=", labId).forUpdate().executeTakeFirst();
}

export async function setGradesHeld(db: Db, labId: string, held: boolean, releasedAt: Date | null) {
  await db
    .updateTable("labs")
    .set(held ? { grades_held: true } : { grades_held: false, grades_released_at: releasedAt })
    .where("id", "=", labId)
    .execute();
}
