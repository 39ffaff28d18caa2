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
    .select(["id", "password_hash as passwordHash", "disabled_at as disabledAt"])
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

/** The graded-e-mail preference and other settings a user changes on their settings page. */
export async function findPreferences(db: Db, id: string) {
  return db.selectFrom("users").select(["grade_mail as gradeMail"]).where("id", "=", id).executeTakeFirst();
}

export async function setGradeMail(db: Db, id: string, gradeMail: boolean) {
  await db.updateTable("users").set({ grade_mail: gradeMail }).where("id", "=", id).execute();
}

/** A new password. (The caller ends the sessions it should: db/queries/sessions.ts.) */
export async function setPassword(db: Db | Transaction<Database>, id: string, passwordHash: string) {
  await db.updateTable("users").set({ password_hash: passwordHash }).where("id", "=", id).execute();
}

export interface AdminUserRow {
  id: string;
  name: string;
  email: string;
  isAdmin: boolean;
  disabled: boolean;
  courses: { id: string; code: string; role: string }[];
}

/** Accounts whose name or e-mail contains `query` (case does not matter), by name, at most `limit`. */
export async function searchUsers(db: Db, query: string, limit = 50): Promise<AdminUserRow[]> {
  const like = `%${query.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  return db
    .selectFrom("users as u")
    .select((eb) => [
      "u.id",
      "u.name",
      "u.email",
      "u.is_admin as isAdmin",
      sql<boolean>`u.disabled_at is not null`.as("disabled"),
      eb
        .selectFrom("memberships as m")
        .innerJoin("courses as c", "c.id", "m.course_id")
        .select(sql<AdminUserRow["courses"]>`coalesce(json_agg(json_build_object('id', c.id, 'code', c.code, 'role', m.role) order by c.code), '[]'::json)`.as("courses"))
        .whereRef("m.user_id", "=", "u.id")
        .as("courses"),
    ])
    .where((eb) => eb.or([eb(sql`lower(u.name)`, "like", like), eb(sql`lower(u.email)`, "like", like)]))
    .orderBy("u.name")
    .orderBy("u.email")
    .limit(limit)
    .execute() as Promise<AdminUserRow[]>;
}

/** Disables (now) or enables an account; undefined when there is no such account. */
export async function setDisabled(db: Db | Transaction<Database>, id: string, disabled: boolean): Promise<{ id: string; disabled: boolean } | undefined> {
  const row = await db
    .updateTable("users")
    .set({ disabled_at: disabled ? sql<Date>`coalesce(disabled_at, now())` : null })
    .where("id", "=", id)
    .returning(["id", sql<boolean>`disabled_at is not null`.as("disabled")])
    .executeTakeFirst();
  return row;
}
