// The mail outbox: one row per mail event key. The row is written in the same transaction as the event
// (a grade, a reset request), and the worker records the send on it before its job completes.
import { sql, type Transaction } from "kysely";
import type { Database, Db, MailStatus } from "../types";

export interface OutboxInsert {
  key: string;
  kind: string;
  to: string;
  subject?: string | null;
  data: unknown;
  /** the id of the job that sends it, when chosen before the job is queued */
  jobId?: string | null;
}

/** Inserts the row unless its key is already there; returns the new id, or null for a known key. */
export async function insertOutbox(db: Db, m: OutboxInsert): Promise<string | null> {
  const row = await db
    .insertInto("mail_outbox")
    .values({ key: m.key, kind: m.kind, to_address: m.to, subject: m.subject ?? null, data: JSON.stringify(m.data ?? {}), job_id: m.jobId ?? null })
    .onConflict((oc) => oc.column("key").doNothing())
    .returning("id")
    .executeTakeFirst();
  return row?.id ?? null;
}

export async function setOutboxJob(db: Db, id: string, jobId: string | null) {
  await db.updateTable("mail_outbox").set({ job_id: jobId }).where("id", "=", id).execute();
}

const OUTBOX_COLUMNS = [
  "id",
  "key",
  "kind",
  "to_address as to",
  "subject",
  "data",
  "status",
  "tries",
  "last_error as lastError",
  "message_id as messageId",
  "job_id as jobId",
  "created_at as createdAt",
  "sent_at as sentAt",
  "failed_at as failedAt",
] as const;

export async function findOutbox(db: Db, id: string) {
  return db.selectFrom("mail_outbox").select(OUTBOX_COLUMNS).where("id", "=", id).executeTakeFirst();
}

export async function findOutboxByKey(db: Db, key: string) {
  return db.selectFrom("mail_outbox").select(OUTBOX_COLUMNS).where("key", "=", key).executeTakeFirst();
}

export type OutboxRow = NonNullable<Awaited<ReturnType<typeof findOutbox>>>;

/** Locks the row for the rest of the transaction, so two runs of one job cannot both send. */
export async function lockOutbox(trx: Transaction<Database>, id: string) {
  return trx.selectFrom("mail_outbox").select(OUTBOX_COLUMNS).where("id", "=", id).forUpdate().executeTakeFirst();
}

export async function markSent(db: Db, id: string, messageId: string) {
  await db
    .updateTable("mail_outbox")
    .set({ status: "sent", message_id: messageId, sent_at: new Date(), last_error: null, tries: sql`tries + 1` })
    .where("id", "=", id)
    .execute();
}

export async function markTryFailed(db: Db, id: string, error: string, final: boolean) {
  await db
    .updateTable("mail_outbox")
    .set({
      tries: sql`tries + 1`,
      last_error: error.slice(0, 2000),
      ...(final ? { status: "failed" as MailStatus, failed_at: new Date() } : {}),
    })
    .where("id", "=", id)
    .where("status", "!=", "sent")
    .execute();
}

/** Back to the queue for a resend; only a failed message can be resent. */
export async function requeueFailed(db: Db, id: string): Promise<boolean> {
  const r = await db
    .updateTable("mail_outbox")
    .set({ status: "queued", failed_at: null })
    .where("id", "=", id)
    .where("status", "=", "failed")
    .executeTakeFirst();
  return Number(r.numUpdatedRows) === 1;
}

/** Queued, sent and failed counts per day (UTC), newest day first. */
export async function outboxCountsPerDay(db: Db, days = 14) {
  const rows = await db
    .selectFrom("mail_outbox")
    .select([
      sql<string>`to_char(date_trunc('day', created_at at time zone 'UTC'), 'YYYY-MM-DD')`.as("day"),
      sql<number>`count(*) filter (where status = 'queued')::int`.as("queued"),
      sql<number>`count(*) filter (where status = 'sent')::int`.as("sent"),
      sql<number>`count(*) filter (where status = 'failed')::int`.as("failed"),
    ])
    .where("created_at", ">", sql<Date>`now() - make_interval(days => ${days})`)
    .groupBy(sql`1`)
    .orderBy(sql`1`, "desc")
    .execute();
  return rows;
}

export async function lastFailures(db: Db, limit = 20) {
  return db
    .selectFrom("mail_outbox")
    .select(OUTBOX_COLUMNS)
    .where("status", "=", "failed")
    .orderBy("failed_at", "desc")
    .limit(limit)
    .execute();
}

export async function outboxForAddress(db: Db, to: string) {
  return db.selectFrom("mail_outbox").select(OUTBOX_COLUMNS).where(sql`lower(to_address)`, "=", to.toLowerCase()).orderBy("created_at", "desc").execute();
}
