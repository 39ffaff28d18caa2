// The PostgreSQL connection pools of the app (the Kysely instance, the throttle store). When the
// database stops or restarts, every open connection reports an error: an idle one through the pool, one
// in use through its client, where an error nobody listens to would be an uncaught exception with a
// stack. Both are heard here, and an outage is logged once, in one line, until a connection opens again.
import { createHash } from "node:crypto";
import type { PostgresPool, PostgresPoolClient } from "kysely";
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

/** Statement texts that get a name; the rest go out unnamed, so each connection's backend keeps at most this many. */
export const NAMED_STATEMENTS_MAX = 200;

/**
 * The pool as Kysely sees it, with named prepared statements: a statement with parameters goes out under
 * a name derived from its text, so PostgreSQL parses it once per connection (and, after a few runs, plans
 * it once) instead of on every call. Statements without parameters (transaction commands, migrations'
 * multi-statement scripts) go out as before, over the simple protocol. Only the first
 * NAMED_STATEMENTS_MAX distinct texts get names (lists of variable length make new texts), so the memory
 * each backend and each client spends on them stays bounded.
 *
 * A statement that fails behaves as before: node-postgres remembers a name only after PostgreSQL has
 * parsed it, and an error inside a transaction aborts that transaction as any error does. It is safe
 * with migrations: they run before the app starts (npm start, the test runner), so no statement the app
 * prepared outlives a schema change; and should one run later, PostgreSQL re-plans a prepared statement
 * after DDL on the tables it uses (a column added under a `select *` included).
 */
export function withNamedStatements(pool: pg.Pool): PostgresPool {
  const names = new Map<string, string>();
  const nameOf = (text: string): string | undefined => {
    let name = names.get(text);
    if (name === undefined && names.size < NAMED_STATEMENTS_MAX) {
      name = `k_${createHash("sha1").update(text).digest("hex")}`;
      names.set(text, name);
    }
    return name;
  };
  // one wrapper per connection: Kysely keeps its own state per client object
  const wrappers = new WeakMap<pg.PoolClient, PostgresPoolClient>();
  const wrap = (client: pg.PoolClient): PostgresPoolClient => {
    function query(textOrCursor: unknown, values?: unknown[]): unknown {
      if (typeof textOrCursor === "string" && values && values.length > 0) {
        const name = nameOf(textOrCursor);
        if (name) return client.query({ name, text: textOrCursor, values });
      }
      return (client.query as (a: unknown, b?: unknown) => unknown)(textOrCursor, values);
    }
    return { query: query as PostgresPoolClient["query"], release: (destroy?: boolean) => client.release(destroy) };
  };
  return {
    connect: async () => {
      const client = await pool.connect();
      let wrapper = wrappers.get(client);
      if (!wrapper) wrappers.set(client, (wrapper = wrap(client)));
      return wrapper;
    },
    end: () => pool.end(),
  };
}
