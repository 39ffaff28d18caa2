// Object storage for the demo seed (trace uploads), from the same S3_* variables the app uses.
import { PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import type { SeedStorage } from "./labs";

export function seedStorageFromEnv(env: NodeJS.ProcessEnv): SeedStorage | undefined {
  if (!env.S3_ENDPOINT) return undefined;
  const client = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION ?? "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID ?? "S3RVER", secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? "S3RVER" },
  });
  return {
    async put(key, body, contentType) {
      await client.send(new PutObjectCommand({ Bucket: env.S3_BUCKET ?? "shuntwise-uploads", Key: key, Body: body, ContentType: contentType }));
    },
  };
}
