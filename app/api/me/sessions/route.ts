// The caller's sessions (signed-in browsers), the current one marked.
import { db } from "@/db";
import { listSessions } from "@/db/queries/sessions";
import { json, route } from "@/lib/http/route";
import { currentSessionId, requireUser } from "@/lib/auth/access";
import { sessionLimits } from "@/lib/auth/sessions";

export const GET = route(async () => {
  const user = await requireUser();
  const [rows, current] = await Promise.all([listSessions(db, user.id, sessionLimits()), currentSessionId()]);
  return json({ sessions: rows.map((s) => ({ ...s, current: s.id === current })) });
});
