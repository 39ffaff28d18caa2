// Ends every session of the caller, on every device, this one included.
import { db } from "@/db";
import { deleteSessionsOf } from "@/db/queries/sessions";
import { json, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";

export const POST = route(async () => {
  const user = await requireUser();
  await deleteSessionsOf(db, user.id);
  return json({ signedOutAt: new Date().toISOString() });
});
