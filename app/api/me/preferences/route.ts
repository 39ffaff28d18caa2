import { db } from "@/db";
import { findPreferences, setGradeMail } from "@/db/queries/users";
import { json, jsonBody, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";
import { preferencesSchema } from "@/lib/validation/mail";

export const GET = route(async () => {
  const user = await requireUser();
  const p = await findPreferences(db, user.id);
  return json({ preferences: { gradeMail: p?.gradeMail ?? true } });
});

// Graded-attempt e-mails on or off; regrades by the staff are always sent.
export const PATCH = route(async (req) => {
  const user = await requireUser();
  const { gradeMail } = await jsonBody(req, preferencesSchema);
  await setGradeMail(db, user.id, gradeMail);
  return json({ preferences: { gradeMail } });
});
