// Users. Password hashes are read only by `findCredentials`, which the sign-in check alone uses.
import { type Kysely, sql, type Transaction } from "kysely";
import type { Database } from "../types";

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

type Db = Kysely<Database>;

/** The user a session cookie names, with the time before which their sessions are void (null: all valid). */
export async function findSessionUser(db: Db, id: string): Promise<(PublicUser & { sessionsValidAfter: Date | null }) | undefined> {
  return db
    .selectFrom("users")
    .select(["id", "email", "name", "is_admin as isAdmin", "sessions_valid_after as sessionsValidAfter"])
    .where("id", "=", id)
    .executeTakeFirst();
}

export async function findUserByEmail(db: Db, email: string): Promise<PublicUser | undefined> {
  return db
    .selectFrom("users")
    .select(["id", "email", "name", "is_admin as isAdmin"])
    .where(sql`lower(email)`, "=", email.toLowerCase())
    .executeTakeFirst();
}

export async function findCredentials(db: Db, email: string) {
  return db
    .selectFrom("users")
    .select(["id", "password_hash as passwordHash"])
    .where(sql`lower(email)`, "=", email.toLowerCase())
    .executeTakeFirst();
}

export async function insertUser(
  db: Db,
  user: { email: string; name: string; passwordHash: string | null; isAdmin?: boolean },
): Promise<PublicUser> {
  return db
    .insertInto("users")
    .values({
      email: user.email.toLowerCase(),
      name: user.name,
      password_hash: user.passwordHash,
      is_admin: user.isAdmin ?? false,
    })
    .returning(["id", "email", "name", "is_admin as isAdmin"])
    .executeTakeFirstOrThrow();
}

/** Ends every session of the user signed in until `at` (sign out on every device). */
export async function revokeSessions(db: Db, userId: string, at = new Date()): Promise<Date> {
  await db.updateTable("users").set({ sessions_valid_after: at }).where("id", "=", userId).execute();
  return at;
}

/** The graded-e-mail preference and other settings a user changes on their settings page. */
export async function findPreferences(db: Db, id: string) {
  return db.selectFrom("users").select(["grade_mail as gradeMail"]).where("id", "=", id).executeTakeFirst();
}

export async function setGradeMail(db: Db, id: string, gradeMail: boolean) {
  await db.updateTable("users").set({ grade_mail: gradeMail }).where("id", "=", id).execute();
}

/** A new password; with `signOutOthers`, every session signed in before now becomes void. */
export async function setPassword(db: Db | Transaction<Database>, id: string, passwordHash: string, opts: { signOutBefore?: Date } = {}) {
  await db
    .updateTable("users")
    .set({ password_hash: passwordHash, ...(opts.signOutBefore ? { sessions_valid_after: opts.signOutBefore } : {}) })
    .where("id", "=", id)
    .execute();
}
