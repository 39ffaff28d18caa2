import { db } from "@/db";
import { json, jsonBody, route } from "@/lib/http/route";
import { currentSessionId, requireUser } from "@/lib/auth/access";
import { changePassword } from "@/lib/mail/password-reset";
import { clientAddress, forgive, giveBack, type LimitName, takeTry } from "@/lib/security/throttle";
import { changePasswordSchema } from "@/lib/validation/mail";

// The current password is checked like a sign-in: a try is taken from the account's sign-in counter and
// the address's before the check (a stolen session cannot guess the password faster than the sign-in
// form allows), and given back when the password was right.
export const POST = route(async (req) => {
  const user = await requireUser();
  const { currentPassword, newPassword } = await jsonBody(req, changePasswordSchema);
  const counters: [LimitName, string][] = [
    ["signInAccount", user.email],
    ["signInAddress", clientAddress(req.headers)],
  ];
  await takeTry(counters, "currentPassword");
  await changePassword(db, user, currentPassword, newPassword, await currentSessionId());
  await Promise.all([forgive("signInAccount", user.email), giveBack([counters[1]])]);
  return json({ message: "Your password is changed. Every other device where you were signed in is signed out." });
});
