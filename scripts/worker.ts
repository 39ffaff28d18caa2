// `npm run worker`: the background jobs alone (graded e-mail, lab recomputations, the sweep of unattached uploads), for a deployment that
// runs web and worker processes separately (start the web server with SHUNTWISE_NO_WORKERS=1 there).
// `npm start` runs the same workers inside the web server. Uses DATABASE_URL, else the local database.
import { serviceConfig } from "./lib/config";
import { localDatabaseUrl } from "./lib/postgres";

async function main() {
  const cfg = serviceConfig("dev");
  process.env.DATABASE_URL ??= await localDatabaseUrl(cfg);
  process.env.SMTP_URL ??= `smtp://127.0.0.1:${cfg.smtpPort}`;
  process.env.APP_URL ??= process.env.NEXTAUTH_URL ?? `http://127.0.0.1:${cfg.appPort}`;
  const { boss } = await import("../lib/jobs/queue");
  const { startWorkersRetrying } = await import("../lib/jobs/workers");
  await startWorkersRetrying();
  console.log("Shuntwise worker is running (graded e-mail and lab recomputations). Ctrl-C stops it.");
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    console.log("Stopping the worker after the jobs in hand…");
    await (await boss()).stop({ graceful: true, wait: true, timeout: 20_000 });
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
