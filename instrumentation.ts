// Runs once when the Next.js server starts: the background-job workers live in the server process.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs" || !process.env.DATABASE_URL) return;
  if (process.env.SHUNTWISE_NO_WORKERS === "1") return;
  const { startWorkers } = await import("./lib/workers");
  await startWorkers().catch((e) => console.error("could not start the job workers", e));
}
