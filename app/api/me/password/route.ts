import { db } from "@/db";
import { json, jsonBody, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";
import { changePassword } from "@/lib/mail/password-reset";
import { changePasswordSchema } from "@/lib/validation/mail";

export const POST = route(async (req) => {
  const user = await requireUser();
  const { currentPassword, newPassword } = await jsonBody(req, changePasswordSchema);
  await changePassword(db, user, currentPassword, newPassword);
  return json({ message: "Your password is changed." });
});
