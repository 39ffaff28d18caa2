// Uploaded files (scope captures and logged traces). The bytes live in object storage; this is the record.
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database, Db, StoredSamples, UploadKind } from "../types";

const UPLOAD_COLUMNS = [
  "id",
  "owner_id as ownerId",
  "course_id as courseId",
  "lab_id as labId",
  "kind",
  "content_type as contentType",
  "size",
  "sha256",
  "storage_key as storageKey",
  "original_name as originalName",
  "analysis",
  "created_at as createdAt",
  "status",
  "progress",
  "failure",
] as const;

export async function findUpload(db: Db, id: string) {
  return db.selectFrom("uploads").select(UPLOAD_COLUMNS).select(sql<boolean>`samples is not null`.as("zoomable")).where("id", "=", id).executeTakeFirst();
}

export async function findUploads(db: Db, ids: string[]) {
  if (ids.length === 0) return [];
  return db.selectFrom("uploads").select(UPLOAD_COLUMNS).select(sql<boolean>`samples is not null`.as("zoomable")).where("id", "in", ids).execute();
}

export type UploadRow = NonNullable<Awaited<ReturnType<typeof findUpload>>>;

export async function insertUpload(
  db: Db,
  u: { ownerId: string; courseId: string; labId: string | null; kind: UploadKind; contentType: string; size: number; sha256: string; storageKey: string; originalName: string; analysis: unknown | null },
) {
  const row = await db
    .insertInto("uploads")
    .values({
      owner_id: u.ownerId,
      course_id: u.courseId,
      lab_id: u.labId,
      kind: u.kind,
      content_type: u.contentType,
      size: u.size,
      sha256: u.sha256,
      storage_key: u.storageKey,
      original_name: u.originalName,
      analysis: u.analysis === null ? null : JSON.stringify(u.analysis),
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/** The row of an upload asked for and not yet sent: its size is the size claimed (the quota counts it). */
export async function insertPendingUpload(
  db: Db,
  u: { ownerId: string; courseId: string; labId: string | null; kind: UploadKind; contentType: string; size: number; storageKey: string; originalName: string; multipartId: string },
) {
  const row = await db
    .insertInto("uploads")
    .values({
      owner_id: u.ownerId,
      course_id: u.courseId,
      lab_id: u.labId,
      kind: u.kind,
      content_type: u.contentType,
      size: u.size,
      sha256: null,
      storage_key: u.storageKey,
      original_name: u.originalName,
      analysis: null,
      status: "pending",
      multipart_id: u.multipartId,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/**
 * Takes a pending upload for completion (status "completing"), so that two completions at once cannot
 * both run; returns its row with the multipart id, or undefined when it is not pending.
 */
export async function claimPendingUpload(db: Db, id: string) {
  return db
    .updateTable("uploads")
    .set({ status: "completing" })
    .where("id", "=", id)
    .where("status", "=", "pending")
    .returning([...UPLOAD_COLUMNS, "multipart_id as multipartId"])
    .executeTakeFirst();
}

/** Gives a claimed upload back (the store could not be reached): it can be completed again. */
export async function releaseClaim(db: Db, id: string): Promise<void> {
  await db.updateTable("uploads").set({ status: "pending" }).where("id", "=", id).where("status", "=", "completing").execute();
}

/** The parts are one object now, checked: its stored size and sniffed type; analysis comes next. */
export async function markAnalysing(db: Db, id: string, u: { size: number; kind: UploadKind; contentType: string }): Promise<void> {
  await db
    .updateTable("uploads")
    .set({ status: "analysing", size: u.size, kind: u.kind, content_type: u.contentType, multipart_id: null, progress: 0 })
    .where("id", "=", id)
    .execute();
}

export async function setUploadProgress(db: Db, id: string, progress: number): Promise<void> {
  await db.updateTable("uploads").set({ progress }).where("id", "=", id).where("status", "=", "analysing").execute();
}

/** The job's results, all at once (one statement): an upload is either analysing or ready with all of them. */
export async function finishUpload(db: Db, id: string, r: { sha256: string; analysis: unknown | null; samples: StoredSamples | null }): Promise<boolean> {
  const res = await db
    .updateTable("uploads")
    .set({
      status: "ready",
      sha256: r.sha256,
      analysis: r.analysis === null ? null : JSON.stringify(r.analysis),
      samples: r.samples === null ? null : JSON.stringify(r.samples),
      progress: 1,
      failure: null,
    })
    .where("id", "=", id)
    .where("status", "=", "analysing")
    .executeTakeFirst();
  return Number(res.numUpdatedRows) === 1;
}

export async function failUpload(db: Db, id: string, failure: string): Promise<void> {
  await db.updateTable("uploads").set({ status: "failed", failure, progress: null }).where("id", "=", id).where("status", "=", "analysing").execute();
}

export async function deleteUpload(db: Db, id: string): Promise<void> {
  await db.deleteFrom("uploads").where("id", "=", id).execute();
}

export async function findUploadSamples(db: Db, id: string) {
  return db.selectFrom("uploads").select(["id", "owner_id as ownerId", "course_id as courseId", "status", "samples"]).where("id", "=", id).executeTakeFirst();
}

/** Bytes stored for one owner, over all their uploads. */
export async function storedBytes(db: Db, ownerId: string): Promise<number> {
  const r = await db.selectFrom("uploads").select(sql<string>`coalesce(sum(size), 0)`.as("total")).where("owner_id", "=", ownerId).executeTakeFirstOrThrow();
  return Number(r.total);
}

/** Serialises one owner's uploads until the end of `trx`, so two at once cannot both pass the quota. */
export async function lockOwnerUploads(trx: Transaction<Database>, ownerId: string): Promise<void> {
  await sql`select pg_advisory_xact_lock(hashtextextended(${"uploads:" + ownerId}, 0))`.execute(trx);
}

/**
 * Locks the uploads an attempt attaches until the attempt's transaction ends (the sweep skips locked
 * rows); returns how many of them still exist.
 */
export async function lockUploadsForAttempt(trx: Transaction<Database>, ids: string[]): Promise<number> {
  if (ids.length === 0) return 0;
  const rows = await trx.selectFrom("uploads").select("id").where("id", "in", ids).forShare().execute();
  return rows.length;
}

/**
 * Deletes at most `limit` uploads created before `before` that no attempt attaches, and returns their
 * storage keys (the caller removes the objects). Rows are locked first, skipping any an attempt is
 * attaching right now, and the "not attached" condition is checked again after the lock.
 */
export async function deleteUnattachedUploads(
  db: Kysely<Database>,
  before: Date,
  limit = 500,
): Promise<{ storageKey: string; multipartId: string | null; samplesKey: string | null }[]> {
  return db.transaction().execute(async (trx) => {
    const notAttached = sql<boolean>`not exists (select 1 from attempts a where uploads.id = any(a.upload_ids))`;
    const candidates = await trx
      .selectFrom("uploads")
      .select("id")
      .where("created_at", "<", before)
      .where(notAttached)
      .orderBy("created_at")
      .limit(limit)
      .forUpdate()
      .skipLocked()
      .execute();
    if (candidates.length === 0) return [];
    const gone = await trx
      .deleteFrom("uploads")
      .where("id", "in", candidates.map((c) => c.id))
      .where(notAttached)
      .returning(["storage_key", "multipart_id", "samples"])
      .execute();
    return gone.map((g) => ({ storageKey: g.storage_key, multipartId: g.multipart_id, samplesKey: g.samples?.key ?? null }));
  });
}

/** An upload's row with its open multipart upload's id (null once completed). */
export async function findPendingUpload(db: Db, id: string) {
  return db.selectFrom("uploads").select([...UPLOAD_COLUMNS, "multipart_id as multipartId"]).where("id", "=", id).executeTakeFirst();
}
