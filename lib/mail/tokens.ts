// Password tokens: a signed, single-use link to choose a password. A reset link is valid for 30 minutes;
// an invitation (a first password for an account the staff made) for seven days, since a student may read
// it days before the first lab session. The token is
// the row id and an HMAC of it under the app's secret, so a guessed or altered link is refused before
// the database is asked; the row makes it single-use and carries the expiry.
import crypto from "node:crypto";
import type { Kysely, Transaction } from "kysely";
import type { Database, Db, PasswordTokenPurpose } from "@/db/types";
import { findUsableToken, insertPasswordToken, retireTokens, spendToken } from "@/db/queries/password-tokens";
import { queueMail } from "./queue";

export const TOKEN_MINUTES = 30;
/** How long a link of each purpose stays usable, in minutes. */
export const TOKEN_LIFETIME_MINUTES: Record<PasswordTokenPurpose, number> = { reset: TOKEN_MINUTES, set: 7 * 24 * 60 };

function secret(): string {
  const s = process.env.NEXTAUTH_SECRET;
  if (!s) throw new Error("NEXTAUTH_SECRET is not set (npm start and npm test set it).");
  return s;
}

function sign(id: string): string {
  return crypto.createHmac("sha256", secret()).update(`password-token:${id}`).digest("base64url");
}

/** The row id inside a well-formed, correctly signed token; null otherwise. */
export function verifyToken(token: string): string | null {
  const m = /^([0-9a-f-]{36})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!m) return null;
  const expected = Buffer.from(sign(m[1]));
  const given = Buffer.from(m[2]);
  return given.length === expected.length && crypto.timingSafeEqual(given, expected) ? m[1] : null;
}

export async function issuePasswordToken(trx: Db, userId: string, purpose: PasswordTokenPurpose, now = new Date()) {
  const id = await insertPasswordToken(trx, userId, purpose, new Date(now.getTime() + TOKEN_LIFETIME_MINUTES[purpose] * 60_000));
  return { id, token: `${id}.${sign(id)}` };
}

/** Issues a token and queues its message in `trx` (the same queue as every other message). */
export async function queuePasswordMail(
  trx: Transaction<Database>,
  user: { id: string; email: string; name: string },
  purpose: PasswordTokenPurpose,
  now = new Date(),
) {
  const { id, token } = await issuePasswordToken(trx, user.id, purpose, now);
  await queueMail(trx, {
    key: `password:${id}`,
    kind: purpose === "reset" ? "password_reset" : "password_set",
    to: user.email,
    data: { purpose, name: user.name, tokenPath: `/reset-password/${token}`, minutes: TOKEN_LIFETIME_MINUTES[purpose] },
  });
  return { id, token };
}

/** Whether a token can still be used (for the page that shows the form). */
export async function checkToken(db: Kysely<Database>, token: string, now = new Date()) {
  const id = verifyToken(token);
  return id ? ((await findUsableToken(db, id, now)) ?? null) : null;
}

/** Uses the token once: returns its user, and retires every other open token of that user. */
export async function consumeToken(trx: Transaction<Database>, token: string, now = new Date()) {
  const id = verifyToken(token);
  if (!id) return null;
  const used = await spendToken(trx, id, now);
  if (!used) return null;
  await retireTokens(trx, used.userId, now);
  return used;
}
