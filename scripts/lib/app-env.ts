// The environment the Next.js server and the scripts run with. Values already set in the environment win.
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type { ServiceConfig } from "./config";
import { UPLOAD_BUCKET } from "./standins";

function secret(cfg: ServiceConfig): string {
  if (process.env.NEXTAUTH_SECRET) return process.env.NEXTAUTH_SECRET;
  const file = path.join(cfg.dataDir, `nextauth-secret-${cfg.profile}`);
  if (!fs.existsSync(file)) {
    fs.mkdirSync(cfg.dataDir, { recursive: true });
    fs.writeFileSync(file, crypto.randomBytes(32).toString("base64url"), { mode: 0o600 });
  }
  return fs.readFileSync(file, "utf8").trim();
}

export function appEnv(cfg: ServiceConfig, databaseUrl: string): NodeJS.ProcessEnv {
  const url = `http://${cfg.appHost}:${cfg.appPort}`;
  return {
    ...process.env,
    NODE_ENV: "production",
    DATABASE_URL: process.env.DATABASE_URL && cfg.profile === "dev" ? process.env.DATABASE_URL : databaseUrl,
    NEXTAUTH_URL: process.env.NEXTAUTH_URL && cfg.profile === "dev" ? process.env.NEXTAUTH_URL : url,
    NEXTAUTH_SECRET: secret(cfg),
    APP_URL: url,
    SMTP_URL: process.env.SMTP_URL ?? `smtp://127.0.0.1:${cfg.smtpPort}`,
    MAIL_FROM: process.env.MAIL_FROM ?? "Shuntwise <no-reply@shuntwise.example>",
    S3_ENDPOINT: process.env.S3_ENDPOINT ?? `http://127.0.0.1:${cfg.s3Port}`,
    S3_BUCKET: process.env.S3_BUCKET ?? UPLOAD_BUCKET,
    S3_REGION: process.env.S3_REGION ?? "us-east-1",
    S3_ACCESS_KEY_ID: process.env.S3_ACCESS_KEY_ID ?? "S3RVER",
    S3_SECRET_ACCESS_KEY: process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
    SHUNTWISE_MAIL_DIR: path.join(cfg.dataDir, `mail-${cfg.profile}`),
    // the development mailbox (/dev/mailbox): these scripts run the local SMTP stand-in, so they turn it
    // on; it stays off whenever SMTP_URL names another server (lib/mail/mailbox.ts)
    SHUNTWISE_DEV_MAILBOX: process.env.SHUNTWISE_DEV_MAILBOX ?? "1",
  };
}
