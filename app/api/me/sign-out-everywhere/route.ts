// Ends every session of the caller, on every device, this one included.
import { db } from "@/db";
import { revokeSessions } from "@/db/queries/users";
import { json, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";

export const POST = route(async () => {
  const user = await requireUser();
  const at = await revokeSessions(db, user.id);
  return json({ signedOutAt: at.toISOString() });
});
