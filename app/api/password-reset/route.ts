import { after } from "next/server";
import { db } from "@/db";
import { json, jsonBody, route } from "@/lib/http/route";
import { RESET_ANSWER, requestPasswordReset } from "@/lib/mail/password-reset";
import { clientAddress, throttle } from "@/lib/security/throttle";
import { resetRequestSchema } from "@/lib/validation/mail";

// Asks for a password link. The answer is the same whether or not an account uses the address, and it
// goes out before any work that depends on the address: the link is queued after answering (next/server's
// after()), so the time to answer does not tell whether an account exists.
export const POST = route(async (req) => {
  const { email } = await jsonBody(req, resetRequestSchema);
  // counted per address and per e-mail whether or not an account uses it: a 429 tells nothing either
  await throttle([
    ["resetAccount", email],
    ["resetAddress", clientAddress(req.headers)],
  ]);
  after(async () => {
    try {
      await requestPasswordReset(db, email);
    } catch (e) {
      console.error(`A password link could not be queued (${e instanceof Error ? e.message : String(e)}).`);
    }
  });
  return json({ message: RESET_ANSWER });
});
