// Background jobs on pg-boss (same PostgreSQL). The web server starts the workers from
// instrumentation.ts (retrying until the database answers); handlers are idempotent so a retried job
// does no harm.
import { CompiledQuery, type Transaction } from "kysely";
import PgBoss from "pg-boss";
import { connectionLost } from "@/db/pool";
import type { Database } from "@/db/types";
import { isDatabaseUnavailable } from "@/lib/errors";

export const QUEUES = { regrade: "lab-regrade", mail: "mail-send", uploadSweep: "uploads-sweep", draws: "lab-draws", uploadAnalysis: "upload-analysis" } as const;

const g = globalThis as unknown as { shuntwiseBoss?: Promise<PgBoss> };

/**
 * The process's one pg-boss, on DATABASE_URL (a script that seeds another database names it on first
 * use). A start that fails is not kept: the next call tries again.
 */
export function boss(connectionString = process.env.DATABASE_URL): Promise<PgBoss> {
  if (g.shuntwiseBoss) return g.shuntwiseBoss;
  const starting = (async () => {
    const b = new PgBoss({ connectionString, schema: "pgboss", max: 3 });
    // its pool and workers report a database outage as the app's pools do: once, in one line
    b.on("error", (e) => (isDatabaseUnavailable(e) ? connectionLost(e) : console.error("job queue error", e)));
    try {
      await b.start();
      for (const q of Object.values(QUEUES)) await b.createQueue(q);
    } catch (e) {
      await b.stop({ graceful: false, wait: false }).catch(() => {});
      throw e;
    }
    return b;
  })();
  g.shuntwiseBoss = starting;
  starting.catch(() => {
    if (g.shuntwiseBoss === starting) g.shuntwiseBoss = undefined;
  });
  return starting;
}

/** Stops the process's pg-boss (scripts, tests); the next boss() starts a new one. */
export async function stopBoss(): Promise<void> {
  const b = g.shuntwiseBoss;
  g.shuntwiseBoss = undefined;
  if (b) await (await b.catch(() => null))?.stop({ graceful: false, wait: true });
}

/** pg-boss runs its SQL through the caller's transaction (its `db` option): the job exists only if the transaction commits. */
export function bossDb(trx: Transaction<Database>): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[]) {
      const r = await trx.executeQuery(CompiledQuery.raw(text, values));
      return { rows: r.rows as unknown[] };
    },
  };
}

/** Sends a job, inside `opts.trx` when given. Throws when the queue refused it. */
export async function enqueue(queue: string, data: object, opts: PgBoss.SendOptions & { trx?: Transaction<Database> } = {}): Promise<string> {
  const { trx, ...send } = opts;
  const id = await (await boss()).send(queue, data, { retryLimit: 3, retryDelay: 5, ...send, ...(trx ? { db: bossDb(trx) } : {}) });
  if (!id) throw new Error(`the job queue "${queue}" did not accept the job`);
  return id;
}

/**
 * Calls `start` until it succeeds, waiting `delayMs` (doubling up to a minute) between tries, so
 * a database that is not up yet at boot only delays the workers. Resolves once started.
 */
export async function keepTrying(start: () => Promise<void>, opts: { delayMs?: number; maxDelayMs?: number; what?: string } = {}): Promise<void> {
  let delay = opts.delayMs ?? 2000;
  for (let attempt = 1; ; attempt++) {
    try {
      await start();
      if (attempt > 1) console.log(`${opts.what ?? "job workers"} started on try ${attempt}`);
      return;
    } catch (e) {
      console.error(`could not start the ${opts.what ?? "job workers"} (try ${attempt}); trying again in ${Math.round(delay / 1000)} s:`, e instanceof Error ? e.message : e);
      await new Promise((r) => setTimeout(r, delay));
      delay = Math.min(delay * 2, opts.maxDelayMs ?? 60_000);
    }
  }
}
