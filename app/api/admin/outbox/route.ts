import { db } from "@/db";
import { json, route } from "@/lib/http/route";
import { requireAdmin } from "@/lib/auth/access";
import { outboxSummary } from "@/lib/mail/outbox";

export const GET = route(async () => {
  await requireAdmin();
  return json(await outboxSummary(db));
});
