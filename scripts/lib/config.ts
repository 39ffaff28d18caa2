// Where each local service lives. `dev` serves `npm start`; `test` is a separate PostgreSQL cluster
// (fsync off) and separate ports for `npm test`, so a running demo and a test run never collide.
import path from "node:path";

export const root = path.resolve(import.meta.dirname, "..", "..");

export type Profile = "dev" | "test";

export interface ServiceConfig {
  profile: Profile;
  dataDir: string;
  pgDir: string;
  pgPort: number;
  databases: string[];
  appPort: number;
  appHost: string;
  s3Port: number;
  smtpPort: number;
}

function int(name: string, fallback: number): number {
  const raw = process.env[name];
  if (!raw) return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0 || n > 65535) throw new Error(`${name} must be a port number, got "${raw}"`);
  return n;
}

export function serviceConfig(profile: Profile): ServiceConfig {
  const dataDir = path.resolve(root, process.env.SHUNTWISE_DATA_DIR ?? ".data");
  if (profile === "dev") {
    return {
      profile,
      dataDir,
      pgDir: path.join(dataDir, "pg"),
      pgPort: int("SHUNTWISE_PG_PORT", 54329),
      databases: ["shuntwise"],
      appPort: int("PORT", 3000),
      appHost: "127.0.0.1",
      s3Port: int("SHUNTWISE_S3_PORT", 4569),
      smtpPort: int("SHUNTWISE_SMTP_PORT", 2525),
    };
  }
  return {
    profile,
    dataDir,
    pgDir: path.join(dataDir, "pg-test"),
    pgPort: int("SHUNTWISE_TEST_PG_PORT", 54339),
    // shuntwise_test: integration tests (tables emptied between tests);
    // shuntwise_e2e: the seeded demo served to the browser and HTTP tests.
    databases: ["shuntwise_test", "shuntwise_e2e"],
    appPort: int("SHUNTWISE_TEST_APP_PORT", 3100),
    appHost: "127.0.0.1",
    s3Port: int("SHUNTWISE_TEST_S3_PORT", 4579),
    smtpPort: int("SHUNTWISE_TEST_SMTP_PORT", 2535),
  };
}

export function databaseUrl(cfg: ServiceConfig, database: string): string {
  return `postgres://postgres@127.0.0.1:${cfg.pgPort}/${database}`;
}
