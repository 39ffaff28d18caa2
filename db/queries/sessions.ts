// Server-side sessions: one row per signed-in browser. The cookie carries the row's id; a session is
// valid while its row exists, its user is not disabled, it was seen within the idle limit and created
// within the absolute limit. Signing out deletes the row.
import { type Kysely, sql, type Transaction } from "kysely";
import type { Database } from "../types";
import type { PublicUser } from "./users";

type Db = Kysely<Database> | Transaction<Database>;

export interface SessionLimits {
  idleSeconds: number;
  absoluteSeconds: number;
}

/** A new session for the user; their sessions already past a limit are removed at the same time. */
export async function createSession(db: Db, userId: string, userAgent: string | null, limits: SessionLimits): Promise<string> {
  const row = await db
    .with("expired", (q) =>
      q
        .deleteFrom("sessions")
        .where("user_id", "=", userId)
        .where((eb) =>
          eb.or([
            eb("last_seen_at", "<=", sql<Date>`now() - make_interval(secs => ${limits.idleSeconds})`),
            eb("created_at", "<=", sql<Date>`now() - make_interval(secs => ${limits.absoluteSeconds})`),
          ]),
        ),
    )
    .insertInto("sessions")
    .values({ user_id: userId, user_agent: userAgent })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/**
 * The user a session names, in one statement: null when the session is gone, past a limit, or its user
 * disabled. The same statement notes the session as seen (at most once a minute, so a burst of requests
 * writes once), which is what the idle limit counts from.
 */
export async function findSessionUser(db: Db, sessionId: string, userId: string, limits: SessionLimits): Promise<PublicUser | undefined> {
  const alive = (s: string) =>
    sql`${sql.ref(`${s}.id`)} = ${sessionId} and ${sql.ref(`${s}.user_id`)} = ${userId}
      and ${sql.ref(`${s}.last_seen_at`)} > now() - make_interval(secs => ${limits.idleSeconds})
      and ${sql.ref(`${s}.created_at`)} > now() - make_interval(secs => ${limits.absoluteSeconds})`;
  const r = await sql<PublicUser>`
    with seen as (
      update sessions t set last_seen_at = now()
      where ${alive("t")} and t.last_seen_at < now() - interval '1 minute'
      returning t.id
    )
    select u.id, u.email, u.name, u.is_admin as "isAdmin"
    from sessions s join users u on u.id = s.user_id
    where ${alive("s")} and u.disabled_at is null`.execute(db);
  return r.rows[0];
}

export interface SessionRow {
  id: string;
  createdAt: Date;
  lastSeenAt: Date;
  userAgent: string | null;
}

/** The user's sessions that are still valid, the most recently seen first. */
export async function listSessions(db: Db, userId: string, limits: SessionLimits): Promise<SessionRow[]> {
  return db
    .selectFrom("sessions")
    .select(["id", "created_at as createdAt", "last_seen_at as lastSeenAt", "user_agent as userAgent"])
    .where("user_id", "=", userId)
    .where("last_seen_at", ">", sql<Date>`now() - make_interval(secs => ${limits.idleSeconds})`)
    .where("created_at", ">", sql<Date>`now() - make_interval(secs => ${limits.absoluteSeconds})`)
    .orderBy("last_seen_at", "desc")
    .execute();
}

/** Ends one session of the user; false when they have no such session. */
export async function deleteSession(db: Db, userId: string, sessionId: string): Promise<boolean> {
  const r = await db.deleteFrom("sessions").where("id", "=", sessionId).where("user_id", "=", userId).executeTakeFirst();
  return Number(r.numDeletedRows) > 0;
}

/** Ends every session of the user (all devices), or every one but `except`. */
export async function deleteSessionsOf(db: Db, userId: string, except?: string): Promise<number> {
  let q = db.deleteFrom("sessions").where("user_id", "=", userId);
  if (except) q = q.where("id", "<>", except);
  const r = await q.executeTakeFirst();
  return Number(r.numDeletedRows);
}
