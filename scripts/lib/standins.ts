// Local stand-ins for the production mail service and object storage: an SMTP server on 127.0.0.1
// that keeps every message as an .eml file, and an S3-compatible server with its data in .data/.
import fs from "node:fs";
import path from "node:path";
import S3rver from "s3rver";
import { SMTPServer } from "smtp-server";
import type { ServiceConfig } from "./config";
import { multipartExtras, UPLOAD_BUCKET_CORS } from "./s3-multipart-extras";

export const UPLOAD_BUCKET = "shuntwise-uploads";

export interface StandIns {
  mailDir: string;
  s3Endpoint: string;
  smtpUrl: string;
  close(): Promise<void>;
}

export async function startStandIns(cfg: ServiceConfig): Promise<StandIns> {
  const mailDir = path.join(cfg.dataDir, `mail-${cfg.profile}`);
  const s3Dir = path.join(cfg.dataDir, `s3-${cfg.profile}`);
  if (cfg.profile === "test") {
    // every test run starts with empty storage and an empty mailbox
    fs.rmSync(mailDir, { recursive: true, force: true });
    fs.rmSync(s3Dir, { recursive: true, force: true });
  }
  fs.mkdirSync(mailDir, { recursive: true });
  fs.mkdirSync(s3Dir, { recursive: true });

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["AUTH", "STARTTLS"],
    logger: false,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        const name = `${new Date().toISOString().replace(/[:.]/g, "-")}-${Math.random().toString(36).slice(2, 8)}.eml`;
        fs.writeFileSync(path.join(mailDir, name), Buffer.concat(chunks));
        callback();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(cfg.smtpPort, "127.0.0.1", () => resolve());
  });

  const s3 = new S3rver({
    port: cfg.s3Port,
    address: "127.0.0.1",
    silent: true,
    directory: s3Dir,
    configureBuckets: [{ name: UPLOAD_BUCKET, configs: [UPLOAD_BUCKET_CORS] }],
  });
  // ListParts and AbortMultipartUpload, which s3rver lacks, answered before its own routes
  s3.middleware.unshift(multipartExtras(s3.store) as (typeof s3.middleware)[number]);
  await s3.run();

  return {
    mailDir,
    s3Endpoint: `http://127.0.0.1:${cfg.s3Port}`,
    smtpUrl: `smtp://127.0.0.1:${cfg.smtpPort}`,
    async close() {
      await Promise.allSettled([new Promise<void>((r) => smtp.close(() => r())), s3.close()]);
    },
  };
}
