import { db } from "@/db";
import { json, route } from "@/lib/http/route";
import { requireAdmin } from "@/lib/auth/access";
import { notFound } from "@/lib/errors";
import { findOutbox } from "@/db/queries/mail-outbox";
import { resendFailed } from "@/lib/mail/outbox";
import { uuidSchema } from "@/lib/validation/common";

export const POST = route<{ mailId: string }>(async (_req, { mailId }) => {
  await requireAdmin();
  if (!uuidSchema.safeParse(mailId).success || !(await findOutbox(db, mailId))) throw notFound("That message");
  await resendFailed(db, mailId);
  return json({ message: { id: mailId, status: "queued" } });
});
