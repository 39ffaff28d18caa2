// Sign-in and password-reset throttles: per e-mail, counted in PostgreSQL, 429 with Retry-After and a
// message a person reads, the same for an address with an account and one without.
import { describe, expect, it } from "vitest";
import { uniqueEmail } from "../support/db";
import { Client, baseURL } from "../support/http";
import { courseWithPeople } from "./fixtures";

/** One sign-in try through next-auth's credentials callback, as the sign-in form sends it. */
async function signInTry(email: string, password: string) {
  const c = new Client();
  const csrf = await c.json("/api/auth/csrf");
  const form = new URLSearchParams({ csrfToken: csrf.body.csrfToken, email, password, json: "true" });
  return c.fetch("/api/auth/callback/credentials", {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", origin: baseURL },
    body: form.toString(),
  });
}

describe("sign-in throttle", () => {
  it("after 10 tries in 15 minutes an e-mail gets 429 with Retry-After, whether or not it has an account", async () => {
    const f = await courseWithPeople();
    for (const email of [f.people.student.email, uniqueEmail("nobody")]) {
      const statuses: number[] = [];
      for (let i = 0; i < 10; i++) statuses.push((await signInTry(email, `wrong password ${i}`)).status);
      expect(statuses.every((s) => s !== 429)).toBe(true);
      const res = await signInTry(email, "wrong password again");
      expect(res.status).toBe(429);
      const wait = Number(res.headers.get("retry-after"));
      expect(wait).toBeGreaterThan(0);
      expect(wait).toBeLessThanOrEqual(15 * 60);
      const body = await res.json();
      expect(body.error.code).toBe("too_many_requests");
      expect(body.error.message).toMatch(/Too many sign-in attempts.*Wait \d+ minutes?/);
      expect(new URL(body.url).searchParams.get("error")).toBe("TooManyRequests");
    }
    // even the right password waits: the account's counter is used up
    expect((await signInTry(f.people.student.email, "fixture-password-1")).status).toBe(429);
    // another account is not affected
    expect(await new Client().signIn(f.people.ta.email, "fixture-password-1")).toBe(true);
  });
});

describe("sign-in throttle and successful sign-ins", () => {
  it("counts failures only: a person who signs in correctly again and again is never refused, and success clears earlier failures", async () => {
    const f = await courseWithPeople();
    for (let i = 0; i < 9; i++) expect((await signInTry(f.people.ta.email, `wrong password ${i}`)).status).not.toBe(429);
    for (let i = 0; i < 12; i++) expect(await new Client().signIn(f.people.ta.email, "fixture-password-1")).toBe(true);
    // the nine failures were cleared by the first success: nine more wrong tries are still answered
    for (let i = 0; i < 9; i++) expect((await signInTry(f.people.ta.email, `again wrong ${i}`)).status).not.toBe(429);
  });
});

describe("password reset throttle", () => {
  it("answers the same three times, then 429 with Retry-After, for a known and an unknown address alike", async () => {
    const f = await courseWithPeople();
    const answers: { status: number; body: unknown }[][] = [];
    for (const email of [f.people.outsider.email, uniqueEmail("nobody")]) {
      const c = new Client();
      const seen = [];
      for (let i = 0; i < 4; i++) {
        const r = await c.post("/api/password-reset", { email });
        seen.push({ status: r.status, body: r.status === 429 ? r.body.error.code : r.body });
      }
      answers.push(seen);
    }
    expect(answers[0].map((a) => a.status)).toEqual([200, 200, 200, 429]);
    expect(answers[1]).toEqual(answers[0]);
  });
});
