// Runs once when the Next.js server starts: the background-job workers live in the server process.
// A database that does not answer yet delays the workers (they are tried again with backoff), it does
// not disable them until the next restart.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs" || !process.env.DATABASE_URL) return;
  if (process.env.SHUNTWISE_NO_WORKERS === "1") return;
  const { startWorkersRetrying } = await import("./lib/jobs/workers");
  void startWorkersRetrying();
}
