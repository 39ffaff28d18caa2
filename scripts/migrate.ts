// `npm run db:migrate`: brings the database at DATABASE_URL (or the local one) to the latest migration.
// `npm run db:migrate -- down` undoes the last one.
import { createDb } from "../db";
import { migrateToLatest, migrator } from "../db/migrator";
import { serviceConfig } from "./lib/config";
import { localDatabaseUrl } from "./lib/postgres";

async function main() {
  const url = await localDatabaseUrl(serviceConfig("dev"));
  const db = createDb(url, 2);
  try {
    if (process.argv[2] === "down") {
      const { error, results } = await migrator(db).migrateDown();
      if (error) throw error;
      console.log(results?.map((r) => `undid ${r.migrationName}`).join("\n") || "nothing to undo");
    } else {
      const done = await migrateToLatest(db);
      console.log(done.length ? done.map((n) => `applied ${n}`).join("\n") : "database is up to date");
    }
  } finally {
    await db.destroy();
  }
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
