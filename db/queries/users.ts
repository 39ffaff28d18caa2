// Users. Password hashes are read only by `findCredentials`, which the sign-in check alone uses.
import { type Kysely, sql } from "kysely";
import type { Database } from "../types";

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

type Db = Kysely<Database>;

export async function findUserById(db: Db, id: string): Promise<PublicUser | undefined> {
  return db
    .selectFrom("users")
    .select(["id", "email", "name", "is_admin as isAdmin"])
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
