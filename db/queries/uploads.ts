// Uploaded files (scope captures and logged traces). The bytes live in object storage; this is the record.
import type { Kysely, Transaction } from "kysely";
import type { Database, UploadKind } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

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
] as const;

export async function findUpload(db: Db, id: string) {
  return db.selectFrom("uploads").select(UPLOAD_COLUMNS).where("id", "=", id).executeTakeFirst();
}

export async function findUploads(db: Db, ids: string[]) {
  if (ids.length === 0) return [];
  return db.selectFrom("uploads").select(UPLOAD_COLUMNS).where("id", "in", ids).execute();
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
