// `npm run db:seed`: adds the demo course to the database at DATABASE_URL (or the local one).
import { createDb } from "../db";
import { seedDemo } from "../db/seed/demo";
import { databaseUrl, serviceConfig } from "./lib/config";
import { ensurePostgres } from "./lib/postgres";

async function main() {
  let url = process.env.DATABASE_URL;
  if (!url) {
    const cfg = serviceConfig("dev");
    await ensurePostgres(cfg);
    url = databaseUrl(cfg, cfg.databases[0]);
  }
  const db = createDb(url, 2);
  try {
    await seedDemo(db);
    console.log("demo course seeded");
  } finally {
    await db.destroy();
  }
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
