// The job handlers. Each is safe to run twice (a regrade recomputes from stored readings; a mail job
// finds its message already sent; the upload sweep removes only what is still unattached).
import type PgBoss from "pg-boss";
import { boss, keepTrying, QUEUES, stopBoss } from "./queue";
import { drawForEveryone } from "../labs/draws";
import { runRegrade } from "../labs/regrade";
import { startMailWorker } from "../mail/worker";
import { sweepUnattachedUploads } from "../uploads/accept";
import { analyseUpload, type AnalysisJob } from "../uploads/analysis";

/** When the sweep of unattached uploads runs: every hour, at 17 past (cron, UTC). */
export const UPLOAD_SWEEP_CRON = "17 * * * *";

export async function startWorkers(connectionString?: string): Promise<void> {
  const b = await boss(connectionString);
  try {
    await registerWorkers(b);
  } catch (e) {
    await stopBoss(); // half-registered workers would run twice after the next try
    throw e;
  }
}

async function registerWorkers(b: PgBoss): Promise<void> {
  await b.work<{ regradeId: string }>(QUEUES.regrade, { pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) await runRegrade(job.data.regradeId);
  });
  await b.work<{ labId: string }>(QUEUES.draws, { pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) await drawForEveryone(job.data.labId);
  });
  await startMailWorker(b);
  await b.work<AnalysisJob>(QUEUES.uploadAnalysis, { pollingIntervalSeconds: 1, includeMetadata: true }, async (jobs) => {
    for (const job of jobs) await analyseUpload(job.data, { lastTry: job.retryCount >= job.retryLimit });
  });
  await b.work(QUEUES.uploadSweep, { pollingIntervalSeconds: 5 }, async () => {
    const removed = await sweepUnattachedUploads();
    if (removed) console.log(`removed ${removed} upload(s) never attached to an attempt`);
  });
  await b.schedule(QUEUES.uploadSweep, UPLOAD_SWEEP_CRON, {}, { tz: "UTC", retryLimit: 2 });
}

/** startWorkers, tried again (with backoff) until the database answers: a failed start at boot is not final. */
export function startWorkersRetrying(opts: { connectionString?: string; delayMs?: number } = {}): Promise<void> {
  return keepTrying(() => startWorkers(opts.connectionString), { delayMs: opts.delayMs, what: "job workers" });
}
