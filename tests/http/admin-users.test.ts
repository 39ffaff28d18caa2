// The site admin's accounts: search by name or e-mail, disable (sessions end at once, sign-in refused
// with a message to contact the course staff) and enable again. Sent as an attacker would: copied
// cookies, the right and a wrong password, the admin's own account.
import { describe, expect, it } from "vitest";
import { Client, baseURL } from "../support/http";
import { addPerson, clientFor, courseWithPeople, PASSWORD } from "./fixtures";

async function signInAnswer(email: string, password: string): Promise<{ status: number; url: string; cookie: boolean }> {
  const c = new Client();
  const csrf = await c.json("/api/auth/csrf");
  const form = new URLSearchParams({ csrfToken: csrf.body.csrfToken, email, password, json: "true" });
  const res = await c.fetch("/api/auth/callback/credentials", { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded", origin: baseURL }, body: form.toString() });
  const body = await res.json().catch(() => ({}));
  return { status: res.status, url: String(body.url ?? res.headers.get("location") ?? ""), cookie: res.headers.getSetCookie().some((c) => /session-token=[^;]/.test(c)) };
}

describe("site admin: accounts", () => {
  it("finds accounts by part of a name or e-mail, with their courses and roles", async () => {
    const f = await courseWithPeople();
    const admin = await clientFor((await addPerson("accounts-admin", { isAdmin: true })).email);
    const byEmail = await admin.json(`/api/admin/users?query=${encodeURIComponent(f.people.ta.email.slice(0, 20).toUpperCase())}`);
    expect(byEmail.status).toBe(200);
    const ta = byEmail.body.users.find((u: { id: string }) => u.id === f.people.ta.id);
    expect(ta).toEqual({ id: f.people.ta.id, name: "Fixture ta", email: f.people.ta.email, isAdmin: false, disabled: false, courses: [{ id: f.courseId, code: expect.any(String), role: "ta" }] });
    // a pattern character is text, not a wildcard
    expect((await admin.json("/api/admin/users?query=%25%25%25nobody")).body.users).toEqual([]);
    expect((await admin.json(`/api/admin/users?query=${"x".repeat(201)}`)).status).toBe(400);
  });

  it("a disabled account is signed out everywhere at once and told to contact the course staff; enabled again, it signs in", async () => {
    const f = await courseWithPeople();
    const admin = await clientFor((await addPerson("accounts-admin", { isAdmin: true })).email);
    const email = f.people.student.email;
    const laptop = await clientFor(email);
    const copied = laptop.copy();
    const off = await admin.json(`/api/admin/users/${f.people.student.id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ disabled: true }) });
    expect(off.status).toBe(200);
    expect(off.body).toEqual({ user: { id: f.people.student.id, disabled: true } });
    for (const c of [laptop, copied]) expect((await c.json("/api/courses")).status).toBe(401);

    // the right password: refused with the reason the sign-in page words; no session
    const right = await signInAnswer(email, PASSWORD);
    expect(right.cookie).toBe(false);
    expect(new URL(right.url, baseURL).searchParams.get("error")).toBe("AccountDisabled");
    // a wrong password learns nothing about the account
    const wrong = await signInAnswer(email, "not-the-password-1");
    expect(wrong.cookie).toBe(false);
    expect(new URL(wrong.url, baseURL).searchParams.get("error")).toBe("CredentialsSignin");
    const listed = await admin.json(`/api/admin/users?query=${encodeURIComponent(email)}`);
    expect(listed.body.users[0].disabled).toBe(true);

    const on = await admin.json(`/api/admin/users/${f.people.student.id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ disabled: false }) });
    expect(on.body).toEqual({ user: { id: f.people.student.id, disabled: false } });
    expect((await laptop.json("/api/courses")).status).toBe(401); // its session stayed ended
    expect((await (await clientFor(email)).json("/api/courses")).status).toBe(200);
  });

  it("refuses to disable the admin's own account (409) and an unknown one (404); only a site admin may (403)", async () => {
    const me = await addPerson("accounts-admin", { isAdmin: true });
    const admin = await clientFor(me.email);
    const patch = (c: Client, id: string, disabled: boolean) => c.json(`/api/admin/users/${id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ disabled }) });
    const self = await patch(admin, me.id, true);
    expect(self.status).toBe(409);
    expect(self.body.error.fields).toHaveProperty("disabled");
    expect((await admin.json("/api/courses")).status).toBe(200);
    expect((await patch(admin, "00000000-0000-4000-8000-000000000000", true)).status).toBe(404);
    const f = await courseWithPeople();
    const instructor = await clientFor(f.people.instructor.email);
    expect((await patch(instructor, f.people.student.id, true)).status).toBe(403);
  });
});
