// The admin outbox: counts per day and the last failures, and sending a failed message again.
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { lastFailures, outboxCountsPerDay, requeueFailed, setOutboxJob } from "@/db/queries/mail-outbox";
import { AppError } from "@/lib/errors";
import { sendMailJob } from "./queue";

export async function outboxSummary(db: Kysely<Database>) {
  const [days, failures] = await Promise.all([outboxCountsPerDay(db), lastFailures(db)]);
  return {
    days,
    failures: failures.map((f) => ({
      id: f.id,
      kind: f.kind,
      to: f.to,
      tries: f.tries,
      error: f.lastError,
      createdAt: f.createdAt,
      failedAt: f.failedAt,
    })),
  };
}

/** A failed message goes back to the queue with a new job, in one transaction; its key stays the same. */
export async function resendFailed(db: Kysely<Database>, id: string) {
  await db.transaction().execute(async (trx) => {
    if (!(await requeueFailed(trx, id))) throw new AppError("conflict", "Only a failed message can be sent again.");
    const jobId = await sendMailJob(id, trx);
    await setOutboxJob(trx, id, jobId);
  });
}
