// A database that goes away answers 503 with Retry-After, not 500: the errors PostgreSQL and the driver
// really raise (a server refusing connections, a backend terminated by the administrator as at a
// shutdown) go through the route wrapper's errorResponse. A query error stays a 500.
import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import { createDb, db } from "@/db";
import { errorResponse } from "@/lib/http/route";
import { freePort } from "../support/mail";

async function failureOf(p: Promise<unknown>): Promise<unknown> {
  return p.then(
    () => {
      throw new Error("expected the query to fail");
    },
    (e) => e,
  );
}

async function expect503(e: unknown) {
  const res = errorResponse(e);
  expect(res.status).toBe(503);
  expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
  const body = await res.json();
  expect(body.error.code).toBe("service_unavailable");
  expect(body.error.message).toMatch(/try again/i);
}

describe("the database out of reach", () => {
  it("no server listening (ECONNREFUSED) is a 503 with Retry-After", async () => {
    const url = new URL(process.env.DATABASE_URL!);
    url.port = String(await freePort());
    const gone = createDb(url.toString(), 1);
    try {
      await expect503(await failureOf(sql`select 1`.execute(gone)));
    } finally {
      await gone.destroy();
    }
  });

  it("a connection terminated by the server (57P01, as at a fast shutdown) is a 503 with Retry-After", async () => {
    const victim = createDb(process.env.DATABASE_URL!, 1);
    try {
      const pid = (await sql<{ pid: number }>`select pg_backend_pid() as pid`.execute(victim)).rows[0].pid;
      const running = failureOf(sql`select pg_sleep(30)`.execute(victim));
      // wait until the sleep is running, then end that backend as pg_ctl stop -m fast does
      for (let i = 0; i < 200; i++) {
        const r = await sql<{ n: number }>`select count(*)::int as n from pg_stat_activity where pid = ${pid} and query like '%pg_sleep%'`.execute(db);
        if (r.rows[0].n > 0) break;
        await new Promise((r) => setTimeout(r, 50));
      }
      await sql`select pg_terminate_backend(${pid})`.execute(db);
      const e = await running;
      expect((e as { code?: string }).code).toBe("57P01");
      await expect503(e);
    } finally {
      await victim.destroy();
    }
  });

  it("a query error is still a 500", async () => {
    const e = await failureOf(sql`select * from no_such_table`.execute(db));
    expect(errorResponse(e).status).toBe(500);
  });
});
