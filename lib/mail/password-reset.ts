// Password reset by e-mail and the settings a user changes: the answer to a reset request never says
// whether an account exists; choosing the new password uses the link once and signs out every session.
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { deleteSessionsOf } from "@/db/queries/sessions";
import { findCredentials, findUserByEmail, setPassword } from "@/db/queries/users";
import { checkPassword, hashPassword } from "@/lib/auth/password";
import { AppError } from "@/lib/errors";
import { consumeToken, queuePasswordMail, TOKEN_MINUTES } from "./tokens";

export const RESET_ANSWER = `If an account uses that address, a link to choose a new password is on its way. It works once, within ${TOKEN_MINUTES} minutes.`;
export const LINK_UNUSABLE = "This link has expired or was already used. Ask for a new one.";

/** The same answer whether or not the address has an account. */
export async function requestPasswordReset(db: Kysely<Database>, email: string, now = new Date()): Promise<string> {
  const user = await findUserByEmail(db, email);
  if (user) await db.transaction().execute((trx) => queuePasswordMail(trx, user, "reset", now));
  return RESET_ANSWER;
}

/** Uses the link once, stores the new password and voids every session signed in before now. */
export async function resetPassword(db: Kysely<Database>, token: string, password: string, now = new Date()): Promise<{ userId: string }> {
  const passwordHash = await hashPassword(password);
  return db.transaction().execute(async (trx) => {
    const used = await consumeToken(trx, token, now);
    if (!used) throw new AppError("bad_request", LINK_UNUSABLE, { token: [LINK_UNUSABLE] });
    await setPassword(trx, used.userId, passwordHash);
    await deleteSessionsOf(trx, used.userId);
    return { userId: used.userId };
  });
}

/** A new password from the settings page: every other session of the user, on every device, ends. */
export async function changePassword(db: Kysely<Database>, user: { id: string; email: string }, current: string, next: string, keepSessionId: string | null) {
  const found = await findCredentials(db, user.email);
  if (!found || found.id !== user.id || !(await checkPassword(found.passwordHash, current))) {
    throw new AppError("bad_request", "Your current password is not right.", { currentPassword: ["That is not your current password."] });
  }
  const passwordHash = await hashPassword(next);
  await db.transaction().execute(async (trx) => {
    await setPassword(trx, user.id, passwordHash);
    await deleteSessionsOf(trx, user.id, keepSessionId ?? undefined);
  });
}
