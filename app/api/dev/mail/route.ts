import { json, route } from "@/lib/http/route";
import { requireAdmin } from "@/lib/auth/access";
import { notFound } from "@/lib/errors";
import { mailboxAvailable, readMailbox } from "@/lib/mail/mailbox";
import { devMailQuerySchema } from "@/lib/validation/mail";
import { parseOr400 } from "@/lib/validation/zod-errors";

// The development mailbox as JSON: only while the local SMTP stand-in is in use (404 otherwise), for
// site admins.
export const GET = route(async (req) => {
  if (!mailboxAvailable()) throw notFound("That page");
  await requireAdmin();
  const to = new URL(req.url).searchParams.get("to");
  const q = parseOr400(devMailQuerySchema, to === null ? {} : { to });
  return json({ messages: await readMailbox({ to: q.to }) });
});
