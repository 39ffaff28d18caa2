// `npm run db:stop` stops the local PostgreSQL clusters (the demo's and the tests').
import { serviceConfig } from "./lib/config";
import { stopPostgres } from "./lib/postgres";

const what = process.argv[2];
if (what !== "stop") {
  console.error("usage: tsx scripts/db.ts stop");
  process.exit(2);
}
for (const profile of ["dev", "test"] as const) {
  const stopped = stopPostgres(serviceConfig(profile));
  console.log(stopped ? `Stopped the ${profile} database.` : `The ${profile} database was not running.`);
}
