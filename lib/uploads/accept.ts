// Accepting an upload: size cap, per-person storage quota, type from the bytes (never from the name or
// the browser's claim), SHA-256, storage, and for a logged trace the analysis. Callers authorize first.
// The object is stored before its row; when the row cannot be written the object is removed again.
// Uploads that no attempt attaches are swept after a day (sweepUnattachedUploads, a scheduled job).
import "server-only";
import crypto from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import { db } from "@/db";
import { deleteUnattachedUploads, insertUpload, lockOwnerUploads, storedBytes, type UploadRow } from "@/db/queries/uploads";
import { AppError } from "@/lib/errors";
import { abortMultipartUpload, deleteObjects, downloadName, maxUploadBytes, putObject, signedUrl, unattachedUploadHours, uploadQuotaBytes } from "@/lib/uploads/storage";
import { analyzeTrace } from "@/lib/trace";
import type { Params } from "@/lib/grader";

const IMAGE_TYPES = new Set(["image/png", "image/jpeg"]);

/** A trace is plain text with at least two lines of separated values. */
function looksLikeCsv(bytes: Uint8Array): boolean {
  const head = Buffer.from(bytes.subarray(0, 64 * 1024));
  if (head.includes(0)) return false;
  const text = head.toString("utf8");
  if (text.includes("\uFFFD")) return false;
  const lines = text.split(/\r?\n/).filter((l) => l.trim() !== "");
  return lines.length >= 2 && lines.slice(0, 5).every((l) => /[,;\t]/.test(l));
}

export function mb(bytes: number): string {
  return `${(bytes / 1024 / 1024).toFixed(bytes % (1024 * 1024) ? 1 : 0)} MB`;
}

/**
 * The name to show for an uploaded file: its last path segment, without control characters (PostgreSQL
 * text cannot hold NUL), at most 200 characters; "upload" when nothing is left.
 */
export function displayName(name: string): string {
  const base = (name.split(/[\\/]/).pop() ?? "").replace(/[\u0000-\u001f\u007f]/g, "").trim();
  return Array.from(base).slice(0, 200).join("") || "upload";
}

/**
 * What the first bytes of a file are, from the bytes alone: a PNG or JPEG image, or a CSV trace. Anything
 * else is a 415 naming `field`.
 */
export async function sniffKind(head: Uint8Array, field = "file"): Promise<{ kind: "image" | "trace"; contentType: string }> {
  const detected = await fileTypeFromBuffer(head);
  if (detected && IMAGE_TYPES.has(detected.mime)) return { kind: "image", contentType: detected.mime };
  if (!detected && looksLikeCsv(head)) return { kind: "trace", contentType: "text/csv" };
  const what = detected ? `a ${detected.ext.toUpperCase()} file` : "not a PNG, JPEG or CSV file";
  throw new AppError("unsupported_media_type", `That file is ${what}. Upload a scope capture as PNG or JPEG, or a logged trace as CSV (time and current).`, {
    [field]: ["Only PNG or JPEG images and CSV traces are accepted."],
  });
}

/** 413 naming `file` when `size` more bytes would take the owner past the quota. */
export function checkQuota(used: number, size: number, field = "file"): void {
  const quota = uploadQuotaBytes();
  if (used + size <= quota) return;
  const message = `Your stored files use ${mb(used)} of your ${mb(quota)}; this ${mb(size)} file does not fit. Files not attached to an attempt are removed after a day, or ask your instructor.`;
  throw new AppError("payload_too_large", message, { [field]: [`Not enough storage left: ${mb(Math.max(0, quota - used))} of ${mb(quota)} free.`] });
}

export async function acceptUpload(opts: {
  ownerId: string;
  courseId: string;
  labId: string | null;
  fileName: string;
  bytes: Uint8Array;
  params?: Params;
}) {
  const cap = maxUploadBytes();
  if (opts.bytes.byteLength === 0) throw new AppError("bad_request", "The file is empty.", { file: ["The file is empty."] });
  if (opts.bytes.byteLength > cap) {
    throw new AppError("payload_too_large", `The file is ${mb(opts.bytes.byteLength)}; the limit is ${mb(cap)}.`, { file: [`Files may be at most ${mb(cap)}.`] });
  }
  checkQuota(await storedBytes(db, opts.ownerId), opts.bytes.byteLength);
  const { kind, contentType } = await sniffKind(opts.bytes);
  const sha256 = crypto.createHash("sha256").update(opts.bytes).digest("hex");
  let analysis: unknown = null;
  if (kind === "trace") {
    const capacity = typeof opts.params?.batteryCapacity === "number" ? opts.params.batteryCapacity : undefined;
    const usable = typeof opts.params?.usableFraction === "number" ? opts.params.usableFraction : undefined;
    try {
      analysis = await analyzeTrace(Buffer.from(opts.bytes), { batteryCapacity: capacity, usableFraction: usable });
    } catch (e) {
      throw new AppError("bad_request", `The trace could not be read: ${(e as Error).message}`, { file: [(e as Error).message] });
    }
  }
  const storageKey = `${opts.courseId}/${opts.ownerId}/${crypto.randomUUID()}${kind === "trace" ? ".csv" : contentType === "image/png" ? ".png" : ".jpg"}`;
  await putObject(storageKey, opts.bytes, contentType);
  let id: string;
  try {
    id = await db.transaction().execute(async (trx) => {
      await lockOwnerUploads(trx, opts.ownerId);
      checkQuota(await storedBytes(trx, opts.ownerId), opts.bytes.byteLength);
      return insertUpload(trx, {
        ownerId: opts.ownerId,
        courseId: opts.courseId,
        labId: opts.labId,
        kind,
        contentType,
        size: opts.bytes.byteLength,
        sha256,
        storageKey,
        originalName: displayName(opts.fileName),
        analysis,
      });
    });
  } catch (e) {
    // no row, no object: a stored file nobody can reach would only use space
    await deleteObjects([storageKey]).catch((err) => console.error("could not remove the stored file of a failed upload", storageKey, err));
    throw e;
  }
  return { id, kind, contentType, size: opts.bytes.byteLength, sha256, analysis };
}

/** An upload's record with a signed URL valid for 60 s; call it only once the caller may see the file. */
export async function uploadView(u: UploadRow) {
  return {
    id: u.id,
    kind: u.kind,
    contentType: u.contentType,
    size: u.size,
    sha256: u.sha256,
    originalName: u.originalName,
    createdAt: u.createdAt,
    analysis: u.analysis,
    status: u.status,
    progress: u.progress,
    failure: u.failure,
    /** the samples are kept for zooming (GET /api/uploads/{id}/trace) */
    zoomable: u.zoomable,
    url: await signedUrl(u.storageKey, 60, downloadName(u.originalName, u.contentType)),
    urlExpiresInSeconds: 60,
  };
}

/**
 * Removes uploads older than SHUNTWISE_UPLOAD_SWEEP_HOURS (default 24) that no attempt attaches: rows
 * first, then their objects. Returns how many were removed.
 */
export async function sweepUnattachedUploads(now = new Date()): Promise<number> {
  const before = new Date(now.getTime() - unattachedUploadHours() * 3600_000);
  let removed = 0;
  for (;;) {
    const gone = await deleteUnattachedUploads(db, before);
    if (gone.length === 0) return removed;
    for (const g of gone) if (g.multipartId) await abortMultipartUpload(g.storageKey, g.multipartId);
    await deleteObjects(gone.flatMap((g) => (g.samplesKey ? [g.storageKey, g.samplesKey] : [g.storageKey])));
    removed += gone.length;
  }
}
