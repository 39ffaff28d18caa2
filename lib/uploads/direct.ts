// Uploads sent straight to object storage (issue 26). The app asks the store for a multipart upload and
// signs one URL per part; the browser sends the parts to the store itself (the app server sees no byte of
// the file) and then asks the app to complete it. Completion lists the parts the store holds (a part sent
// twice counts once: the store keeps the last copy), joins them, reads the stored size and the first bytes
// back from the store, and refuses (removing the object and the row) a file larger than claimed or than
// the limit, past the quota, or not of the type it claimed. A trace is then analysed by a job
// (lib/uploads/analysis.ts). Limits and the quota are checked when the upload is asked for and again on
// the stored size. Callers authorize first.
import "server-only";
import crypto from "node:crypto";
import { db } from "@/db";
import { claimPendingUpload, deleteUpload, findUpload, insertPendingUpload, lockOwnerUploads, markAnalysing, releaseClaim, storedBytes } from "@/db/queries/uploads";
import { AppError } from "@/lib/errors";
import { enqueue, QUEUES } from "@/lib/jobs/queue";
import {
  abortMultipartUpload,
  completeMultipartUpload,
  createMultipartUpload,
  deleteObjects,
  getObjectRange,
  listParts,
  maxTraceBytes,
  maxUploadBytes,
  objectSize,
  signedPartUrl,
} from "@/lib/uploads/storage";
import { checkQuota, displayName, mb, sniffKind } from "@/lib/uploads/accept";
import { claimedKind, partBytes, type UploadRequest } from "@/lib/validation/uploads";
import type { Params } from "@/lib/grader";

/** How long the signed part URLs last. */
export const PART_URL_SECONDS = 2 * 3600;
/** Bytes read back from storage to sniff the type. */
const SNIFF_BYTES = 64 * 1024;

/** The largest file of a kind: traces SHUNTWISE_MAX_TRACE_BYTES (200 MB), images SHUNTWISE_MAX_UPLOAD_BYTES (10 MB). */
export const capFor = (kind: "image" | "trace") => (kind === "trace" ? maxTraceBytes() : maxUploadBytes());

export async function requestUpload(opts: { ownerId: string; courseId: string; labId: string; input: UploadRequest }) {
  const { input } = opts;
  const kind = claimedKind(input.type);
  const cap = capFor(kind);
  if (input.size > cap) {
    throw new AppError("payload_too_large", `The file is ${mb(input.size)}; ${kind === "trace" ? "a logged trace" : "an image"} may be at most ${mb(cap)}.`, {
      size: [`At most ${mb(cap)}.`],
    });
  }
  checkQuota(await storedBytes(db, opts.ownerId), input.size, "size");
  const ext = kind === "trace" ? ".csv" : input.type === "image/png" ? ".png" : ".jpg";
  const storageKey = `${opts.courseId}/${opts.ownerId}/${crypto.randomUUID()}${ext}`;
  const contentType = kind === "trace" ? "text/csv" : input.type;
  const multipartId = await createMultipartUpload(storageKey, contentType);
  let id: string;
  try {
    id = await db.transaction().execute(async (trx) => {
      await lockOwnerUploads(trx, opts.ownerId);
      checkQuota(await storedBytes(trx, opts.ownerId), input.size, "size");
      return insertPendingUpload(trx, {
        ownerId: opts.ownerId,
        courseId: opts.courseId,
        labId: opts.labId,
        kind,
        contentType,
        size: input.size,
        storageKey,
        originalName: displayName(input.name),
        multipartId,
      });
    });
  } catch (e) {
    await abortMultipartUpload(storageKey, multipartId).catch((err) => console.error("could not drop the multipart upload of a refused upload", storageKey, err));
    throw e;
  }
  const size = partBytes(input.size);
  const count = Math.ceil(input.size / size);
  const parts = await Promise.all(
    Array.from({ length: count }, async (_, k) => ({ number: k + 1, url: await signedPartUrl(storageKey, multipartId, k + 1, PART_URL_SECONDS) })),
  );
  return { upload: { id }, parts, partSize: size, expiresInSeconds: PART_URL_SECONDS };
}

/** Removes a refused upload (object and row) and throws its refusal. */
async function refuse(id: string, storageKey: string, error: AppError): Promise<never> {
  await deleteObjects([storageKey]).catch((err) => console.error("could not remove a refused upload's object", storageKey, err));
  await deleteUpload(db, id);
  throw error;
}

/**
 * Completes an upload of `ownerId`'s: 200 with the upload (status "analysing", or what it is now when it
 * was completed before), a 4xx with the reason when refused (and then nothing of it is left).
 */
export async function completeUpload(opts: { uploadId: string; ownerId: string; params?: Params }) {
  const claimed = await claimPendingUpload(db, opts.uploadId);
  if (!claimed) {
    const row = await findUpload(db, opts.uploadId);
    if (!row || row.ownerId !== opts.ownerId) throw new AppError("not_found", "That upload was not found.");
    if (row.status === "completing") throw new AppError("conflict", "This upload is being completed by another request; ask for it again in a moment.");
    return row;
  }
  if (claimed.ownerId !== opts.ownerId) {
    await releaseClaim(db, claimed.id);
    throw new AppError("not_found", "That upload was not found.");
  }
  const { storageKey, multipartId } = claimed;
  try {
    if (multipartId) {
      const parts = await listParts(storageKey, multipartId);
      if (parts.length === 0) {
        await releaseClaim(db, claimed.id);
        throw new AppError("bad_request", "No part of the file has reached storage yet; send the parts, then complete the upload.", { parts: ["No part has arrived."] });
      }
      const numbers = parts.map((p) => p.number);
      if (numbers.some((n, k) => n !== k + 1)) {
        await releaseClaim(db, claimed.id);
        throw new AppError("bad_request", `Part ${numbers.findIndex((n, k) => n !== k + 1) + 1} of the file has not reached storage yet; send it, then complete the upload.`, {
          parts: ["A part is missing."],
        });
      }
      await completeMultipartUpload(storageKey, multipartId, parts);
    }
  } catch (e) {
    if (!(e instanceof AppError)) await releaseClaim(db, claimed.id);
    throw e;
  }
  const stored = await objectSize(storageKey);
  if (stored === null || stored === 0) return refuse(claimed.id, storageKey, new AppError("bad_request", "The file is empty.", { file: ["The file is empty."] }));
  const cap = capFor(claimed.kind);
  if (stored > cap) {
    return refuse(claimed.id, storageKey, new AppError("payload_too_large", `The stored file is ${mb(stored)}; the limit is ${mb(cap)}. It was removed.`, { size: [`At most ${mb(cap)}.`] }));
  }
  if (stored !== claimed.size) {
    return refuse(
      claimed.id,
      storageKey,
      new AppError("bad_request", `The stored file has ${stored} bytes, not the ${claimed.size} announced when the upload was asked for. It was removed; upload it again.`, {
        size: ["The size announced differs from the file's."],
      }),
    );
  }
  const head = await getObjectRange(storageKey, 0, Math.min(stored, SNIFF_BYTES) - 1);
  let sniffed: { kind: "image" | "trace"; contentType: string };
  try {
    sniffed = await sniffKind(head);
  } catch (e) {
    return refuse(claimed.id, storageKey, e as AppError);
  }
  if (sniffed.kind !== claimed.kind) {
    const what = (k: string) => (k === "trace" ? "a CSV trace" : "an image");
    return refuse(
      claimed.id,
      storageKey,
      new AppError("unsupported_media_type", `The file was announced as ${what(claimed.kind)} but is ${what(sniffed.kind)}. It was removed.`, { type: ["The file is not of this type."] }),
    );
  }
  try {
    await db.transaction().execute(async (trx) => {
      await lockOwnerUploads(trx, opts.ownerId);
      // the quota on the stored size: the row already counts the size announced, which equals it here
      checkQuota((await storedBytes(trx, opts.ownerId)) - claimed.size, stored);
      await markAnalysing(trx, claimed.id, { size: stored, kind: sniffed.kind, contentType: sniffed.contentType });
      await enqueue(QUEUES.uploadAnalysis, { uploadId: claimed.id, params: opts.params ?? null }, { trx, retryLimit: 3, retryDelay: 2, singletonKey: claimed.id });
    });
  } catch (e) {
    if (e instanceof AppError) return refuse(claimed.id, storageKey, e);
    await releaseClaim(db, claimed.id);
    throw e;
  }
  return (await findUpload(db, claimed.id))!;
}

/** The parts of a pending upload the store holds so far (for an upload client resuming after a dropped connection). */
export async function storedParts(row: { storageKey: string; status: string; multipartId: string | null }) {
  if (row.status !== "pending" || !row.multipartId) return [];
  return listParts(row.storageKey, row.multipartId);
}
