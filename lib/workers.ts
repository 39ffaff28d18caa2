// The job handlers. Each is safe to run twice (a regrade recomputes from stored readings).
import { boss, QUEUES } from "./jobs";
import { runRegrade } from "./labs/regrade";

export async function startWorkers(): Promise<void> {
  const b = await boss();
  await b.work<{ regradeId: string }>(QUEUES.regrade, { pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) await runRegrade(job.data.regradeId);
  });
}
