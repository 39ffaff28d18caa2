// Object storage for uploads (S3-compatible). Files are private: they are read only through short-lived
// signed URLs handed to the owner and the course staff. Those URLs point at the store's own origin and
// ask it to answer with `Content-Disposition: attachment`, so a stored file is never shown inline as a
// page of this site (an <img> still displays it). No route of the app returns stored bytes itself.
import "server-only";
import {
  AbortMultipartUploadCommand,
  CompleteMultipartUploadCommand,
  CreateMultipartUploadCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  ListPartsCommand,
  PutObjectCommand,
  S3Client,
  UploadPartCommand,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";

let client: S3Client | undefined;

function s3(): S3Client {
  client ??= new S3Client({
    endpoint: process.env.S3_ENDPOINT,
    region: process.env.S3_REGION ?? "us-east-1",
    forcePathStyle: true,
    // no checksums unless the operation needs one: a streamed body is then sent as it is (not in
    // aws-chunked framing, which S3-compatible stores such as the local stand-in may store verbatim), and
    // signed part URLs carry no checksum of an empty body
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    credentials: {
      accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "S3RVER",
      secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
    },
  });
  return client;
}

const bucket = () => process.env.S3_BUCKET ?? "shuntwise-uploads";

export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType }));
}

/** Stores `length` bytes read from a stream (large objects, without joining them in memory first). */
export async function putObjectStream(key: string, body: NodeJS.ReadableStream, length: number, contentType: string): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body as never, ContentLength: length, ContentType: contentType }));
}

export async function getObjectBytes(key: string): Promise<Uint8Array> {
  const res = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return res.Body!.transformToByteArray();
}

/** Removes objects (missing ones are no error). */
export async function deleteObjects(keys: string[]): Promise<void> {
  for (const Key of keys) await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key }));
}

/** The keys stored under `prefix` (for housekeeping and tests). */
export async function listKeys(prefix: string): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const res = await s3().send(new ListObjectsV2Command({ Bucket: bucket(), Prefix: prefix, ContinuationToken: token }));
    for (const o of res.Contents ?? []) if (o.Key) keys.push(o.Key);
    token = res.IsTruncated ? res.NextContinuationToken : undefined;
  } while (token);
  return keys;
}

/** The extension of each type an upload can be stored as (the type read from the bytes, never the name's). */
const EXTENSION: Record<string, string> = { "image/png": "png", "image/jpeg": "jpg", "text/csv": "csv" };

/**
 * A stored file's download name: the name the student gave without its extension, with the extension of
 * the detected type (`poly.html` stored as PNG downloads as `poly.png`).
 */
export function downloadName(originalName: string, contentType: string): string {
  const base = (originalName.split(/[\\/]/).pop() ?? "").replace(/\.[^.]*$/, "").replace(/[^\w.\- ]/g, "_").replace(/^[.\s]+/, "") || "file";
  return `${base.slice(0, 100)}.${EXTENSION[contentType.split(";")[0].trim().toLowerCase()] ?? "bin"}`;
}

/** `attachment; filename=…` with the name reduced to safe characters. */
export function attachmentDisposition(name = "file"): string {
  return `attachment; filename="${name.replace(/[^\w.\- ]/g, "_") || "file"}"`;
}

/**
 * A URL that reads the object for `seconds` (default 60 s), on the store's origin, always answered as
 * an attachment (a download, never a page shown inline).
 */
export async function signedUrl(key: string, seconds = 60, downloadName?: string): Promise<string> {
  return getSignedUrl(
    s3(),
    new GetObjectCommand({ Bucket: bucket(), Key: key, ResponseContentDisposition: attachmentDisposition(downloadName) }),
    { expiresIn: seconds },
  );
}

/** The object's bytes as a Node stream (for reading a large object once, front to back). */
export async function getObjectStream(key: string, range?: { start: number; end: number }): Promise<NodeJS.ReadableStream> {
  const res = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key, Range: range ? `bytes=${range.start}-${range.end}` : undefined }));
  return res.Body as NodeJS.ReadableStream;
}

/** Bytes `start`..`end` (inclusive) of an object: a ranged GET. */
export async function getObjectRange(key: string, start: number, end: number): Promise<Uint8Array> {
  const res = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key, Range: `bytes=${start}-${end}` }));
  return res.Body!.transformToByteArray();
}

/** The stored size of an object, or null when there is none. */
export async function objectSize(key: string): Promise<number | null> {
  try {
    const res = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return res.ContentLength ?? null;
  } catch (e) {
    if ((e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
    throw e;
  }
}

// Multipart uploads: the app starts one and signs a URL per part; the browser sends the parts straight to
// the store; the app lists what arrived (the store's word, not the browser's) and completes it.

export async function createMultipartUpload(key: string, contentType: string): Promise<string> {
  const res = await s3().send(new CreateMultipartUploadCommand({ Bucket: bucket(), Key: key, ContentType: contentType }));
  if (!res.UploadId) throw new Error("the object store gave no upload id");
  return res.UploadId;
}

/** A URL that stores part `partNumber` of a multipart upload with a PUT, for `seconds`. */
export async function signedPartUrl(key: string, uploadId: string, partNumber: number, seconds: number): Promise<string> {
  return getSignedUrl(s3(), new UploadPartCommand({ Bucket: bucket(), Key: key, UploadId: uploadId, PartNumber: partNumber }), { expiresIn: seconds });
}

export type StoredPart = { number: number; etag: string; size: number };

/** The parts the store holds for a multipart upload (the last copy of a part sent twice), by number. */
export async function listParts(key: string, uploadId: string): Promise<StoredPart[]> {
  const parts: StoredPart[] = [];
  let marker: string | undefined;
  for (;;) {
    const res = await s3().send(new ListPartsCommand({ Bucket: bucket(), Key: key, UploadId: uploadId, PartNumberMarker: marker }));
    for (const p of res.Parts ?? []) if (p.PartNumber && p.ETag) parts.push({ number: p.PartNumber, etag: p.ETag, size: p.Size ?? 0 });
    if (!res.IsTruncated || !res.NextPartNumberMarker) break;
    marker = res.NextPartNumberMarker;
  }
  return parts.sort((a, b) => a.number - b.number);
}

export async function completeMultipartUpload(key: string, uploadId: string, parts: StoredPart[]): Promise<void> {
  await s3().send(
    new CompleteMultipartUploadCommand({
      Bucket: bucket(),
      Key: key,
      UploadId: uploadId,
      MultipartUpload: { Parts: parts.map((p) => ({ PartNumber: p.number, ETag: p.etag })) },
    }),
  );
}

/** Drops a multipart upload and its parts (one already gone is no error). */
export async function abortMultipartUpload(key: string, uploadId: string): Promise<void> {
  try {
    await s3().send(new AbortMultipartUploadCommand({ Bucket: bucket(), Key: key, UploadId: uploadId }));
  } catch (e) {
    if ((e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode !== 404) throw e;
  }
}

export const maxUploadBytes = () => Number(process.env.SHUNTWISE_MAX_UPLOAD_BYTES ?? 10 * 1024 * 1024);

/** Largest logged trace sent straight to storage (SHUNTWISE_MAX_TRACE_BYTES, default 200 MB). */
export function maxTraceBytes(): number {
  const n = Number(process.env.SHUNTWISE_MAX_TRACE_BYTES);
  return Number.isFinite(n) && n > 0 ? n : 200 * 1024 * 1024;
}

/** Bytes one person may keep stored in all (SHUNTWISE_UPLOAD_QUOTA_BYTES, default 200 MB). */
export function uploadQuotaBytes(): number {
  const n = Number(process.env.SHUNTWISE_UPLOAD_QUOTA_BYTES);
  return Number.isFinite(n) && n > 0 ? n : 200 * 1024 * 1024;
}

/** Uploads not attached to any attempt are removed after this many hours (SHUNTWISE_UPLOAD_SWEEP_HOURS, default 24). */
export function unattachedUploadHours(): number {
  const n = Number(process.env.SHUNTWISE_UPLOAD_SWEEP_HOURS);
  return Number.isFinite(n) && n > 0 ? n : 24;
}
