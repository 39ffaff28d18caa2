import { db } from "@/db";
import { json, jsonBody, route } from "@/lib/http/route";
import { resetPassword } from "@/lib/mail/password-reset";
import { resetConfirmSchema } from "@/lib/validation/mail";

// Chooses the new password with the e-mailed link: works once, within 30 minutes; signs out every session.
export const POST = route(async (req) => {
  const { token, password } = await jsonBody(req, resetConfirmSchema);
  await resetPassword(db, token, password);
  return json({ message: "Your new password is set. Every other session was signed out; sign in with the new password." });
});
