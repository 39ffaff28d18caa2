// `npm run db:seed`: adds the demo course to the database at DATABASE_URL (or the local one).
import { createDb } from "../db";
import { seedDemo } from "./seed/demo";
import { serviceConfig } from "./lib/config";
import { localDatabaseUrl } from "./lib/postgres";

async function main() {
  const url = await localDatabaseUrl(serviceConfig("dev"));
  const db = createDb(url, 2);
  try {
    await seedDemo(db, { mailDatabaseUrl: url });
    console.log("demo course seeded");
  } finally {
    await db.destroy();
  }
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
