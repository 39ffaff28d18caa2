// Password reset by e-mail against the test server: the same answer for any address, a link that works
// once and not after 30 minutes, and every other session signed out once the new password is chosen.
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/scripts/seed/demo";
import { issuePasswordToken } from "@/lib/mail/tokens";
import { e2eDb } from "../support/db";
import { Client } from "../support/http";
import { clientFor, courseWithPeople, PASSWORD } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let admin: Client;

beforeAll(async () => {
  f = await courseWithPeople();
  admin = new Client();
  expect(await admin.signIn("admin@larkmoor-tech.example", DEMO_PASSWORD)).toBe(true);
});

async function resetLinkFor(to: string): Promise<string> {
  const end = Date.now() + 30_000;
  for (;;) {
    const r = await admin.json(`/api/dev/mail?to=${encodeURIComponent(to)}`);
    const m = (r.body.messages as { text: string }[]).map((x) => /https?:\/\/\S+\/reset-password\/[^\s"<>]+/.exec(x.text)?.[0]).find(Boolean);
    if (m) return new URL(m).pathname;
    if (Date.now() > end) throw new Error(`no reset message for ${to}`);
    await new Promise((res) => setTimeout(res, 500));
  }
}

describe("password reset by e-mail", () => {
  it("answers the same for a known and an unknown address, and names a malformed one", async () => {
    const anon = new Client();
    const known = await anon.post("/api/password-reset", { email: f.people.ta.email });
    const unknown = await anon.post("/api/password-reset", { email: `nobody.${Date.now()}@test.example` });
    expect(known.status).toBe(200);
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    const bad = await anon.post("/api/password-reset", { email: "not an address" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("email");
  });

  it("the e-mailed link works once, sets the password and signs out every other session", async () => {
    const email = f.people.student.email;
    const other = await clientFor(email); // a session open elsewhere
    expect((await other.json("/api/courses")).status).toBe(200);

    const anon = new Client();
    expect((await anon.post("/api/password-reset", { email })).status).toBe(200);
    const path = await resetLinkFor(email);
    const page = await anon.fetch(path);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Choose a new password");
    const token = decodeURIComponent(path.split("/").pop()!);

    const newPassword = "a new bench password";
    const mismatch = await anon.post("/api/password-reset/confirm", { token, password: newPassword, confirm: "something else" });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.fields).toHaveProperty("confirm");
    const ok = await anon.post("/api/password-reset/confirm", { token, password: newPassword, confirm: newPassword });
    expect(ok.status).toBe(200);

    expect((await other.json("/api/courses")).status).toBe(401);
    expect(await new Client().signIn(email, PASSWORD)).toBe(false);
    const fresh = new Client();
    expect(await fresh.signIn(email, newPassword)).toBe(true);
    expect((await fresh.json("/api/courses")).status).toBe(200);

    const again = await anon.post("/api/password-reset/confirm", { token, password: "yet another password", confirm: "yet another password" });
    expect(again.status).toBe(400);
    expect(again.body.error.fields).toHaveProperty("token");
    expect(await (await anon.fetch(path)).text()).toContain("This link no longer works");
  });

  it("refuses a link older than 30 minutes", async () => {
    const db = e2eDb();
    let token: string;
    try {
      const u = await db.selectFrom("users").select("id").where("email", "=", f.people.ta.email).executeTakeFirstOrThrow();
      token = (await issuePasswordToken(db, u.id, "reset", new Date(Date.now() - 31 * 60_000))).token;
    } finally {
      await db.destroy();
    }
    const r = await new Client().post("/api/password-reset/confirm", { token, password: "late password 123", confirm: "late password 123" });
    expect(r.status).toBe(400);
    expect(r.body.error.fields).toHaveProperty("token");
    expect(await clientFor(f.people.ta.email)).toBeInstanceOf(Client); // the old password still works
  });
});

describe("settings", () => {
  it("a signed-in user turns graded e-mails off and on; bad input names the field", async () => {
    const c = await clientFor(f.people.instructor.email);
    expect((await new Client().json("/api/me/preferences")).status).toBe(401);
    expect((await c.json("/api/me/preferences")).body).toEqual({ preferences: { gradeMail: true } });
    const off = await c.json("/api/me/preferences", { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ gradeMail: false }) });
    expect(off.body).toEqual({ preferences: { gradeMail: false } });
    expect((await c.json("/api/me/preferences")).body).toEqual({ preferences: { gradeMail: false } });
    const bad = await c.json("/api/me/preferences", { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ gradeMail: "no" }) });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("gradeMail");
  });

  it("changing the password needs the current one", async () => {
    const c = await clientFor(f.people.outsider.email);
    const wrong = await c.post("/api/me/password", { currentPassword: "not it at all", newPassword: "outsider password 2", confirm: "outsider password 2" });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty("currentPassword");
    const ok = await c.post("/api/me/password", { currentPassword: PASSWORD, newPassword: "outsider password 2", confirm: "outsider password 2" });
    expect(ok.status).toBe(200);
    expect(await new Client().signIn(f.people.outsider.email, "outsider password 2")).toBe(true);
  });
});
