// Object storage for uploads (S3-compatible). Files are private: they are read only through short-lived
// signed URLs handed to the owner and the course staff. Those URLs point at the store's own origin and
// ask it to answer with `Content-Disposition: attachment`, so a stored file is never shown inline as a
// page of this site (an <img> still displays it). No route of the app returns stored bytes itself.
import "server-only";
import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";

let client: S3Client | undefined;

function s3(): S3Client {
  client ??= new S3Client({
    endpoint: process.env.S3_ENDPOINT,
    region: process.env.S3_REGION ?? "us-east-1",
    forcePathStyle: true,
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

export const maxUploadBytes = () => Number(process.env.SHUNTWISE_MAX_UPLOAD_BYTES ?? 10 * 1024 * 1024);

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
