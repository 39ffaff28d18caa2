// queueMail: the one way to send e-mail. It writes the outbox row and the pg-boss job inside the
// caller's transaction, so an event that rolls back sends nothing and a stored event always has its
// job. The key names the event: a second call with the same key queues nothing.
import { randomUUID } from "node:crypto";
import type { Transaction } from "kysely";
import type { Database } from "@/db/types";
import { findOutboxByKey, insertOutbox } from "@/db/queries/mail-outbox";
import { boss, bossDb, QUEUES } from "@/lib/jobs/queue";
import { retryOptions } from "./config";

export interface MailRequest {
  /** the event key, e.g. `graded:{attemptId}`; one message per key, ever */
  key: string;
  /** which template renders it (lib/mail/render.ts) */
  kind: string;
  to: string;
  subject?: string;
  data: Record<string, unknown>;
}

export interface MailJob {
  outboxId: string;
}

/** Sends the outbox row's job, in `trx` when given, with the job id `jobId` when given. */
export async function sendMailJob(outboxId: string, trx?: Transaction<Database>, jobId?: string): Promise<string | null> {
  const b = await boss();
  const data: MailJob = { outboxId };
  return b.send(QUEUES.mail, data, { ...retryOptions(), ...(trx ? { db: bossDb(trx) } : {}), ...(jobId ? { id: jobId } : {}) });
}

/**
 * Queues one message in `trx`. Returns the outbox id and whether this call queued it (false when the
 * key was already queued, in this transaction or an earlier one). The job's id is chosen here, so the
 * row is written with it and the job follows (two statements).
 */
export async function queueMail(trx: Transaction<Database>, m: MailRequest): Promise<{ id: string; queued: boolean }> {
  const jobId = randomUUID();
  const id = await insertOutbox(trx, { ...m, jobId });
  if (!id) {
    const known = await findOutboxByKey(trx, m.key);
    return { id: known!.id, queued: false };
  }
  if ((await sendMailJob(id, trx, jobId)) !== jobId) throw new Error(`the mail queue "${QUEUES.mail}" did not accept the job`);
  return { id, queued: true };
}
