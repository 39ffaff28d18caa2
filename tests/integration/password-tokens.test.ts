// Password links: signed, single-use, 30 minutes.
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { checkToken, consumeToken, issuePasswordToken, TOKEN_MINUTES } from "@/lib/mail/tokens";

process.env.NEXTAUTH_SECRET ??= "integration-test-secret";

async function user() {
  return db.insertInto("users").values({ email: "rowan.pike@test.example", name: "Rowan Pike", password_hash: null }).returning("id").executeTakeFirstOrThrow();
}

describe("password tokens", () => {
  it("work once", async () => {
    const u = await user();
    const { token } = await issuePasswordToken(db, u.id, "reset");
    expect(await checkToken(db, token)).not.toBeNull();
    const used = await db.transaction().execute((trx) => consumeToken(trx, token));
    expect(used?.userId).toBe(u.id);
    expect(await db.transaction().execute((trx) => consumeToken(trx, token))).toBeNull();
    expect(await checkToken(db, token)).toBeNull();
  });

  it("expire after 30 minutes", async () => {
    const u = await user();
    const issued = new Date("2026-12-02T08:00:00Z");
    const { token } = await issuePasswordToken(db, u.id, "reset", issued);
    expect(TOKEN_MINUTES).toBe(30); // the issue's stated lifetime
    const at = (min: number) => new Date(issued.getTime() + min * 60_000);
    expect(await checkToken(db, token, at(29))).not.toBeNull();
    expect(await db.transaction().execute((trx) => consumeToken(trx, token, at(30.5)))).toBeNull();
    expect(await db.transaction().execute((trx) => consumeToken(trx, token, at(29.5)))).not.toBeNull();
  });

  it("an invitation to choose a first password stays usable for seven days", async () => {
    const u = await user();
    const issued = new Date("2026-12-02T08:00:00Z");
    const { token } = await issuePasswordToken(db, u.id, "set", issued);
    const at = (days: number) => new Date(issued.getTime() + days * 24 * 3600_000);
    expect(await checkToken(db, token, at(6.9))).not.toBeNull();
    expect(await checkToken(db, token, at(7.1))).toBeNull();
  });

  it("refuse an altered or unsigned token", async () => {
    const u = await user();
    const { id, token } = await issuePasswordToken(db, u.id, "reset");
    const flipped = token.slice(0, -1) + (token.endsWith("A") ? "B" : "A");
    expect(await db.transaction().execute((trx) => consumeToken(trx, flipped))).toBeNull();
    expect(await db.transaction().execute((trx) => consumeToken(trx, `${id}.${"x".repeat(43)}`))).toBeNull();
    expect(await db.transaction().execute((trx) => consumeToken(trx, "not-a-token"))).toBeNull();
    expect(await db.transaction().execute((trx) => consumeToken(trx, token))).not.toBeNull();
  });

  it("using one link retires the user's other open links", async () => {
    const u = await user();
    const a = await issuePasswordToken(db, u.id, "reset");
    const b = await issuePasswordToken(db, u.id, "reset");
    expect(await db.transaction().execute((trx) => consumeToken(trx, b.token))).not.toBeNull();
    expect(await checkToken(db, a.token)).toBeNull();
  });
});
