// Labs and the per-student circuit values drawn for them. This module reads and writes them in camelCase
// through Kysely's CamelCasePlugin (labsDb below), so a lab's fields have the same names here as in the
// lab schema (lib/validation/labs.ts, which checks at build time that it names the columns of
// LAB_DATA_COLUMNS) and no mapper is kept by hand. The plugin is applied
// to this module's queries only: the rest of the project's queries are written against the snake_case
// tables of db/types.ts, and a global plugin would rename every one of them.
import { CamelCasePlugin, sql, type Insertable, type Kysely, type Selectable, type Transaction, type Updateable } from "kysely";
import type { BenchMode, CoursesTable, Database, LabExceptionsTable, LabStatus, LabsTable, LabVariantsTable, MembershipsTable, Role } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

type CamelName<S extends string> = S extends `${infer Head}_${infer Tail}` ? `${Head}${Capitalize<CamelName<Tail>>}` : S;
type Camel<T> = { [K in keyof T as CamelName<K & string>]: T[K] };

/** The labs tables as this module sees them: db/types.ts's tables with camelCase names. */
interface LabsDatabase {
  labs: Camel<LabsTable>;
  labVariants: Camel<LabVariantsTable>;
  /** read only by findLabForMember, with the lab */
  courses: Camel<CoursesTable>;
  memberships: Camel<MembershipsTable>;
  /** read only by findLabForMember: the member's own exception to the lab */
  labExceptions: Camel<LabExceptionsTable>;
}

// JSON columns (spec, questions, policy, params) are read as stored: their keys are the grader's, not columns.
const camelCase = new CamelCasePlugin({ maintainNestedObjectKeys: true });

/** The same connection or transaction, speaking camelCase. */
function labsDb(db: Db): Kysely<LabsDatabase> {
  return db.withPlugin(camelCase) as unknown as Kysely<LabsDatabase>;
}

/** The columns a lab's author writes: the fields of the lab schema (lib/validation/labs.ts). */
export const LAB_DATA_COLUMNS = [
  "title",
  "templateKey",
  "spec",
  "questions",
  "policy",
  "attemptsAllowed",
  "counting",
  "opensAt",
  "dueAt",
  "closesAt",
  "latePenaltyPercentPerDay",
  "lateFloorPercent",
  "showExpected",
  "instructions",
  "safetyNotes",
  "bench",
] as const;
export type LabDataColumn = (typeof LAB_DATA_COLUMNS)[number];

// A lab as the app reads it: the author's fields and the lab's own state. The columns only copying and
// holding grades use (created_by, grades_released_at, weight) are left out.
const LAB_COLUMNS = [
  "id",
  "courseId",
  "status",
  "version",
  "createdAt",
  "updatedAt",
  "publishedAt",
  "gradesHeld",
  ...LAB_DATA_COLUMNS,
] as const;

export type LabRow = Awaited<ReturnType<typeof findLab>> & {};

export async function findLab(db: Db, labId: string) {
  return labsDb(db).selectFrom("labs").select(LAB_COLUMNS).where("id", "=", labId).executeTakeFirst();
}

/**
 * The lab with its course and the user's membership of it (null when not a member, or no user), in one
 * query; undefined when no such lab. The course has the columns of courses.ts's findCourse.
 */
export async function findLabForMember(db: Db, labId: string, userId: string | null) {
  const row = await labsDb(db)
    .selectFrom("labs as l")
    .innerJoin("courses as c", "c.id", "l.courseId")
    .leftJoin("memberships as m", (j) => {
      const sameCourse = j.onRef("m.courseId", "=", "l.courseId");
      return userId === null ? sameCourse.on(sql<boolean>`false`) : sameCourse.on("m.userId", "=", userId);
    })
    .leftJoin("labExceptions as x", (j) => {
      const sameLab = j.onRef("x.labId", "=", "l.id");
      return userId === null ? sameLab.on(sql<boolean>`false`) : sameLab.on("x.userId", "=", userId);
    })
    .select(LAB_COLUMNS.map((c) => `l.${c}` as const))
    .select([
      "c.code as courseCode",
      "c.title as courseTitle",
      "c.term as courseTerm",
      "c.institution as courseInstitution",
      "c.joinCode as courseJoinCode",
      "c.joiningOpen as courseJoiningOpen",
      "c.defaultLatePenaltyPercentPerDay as courseDefaultLatePenaltyPercentPerDay",
      "c.defaultLateFloorPercent as courseDefaultLateFloorPercent",
      "m.role as memberRole",
      "m.section as memberSection",
      "x.dueAt as exceptionDueAt",
      "x.closesAt as exceptionClosesAt",
      "x.extraAttempts as exceptionExtraAttempts",
      "x.reason as exceptionReason",
    ])
    .where("l.id", "=", labId)
    .executeTakeFirst();
  if (!row) return undefined;
  const {
    courseCode,
    courseTitle,
    courseTerm,
    courseInstitution,
    courseJoinCode,
    courseJoiningOpen,
    courseDefaultLatePenaltyPercentPerDay,
    courseDefaultLateFloorPercent,
    memberRole,
    memberSection,
    exceptionDueAt,
    exceptionClosesAt,
    exceptionExtraAttempts,
    exceptionReason,
    ...lab
  } = row;
  // the member's own exception to the lab's dates and attempts (lib/labs/policy.ts withException)
  const exception =
    exceptionReason === null
      ? null
      : {
          dueAt: exceptionDueAt ? new Date(exceptionDueAt) : null,
          closesAt: exceptionClosesAt ? new Date(exceptionClosesAt) : null,
          extraAttempts: exceptionExtraAttempts ?? 0,
          reason: exceptionReason,
        };
  const course = {
    id: lab.courseId,
    code: courseCode,
    title: courseTitle,
    term: courseTerm,
    institution: courseInstitution,
    joinCode: courseJoinCode,
    joiningOpen: courseJoiningOpen,
    defaultLatePenaltyPercentPerDay: courseDefaultLatePenaltyPercentPerDay,
    defaultLateFloorPercent: courseDefaultLateFloorPercent,
  };
  return { lab: lab as LabRow, course, membership: memberRole ? { role: memberRole as Role, section: memberSection } : null, exception };
}

export async function listLabs(db: Db, courseId: string, opts: { publishedOnly: boolean }) {
  let q = labsDb(db).selectFrom("labs").select(LAB_COLUMNS).where("courseId", "=", courseId);
  if (opts.publishedOnly) q = q.where("status", "=", "published");
  return q.orderBy("dueAt", "asc").orderBy("createdAt", "asc").execute();
}

/**
 * What is written for a lab: the author's fields as the lab schema outputs them, each question with its id
 * (lib/labs/grading.ts withIds). The JSON fields are written as given; the close may be left out: no
 * explicit close.
 */
export type LabWrite = Pick<Selectable<Camel<LabsTable>>, Exclude<LabDataColumn, "spec" | "questions" | "policy" | "closesAt" | "bench">> & {
  spec: unknown;
  questions: ({ id: string } & Record<string, unknown>)[];
  policy: unknown;
  closesAt?: Date | null;
  /** left out: the real bench (the column's default) */
  bench?: BenchMode;
};

/** The JSON fields as JSON text; a field left out stays out (Kysely skips undefined values). */
function jsonColumns(l: Partial<Pick<LabWrite, "spec" | "questions" | "policy">>) {
  const json = (v: unknown) => (v === undefined ? undefined : JSON.stringify(v));
  return { spec: json(l.spec), questions: json(l.questions), policy: json(l.policy) };
}

export async function insertLab(db: Db, courseId: string, createdBy: string, lab: LabWrite, status: LabStatus = "draft") {
  const { spec, questions, policy, ...plain } = lab;
  const row = await labsDb(db)
    .insertInto("labs")
    .values({
      ...plain,
      spec: JSON.stringify(spec),
      questions: JSON.stringify(questions),
      policy: JSON.stringify(policy),
      courseId,
      createdBy,
      status,
      publishedAt: status === "published" ? new Date() : null,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/** Updates the given fields; a change to what grading depends on bumps the lab's version. */
export async function updateLab(db: Db, labId: string, patch: Partial<LabWrite> & { status?: LabStatus }, bumpVersion: boolean) {
  const { status, spec, questions, policy, ...plain } = patch;
  const values: Updateable<Camel<LabsTable>> = { ...plain, ...jsonColumns({ spec, questions, policy }), updatedAt: new Date() };
  if (status) {
    values.status = status;
    if (status === "published") values.publishedAt = new Date();
  }
  await labsDb(db)
    .updateTable("labs")
    .set((eb) => ({ ...values, ...(bumpVersion ? { version: eb("version", "+", 1) } : {}) }))
    .where("id", "=", labId)
    .execute();
}

export async function findVariant(db: Db, labId: string, userId: string) {
  return labsDb(db).selectFrom("labVariants").select(["seed", "params"]).where("labId", "=", labId).where("userId", "=", userId).executeTakeFirst();
}

/** Stores the drawn values unless another request stored them first; returns what is stored. */
export async function storeVariant(db: Db, labId: string, userId: string, seed: string, params: unknown) {
  const stored = await labsDb(db)
    .insertInto("labVariants")
    .values({ labId, userId, seed, params: JSON.stringify(params) })
    .onConflict((oc) => oc.columns(["labId", "userId"]).doNothing())
    .returning(["seed", "params"])
    .executeTakeFirst();
  return stored ?? (await findVariant(db, labId, userId))!;
}

/** Stores many drawn circuits at once; one already stored (drawn by an open in between) is kept. */
export async function storeVariants(db: Db, labId: string, rows: { userId: string; seed: string; params: unknown }[]): Promise<number> {
  if (!rows.length) return 0;
  const r = await labsDb(db)
    .insertInto("labVariants")
    .values(rows.map((v) => ({ labId, userId: v.userId, seed: v.seed, params: JSON.stringify(v.params) })))
    .onConflict((oc) => oc.columns(["labId", "userId"]).doNothing())
    .returning("userId")
    .execute();
  return r.length;
}

/** The course's students without a stored circuit for the lab. */
export async function studentsWithoutVariant(db: Db, labId: string, courseId: string): Promise<string[]> {
  const rows = await db
    .selectFrom("memberships as m")
    .leftJoin("lab_variants as v", (j) => j.onRef("v.user_id", "=", "m.user_id").on("v.lab_id", "=", labId))
    .select("m.user_id")
    .where("m.course_id", "=", courseId)
    .where("m.role", "=", "student")
    .where("v.user_id", "is", null)
    .execute();
  return rows.map((r) => r.user_id);
}

/** How many of the course's students have a stored circuit for the lab, of how many. */
export async function drawProgress(db: Db, labId: string, courseId: string): Promise<{ drawn: number; students: number }> {
  const r = await db
    .selectFrom("memberships as m")
    .leftJoin("lab_variants as v", (j) => j.onRef("v.user_id", "=", "m.user_id").on("v.lab_id", "=", labId))
    .select([sql<number>`count(v.user_id)::int`.as("drawn"), sql<number>`count(*)::int`.as("students")])
    .where("m.course_id", "=", courseId)
    .where("m.role", "=", "student")
    .executeTakeFirstOrThrow();
  return r;
}

export async function deleteVariants(db: Db, labId: string) {
  await labsDb(db).deleteFrom("labVariants").where("labId", "=", labId).execute();
}

// Columns a copied lab starts afresh rather than copying.
const FRESH = new Set(["id", "courseId", "status", "version", "createdBy", "createdAt", "updatedAt", "publishedAt", "gradesReleasedAt"]);

/**
 * Copies every lab of a course into another as drafts, moving each date column (opens, due, close…) by
 * `shiftMs`. Reads whole rows so that columns added later are copied too; JSON values are written back
 * as JSON. Variants, attempts and regrades are not copied.
 */
export async function copyLabs(db: Db, fromCourseId: string, toCourseId: string, createdBy: string, shiftMs: number): Promise<number> {
  const ldb = labsDb(db);
  const rows = await ldb.selectFrom("labs").selectAll().where("courseId", "=", fromCourseId).orderBy("createdAt").execute();
  for (const row of rows) {
    const values: Record<string, unknown> = { courseId: toCourseId, status: "draft", createdBy };
    for (const [k, v] of Object.entries(row)) {
      if (FRESH.has(k)) continue;
      if (v instanceof Date) values[k] = new Date(v.getTime() + shiftMs);
      else if (v !== null && typeof v === "object") values[k] = JSON.stringify(v);
      else values[k] = v;
    }
    await ldb.insertInto("labs").values(values as Insertable<Camel<LabsTable>>).execute();
  }
  return rows.length;
}

/** Every stored circuit of a lab. */
export async function listVariants(db: Db, labId: string) {
  return labsDb(db).selectFrom("labVariants").select(["userId", "params"]).where("labId", "=", labId).execute();
}

/** Locks the lab's row for the rest of the transaction and reads whether its grades are held. */
export async function lockLabHold(db: Transaction<Database>, labId: string) {
  return labsDb(db).selectFrom("labs").select(["id", "gradesHeld", "counting"]).where("id", "=", labId).forUpdate().executeTakeFirst();
}

export async function setGradesHeld(db: Db, labId: string, held: boolean, releasedAt: Date | null) {
  await labsDb(db)
    .updateTable("labs")
    .set(held ? { gradesHeld: true } : { gradesHeld: false, gradesReleasedAt: releasedAt })
    .where("id", "=", labId)
    .execute();
}
