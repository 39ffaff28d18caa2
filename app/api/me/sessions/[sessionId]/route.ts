// Signs out one of the caller's sessions (another device, or this one). Someone else's session, or one
// that is already gone, is not found.
import { db } from "@/db";
import { deleteSession } from "@/db/queries/sessions";
import { json, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";
import { notFound } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";

export const DELETE = route<{ sessionId: string }>(async (_req, { sessionId }) => {
  const user = await requireUser();
  if (!uuidSchema.safeParse(sessionId).success || !(await deleteSession(db, user.id, sessionId))) throw notFound("That session");
  return json({ signedOut: true });
});
