// The mail worker: takes `mail-send` jobs and delivers their outbox rows. A failed try throws, so
// pg-boss retries with exponential backoff; after the last retry the row shows as failed in the
// admin outbox, where it can be sent again.
import type PgBoss from "pg-boss";
import type { Transporter } from "nodemailer";
import { db as appDb } from "@/db";
import type { Database } from "@/db/types";
import type { Kysely } from "kysely";
import { QUEUES } from "@/lib/jobs/queue";
import { deliver } from "./deliver";
import type { MailJob } from "./queue";

export async function handleMailJobs(jobs: PgBoss.JobWithMetadata<MailJob>[], opts: { db?: Kysely<Database>; transport?: Transporter } = {}) {
  for (const job of jobs) {
    await deliver(opts.db ?? appDb, job.data.outboxId, { transport: opts.transport, final: job.retryCount >= job.retryLimit });
  }
}

/**
 * Starts `workers` pollers of the mail queue (default 4). pg-boss 10 waits its polling interval after
 * every fetch, so one poller sends at most one message a second; a deadline's burst of graded e-mail
 * needs several. Each takes one job at a time, so a job's expiry covers one message.
 */
export async function startMailWorker(boss: PgBoss, opts: { db?: Kysely<Database>; transport?: Transporter; pollingIntervalSeconds?: number; workers?: number } = {}) {
  const ids: string[] = [];
  for (let i = 0; i < (opts.workers ?? 4); i++) {
    ids.push(
      await boss.work<MailJob>(
        QUEUES.mail,
        { pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 1, includeMetadata: true, batchSize: 1 },
        (jobs) => handleMailJobs(jobs, opts),
      ),
    );
  }
  return ids[0];
}
