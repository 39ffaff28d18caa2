// One-time password tokens (reset, or a first password). A token is used by one atomic update, so two
// uses of one link cannot both succeed.
import type { Db, PasswordTokenPurpose } from "../types";

export async function insertPasswordToken(db: Db, userId: string, purpose: PasswordTokenPurpose, expiresAt: Date): Promise<string> {
  const row = await db.insertInto("password_tokens").values({ user_id: userId, purpose, expires_at: expiresAt }).returning("id").executeTakeFirstOrThrow();
  return row.id;
}

/** The token if it is unused and not expired at `now`. */
export async function findUsableToken(db: Db, id: string, now: Date) {
  return db
    .selectFrom("password_tokens")
    .select(["id", "user_id as userId", "purpose", "expires_at as expiresAt"])
    .where("id", "=", id)
    .where("used_at", "is", null)
    .where("expires_at", ">", now)
    .executeTakeFirst();
}

/** Marks the token used if it is still usable at `now`; returns its user, or nothing. */
export async function spendToken(db: Db, id: string, now: Date) {
  return db
    .updateTable("password_tokens")
    .set({ used_at: now })
    .where("id", "=", id)
    .where("used_at", "is", null)
    .where("expires_at", ">", now)
    .returning(["user_id as userId", "purpose"])
    .executeTakeFirst();
}

/** Every other open token of the user stops working once one is used. */
export async function retireTokens(db: Db, userId: string, now: Date) {
  await db.updateTable("password_tokens").set({ used_at: now }).where("user_id", "=", userId).where("used_at", "is", null).execute();
}

