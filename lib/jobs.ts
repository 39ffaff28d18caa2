// Background jobs on pg-boss (same PostgreSQL). The web server starts the workers once, from
// instrumentation.ts; handlers are idempotent so a retried job does no harm.
import PgBoss from "pg-boss";

export const QUEUES = { regrade: "lab-regrade", mail: "mail-send" } as const;

const g = globalThis as unknown as { shuntwiseBoss?: Promise<PgBoss> };

export function boss(): Promise<PgBoss> {
  g.shuntwiseBoss ??= (async () => {
    const b = new PgBoss({ connectionString: process.env.DATABASE_URL, schema: "pgboss", max: 3 });
    b.on("error", (e) => console.error("job queue error", e));
    await b.start();
    for (const q of Object.values(QUEUES)) await b.createQueue(q);
    return b;
  })();
  return g.shuntwiseBoss;
}

export async function enqueue(queue: string, data: object, opts: PgBoss.SendOptions = {}): Promise<string | null> {
  return (await boss()).send(queue, data, { retryLimit: 3, retryDelay: 5, ...opts });
}
