// Object storage for uploads (S3-compatible). Files are private: they are read only through short-lived
// signed URLs handed to the owner and the course staff.
import "server-only";
import { GetObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
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

/** A URL that reads the object for `seconds` (default 60 s). */
export async function signedUrl(key: string, seconds = 60, downloadName?: string): Promise<string> {
  return getSignedUrl(
    s3(),
    new GetObjectCommand({
      Bucket: bucket(),
      Key: key,
      ...(downloadName ? { ResponseContentDisposition: `inline; filename="${downloadName.replace(/[^\w.\- ]/g, "_")}"` } : {}),
    }),
    { expiresIn: seconds },
  );
}

export const maxUploadBytes = () => Number(process.env.SHUNTWISE_MAX_UPLOAD_BYTES ?? 10 * 1024 * 1024);
