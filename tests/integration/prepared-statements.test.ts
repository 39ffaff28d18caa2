// The app's queries go out as named prepared statements (db/pool.ts): PostgreSQL parses each once per
// connection. A statement that fails inside a transaction must still undo the whole transaction and leave
// the connection usable for the same statements, and the names a connection holds stay bounded.
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { createDb } from "@/db";
import { NAMED_STATEMENTS_MAX } from "@/db/pool";
import { uniqueEmail } from "../support/db";

// one connection, so every statement below runs on the same backend
const one = createDb(process.env.DATABASE_URL!, 1);
afterAll(() => one.destroy());

async function preparedOnConnection(): Promise<number> {
  const r = await sql<{ n: number }>`select count(*)::int as n from pg_prepared_statements where ${true}`.execute(one);
  return r.rows[0].n;
}

describe("named prepared statements", () => {
  it("a statement that fails inside a transaction undoes it all, and the same statements then commit", async () => {
    const taken = uniqueEmail("prepared-taken");
    const user = await one.insertInto("users").values({ email: taken, name: "First name", password_hash: null }).returning("id").executeTakeFirstOrThrow();
    const attempt = (email: string) =>
      one.transaction().execute(async (tx) => {
        await tx.updateTable("users").set({ name: "Changed name" }).where("id", "=", user.id).execute();
        await tx.insertInto("users").values({ email, name: "Second", password_hash: null }).execute();
      });

    await expect(attempt(taken)).rejects.toMatchObject({ code: "23505" });
    const after = await one.selectFrom("users").select("name").where("id", "=", user.id).executeTakeFirstOrThrow();
    expect(after.name).toBe("First name");
    expect(await preparedOnConnection()).toBeGreaterThan(0);

    const fresh = uniqueEmail("prepared-fresh");
    await attempt(fresh);
    const rows = await one.selectFrom("users").select(["email", "name"]).where("email", "in", [taken, fresh]).orderBy("name").execute();
    expect(rows).toEqual([
      { email: taken, name: "Changed name" },
      { email: fresh, name: "Second" },
    ]);
  });

  it("more distinct statements than get names all run, and the connection holds at most the bound", async () => {
    const texts = NAMED_STATEMENTS_MAX + 50;
    for (let k = 0; k < texts; k++) {
      const r = await sql<{ n: number }>`select ${k}::int * 2 + ${sql.raw(String(k))} as n`.execute(one);
      expect(r.rows[0].n).toBe(3 * k);
    }
    const held = await preparedOnConnection();
    expect(held).toBeGreaterThan(0);
    expect(held).toBeLessThanOrEqual(NAMED_STATEMENTS_MAX);
  });
});
