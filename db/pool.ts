// The PostgreSQL connection pools of the app (the Kysely instance, the throttle store). When the
// database stops or restarts, every open connection reports an error: an idle one through the pool, one
// in use through its client, where an error nobody listens to would be an uncaught exception with a
// stack. Both are heard here, and an outage is logged once, in one line, until a connection opens again.
import pg from "pg";

const g = globalThis as unknown as { shuntwiseDatabaseLost?: boolean };

/** Logs the loss of the database connection once per outage (pg-boss's errors of the same kind come here too). */
export function connectionLost(e: { message?: unknown }): void {
  if (g.shuntwiseDatabaseLost) return;
  g.shuntwiseDatabaseLost = true;
  console.warn(`PostgreSQL connection lost (${String(e.message)}): requests answer 503 until it is back; connections reopen by themselves.`);
}

export function newPool(connectionString: string | undefined, max: number): pg.Pool {
  const pool = new pg.Pool({ connectionString, max });
  pool.on("error", connectionLost); // an idle connection closed by the server; the pool replaces it
  pool.on("connect", (client) => {
    g.shuntwiseDatabaseLost = false;
    client.on("error", connectionLost); // a connection in use: its query fails (503), the process stays up
  });
  return pool;
}
