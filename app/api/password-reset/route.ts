import { db } from "@/db";
import { json, jsonBody, route } from "@/lib/http/route";
import { requestPasswordReset } from "@/lib/mail/password-reset";
import { clientAddress, throttle } from "@/lib/security/throttle";
import { resetRequestSchema } from "@/lib/validation/mail";

// Asks for a password link. The answer is the same whether or not an account uses the address.
export const POST = route(async (req) => {
  const { email } = await jsonBody(req, resetRequestSchema);
  // counted per address and per e-mail whether or not an account uses it: a 429 tells nothing either
  await throttle([
    ["resetAccount", email],
    ["resetAddress", clientAddress(req.headers)],
  ]);
  return json({ message: await requestPasswordReset(db, email) });
});
