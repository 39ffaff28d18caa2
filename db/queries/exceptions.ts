// Exceptions to a lab's rules for one student: their own dates and extra attempts, with a reason.
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

const COLUMNS = [
  "x.lab_id as labId",
  "x.user_id as userId",
  "x.due_at as dueAt",
  "x.closes_at as closesAt",
  "x.extra_attempts as extraAttempts",
  "x.reason",
  "x.granted_at as grantedAt",
] as const;

export async function upsertException(
  db: Db,
  e: { labId: string; userId: string; dueAt: Date | null; closesAt: Date | null; extraAttempts: number; reason: string; grantedBy: string },
) {
  const values = { lab_id: e.labId, user_id: e.userId, due_at: e.dueAt, closes_at: e.closesAt, extra_attempts: e.extraAttempts, reason: e.reason, granted_by: e.grantedBy, granted_at: new Date() };
  await db
    .insertInto("lab_exceptions")
    .values(values)
    .onConflict((oc) => oc.columns(["lab_id", "user_id"]).doUpdateSet({ due_at: e.dueAt, closes_at: e.closesAt, extra_attempts: e.extraAttempts, reason: e.reason, granted_by: e.grantedBy, granted_at: values.granted_at }))
    .execute();
  return (await findException(db, e.labId, e.userId))!;
}

export async function findException(db: Db, labId: string, userId: string) {
  return db
    .selectFrom("lab_exceptions as x")
    .leftJoin("users as g", "g.id", "x.granted_by")
    .select([...COLUMNS, "g.name as grantedBy"])
    .where("x.lab_id", "=", labId)
    .where("x.user_id", "=", userId)
    .executeTakeFirst();
}

export type ExceptionRow = NonNullable<Awaited<ReturnType<typeof findException>>>;

export async function deleteException(db: Db, labId: string, userId: string): Promise<boolean> {
  const r = await db.deleteFrom("lab_exceptions").where("lab_id", "=", labId).where("user_id", "=", userId).executeTakeFirst();
  return Number(r.numDeletedRows) > 0;
}

/** The student's exceptions in the course's labs, by lab. */
export async function studentExceptions(db: Db, courseId: string, userId: string) {
  const rows = await db
    .selectFrom("lab_exceptions as x")
    .innerJoin("labs as l", "l.id", "x.lab_id")
    .leftJoin("users as g", "g.id", "x.granted_by")
    .select([...COLUMNS, "g.name as grantedBy"])
    .where("l.course_id", "=", courseId)
    .where("x.user_id", "=", userId)
    .execute();
  return new Map(rows.map((r) => [r.labId, r]));
}

/** Every exception of a lab with the student's name (the lab's page for staff). */
export async function labExceptions(db: Db, labId: string) {
  return db
    .selectFrom("lab_exceptions as x")
    .innerJoin("users as u", "u.id", "x.user_id")
    .leftJoin("users as g", "g.id", "x.granted_by")
    .select([...COLUMNS, "u.name as studentName", "g.name as grantedBy"])
    .where("x.lab_id", "=", labId)
    .orderBy("u.name")
    .execute();
}
