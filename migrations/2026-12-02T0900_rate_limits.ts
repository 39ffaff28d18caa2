// Counters of the throttles (lib/security/throttle.ts), in the layout rate-limiter-flexible's PostgreSQL
// store uses; created here rather than by the library at run time, so the app never runs DDL.
import { type Kysely, sql } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table rate_limits (key varchar(255) primary key, points integer not null default 0, expire bigint)`.execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("rate_limits").execute();
}
