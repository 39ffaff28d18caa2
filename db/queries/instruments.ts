// Instrument profiles of a course (lib/instruments/profile.ts shape, stored whole as JSON).
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

export interface InstrumentRow {
  id: string;
  courseId: string;
  /** the InstrumentProfile as stored (name and kind also in their own columns) */
  profile: unknown;
  libraryKey: string | null;
  updatedAt: Date;
}

const COLUMNS = ["id", "course_id as courseId", "profile", "library_key as libraryKey", "updated_at as updatedAt"] as const;

/** The course's instruments, oldest first (the teaching meter the course started with comes first). */
export async function listInstruments(db: Db, courseId: string): Promise<InstrumentRow[]> {
  return db.selectFrom("instruments").select(COLUMNS).where("course_id", "=", courseId).orderBy("created_at").orderBy("id").execute();
}

export async function findInstrument(db: Db, id: string): Promise<InstrumentRow | undefined> {
  return db.selectFrom("instruments").select(COLUMNS).where("id", "=", id).executeTakeFirst();
}

export async function insertInstrument(db: Db, courseId: string, profile: { name: string; kind: string }, libraryKey: string | null): Promise<InstrumentRow> {
  return db
    .insertInto("instruments")
    .values({ course_id: courseId, name: profile.name, kind: profile.kind, profile: JSON.stringify(profile), library_key: libraryKey })
    .returning(COLUMNS)
    .executeTakeFirstOrThrow();
}

export async function updateInstrument(db: Db, id: string, profile: { name: string; kind: string }): Promise<InstrumentRow | undefined> {
  return db
    .updateTable("instruments")
    .set({ name: profile.name, kind: profile.kind, profile: JSON.stringify(profile), updated_at: new Date() })
    .where("id", "=", id)
    .returning(COLUMNS)
    .executeTakeFirst();
}

export async function deleteInstrument(db: Db, id: string): Promise<void> {
  await db.deleteFrom("instruments").where("id", "=", id).execute();
}

/** Titles of the published (non-draft) labs that use the instrument. */
export async function publishedLabsUsing(db: Db, id: string): Promise<string[]> {
  const rows = await db.selectFrom("labs").select("title").where("instrument_id", "=", id).where("status", "!=", "draft").orderBy("title").execute();
  return rows.map((r) => r.title);
}

/** Locks the instrument's row for a change (inside a transaction). */
export async function lockInstrument(trx: Transaction<Database>, id: string): Promise<void> {
  await trx.selectFrom("instruments").select("id").where("id", "=", id).forUpdate().execute();
}
