// Background jobs on pg-boss (same PostgreSQL). The web server starts the workers once, from
// instrumentation.ts; handlers are idempotent so a retried job does no harm.
import PgBoss from "pg-boss";

export const QUEUES = { regrade: "lab-regrade", mail: "mail-send" } as const;

const g = globalThis as unknown as { shuntwiseBoss?: Promise<PgBoss> };

/** The process's one pg-boss, on DATABASE_URL (a script that seeds another database names it on first use). */
export function boss(connectionString = process.env.DATABASE_URL): Promise<PgBoss> {
  g.shuntwiseBoss ??= (async () => {
    const b = new PgBoss({ connectionString, schema: "pgboss", max: 3 });
    b.on("error", (e) => console.error("job queue error", e));
    await b.start();
    for (const q of Object.values(QUEUES)) await b.createQueue(q);
    return b;
  })();
  return g.shuntwiseBoss;
}

/** Stops the process's pg-boss (scripts, tests); the next boss() starts a new one. */
export async function stopBoss(): Promise<void> {
  const b = g.shuntwiseBoss;
  g.shuntwiseBoss = undefined;
  if (b) await (await b).stop({ graceful: false, wait: true });
}

export async function enqueue(queue: string, data: object, opts: PgBoss.SendOptions = {}): Promise<string | null> {
  return (await boss()).send(queue, data, { retryLimit: 3, retryDelay: 5, ...opts });
}
