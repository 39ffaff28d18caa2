// The job handlers. Each is safe to run twice (a regrade recomputes from stored readings; a mail job
// finds its message already sent).
import { boss, QUEUES } from "./jobs";
import { runRegrade } from "./labs/regrade";
import { startMailWorker } from "./mail/worker";

export async function startWorkers(): Promise<void> {
  const b = await boss();
  await b.work<{ regradeId: string }>(QUEUES.regrade, { pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) await runRegrade(job.data.regradeId);
  });
  await startMailWorker(b);
}
