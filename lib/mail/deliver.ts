// Sends one outbox row, at most once. The row is locked while the message goes out, and the send is
// recorded with the SMTP message id in the same transaction, before the job completes: a second run
// of the job (a retry, a duplicate) finds the row sent and sends nothing. Every message carries a
// Message-ID made from the row id, so even a crash between the server's acceptance and the commit
// gives a repeat that mail clients recognise as the same message.
import type { Transporter } from "nodemailer";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { lockOutbox, markSent, markTryFailed } from "@/db/queries/mail-outbox";
import { mailFrom } from "./config";
import { renderMail } from "./render";
import { transport as defaultTransport } from "./transport";

export type DeliverOutcome = "sent" | "already-sent" | "gone";

export function messageIdFor(outboxId: string, from = mailFrom()): string {
  const domain = /@([^>\s]+)/.exec(from)?.[1] ?? "shuntwise.example";
  return `<mail-${outboxId}@${domain}>`;
}

export async function deliver(
  db: Kysely<Database>,
  outboxId: string,
  opts: { transport?: Transporter; final?: boolean } = {},
): Promise<DeliverOutcome> {
  const accepted: { messageId?: string } = {}; // set once the SMTP server has taken the message
  try {
    return await db.transaction().execute(async (trx) => {
      const row = await lockOutbox(trx, outboxId);
      if (!row) return "gone";
      if (row.status === "sent") return "already-sent";
      const msg = await renderMail(row.kind, row.data, row.subject);
      const from = mailFrom();
      const messageId = messageIdFor(row.id, from);
      const info = await (opts.transport ?? defaultTransport()).sendMail({
        from,
        to: row.to,
        subject: msg.subject,
        html: msg.html,
        text: msg.text,
        messageId,
        headers: { "X-Shuntwise-Event": row.key },
      });
      const sentId: string = info.messageId || messageId;
      accepted.messageId = sentId;
      await markSent(trx, row.id, sentId);
      return "sent" as const;
    });
  } catch (e) {
    // the server took the message but the database went away before the record committed: keep
    // trying to record it (outside the dead transaction) rather than let a retry send it again
    if (accepted.messageId) return recordSentLater(db, outboxId, accepted.messageId, e);
    await markTryFailed(db, outboxId, e instanceof Error ? e.message : String(e), opts.final ?? false);
    throw e;
  }
}

/** Records a message the SMTP server accepted, trying for up to a minute while the database is away. */
async function recordSentLater(db: Kysely<Database>, outboxId: string, messageId: string, first: unknown): Promise<DeliverOutcome> {
  const until = Date.now() + 60_000;
  let last = first;
  while (Date.now() < until) {
    await new Promise((r) => setTimeout(r, 1000));
    try {
      await markSent(db, outboxId, messageId);
      return "sent";
    } catch (e) {
      last = e;
    }
  }
  throw last;
}
