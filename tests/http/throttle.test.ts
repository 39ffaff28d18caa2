// Sign-in and password-reset throttles: per e-mail, counted in PostgreSQL, 429 with Retry-After and a
// message a person reads, the same for an address with an account and one without.
import type { ChildProcess } from "node:child_process";
import net from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startNext, waitForHttp } from "../../scripts/lib/server";
import { e2eDb, uniqueEmail } from "../support/db";
import { Client, baseURL } from "../support/http";
import { clientFor, courseWithPeople } from "./fixtures";

/** One sign-in try through next-auth's credentials callback, as the sign-in form sends it. */
async function signInTry(email: string, password: string, extraHeaders: Record<string, string> = {}, base = baseURL) {
  const csrfRes = await fetch(`${base}/api/auth/csrf`, { headers: extraHeaders });
  const cookie = csrfRes.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const { csrfToken } = await csrfRes.json();
  const form = new URLSearchParams({ csrfToken, email, password, json: "true" });
  return fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", origin: base, cookie, ...extraHeaders },
    body: form.toString(),
    redirect: "manual",
  });
}

/** The throttle counters stored for keys that contain `part` (rate-limiter-flexible writes `name:key`). */
async function countersLike(part: string): Promise<{ key: string; points: number }[]> {
  const db = e2eDb();
  try {
    return await db.selectFrom("rate_limits").select(["key", "points"]).where("key", "like", `%${part}%`).execute();
  } finally {
    await db.destroy();
  }
}

const randomOctet = () => 1 + Math.floor(Math.random() * 250);

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

describe("throttles keyed on the socket's address", () => {
  it("a made-up X-Forwarded-For or X-Real-IP is not the caller's address: the tries count against the socket's", async () => {
    const forged = `198.51.${randomOctet()}.${randomOctet()}`;
    const before = (await countersLike("signInAddress:127.0.0.1")).reduce((s, c) => s + c.points, 0);
    for (let i = 0; i < 3; i++) {
      const res = await signInTry(uniqueEmail("forger"), "wrong", { "x-forwarded-for": `${forged.slice(0, -1)}${i}`, "x-real-ip": forged, "x-shuntwise-client": `guess ${forged}` });
      expect(res.status).toBe(401);
    }
    expect(await countersLike(forged.split(".").slice(0, 3).join("."))).toEqual([]);
    const after = (await countersLike("signInAddress:127.0.0.1")).reduce((s, c) => s + c.points, 0);
    expect(after).toBeGreaterThanOrEqual(before + 3);
  });
});

describe("throttles behind a proxy named in SHUNTWISE_TRUSTED_PROXIES", () => {
  let server: ChildProcess | undefined;
  let url: string;

  beforeAll(async () => {
    const port = await new Promise<number>((resolve) => {
      const s = net.createServer().listen(0, "127.0.0.1", () => {
        const { port } = s.address() as net.AddressInfo;
        s.close(() => resolve(port));
      });
    });
    url = `http://127.0.0.1:${port}`;
    // the same build and database; the test itself plays the proxy on 127.0.0.1
    const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: "production", DATABASE_URL: process.env.E2E_DATABASE_URL, SHUNTWISE_NO_WORKERS: "1", APP_URL: url, NEXTAUTH_URL: url, SHUNTWISE_TRUSTED_PROXIES: "127.0.0.1, ::1" };
    server = startNext({ distDir: process.env.SHUNTWISE_TEST_DIST_DIR ?? ".next-test", port, host: "127.0.0.1", env, quiet: true });
    await waitForHttp(`${url}/api/health`, server);
  }, 120_000);

  afterAll(async () => {
    if (!server || server.exitCode !== null) return;
    const exited = new Promise((r) => server!.once("exit", r));
    server.kill("SIGTERM");
    await exited;
  });

  it("counts against the address the proxy saw (its own entry), never one the client wrote before it", async () => {
    const seen = `203.0.113.${randomOctet()}`;
    const written = `192.0.2.${randomOctet()}`;
    const res = await signInTry(uniqueEmail("proxied"), "wrong", { "x-forwarded-for": `${written}, ${seen}` }, url);
    expect(res.status).toBe(401);
    expect((await countersLike(`signInAddress:${seen}`)).map((c) => c.points)).toEqual([1]);
    expect(await countersLike(`signInAddress:${written}`)).toEqual([]);
  });
});

describe("sign-in tries sent in parallel", () => {
  it("30 wrong passwords at once for one e-mail: at most 10 are checked (401), the rest wait (429)", async () => {
    const f = await courseWithPeople();
    const statuses = await Promise.all(Array.from({ length: 30 }, (_, i) => signInTry(f.people.student.email, `wrong password ${i}`).then((r) => r.status)));
    const checked = statuses.filter((s) => s === 401).length;
    expect(checked).toBeLessThanOrEqual(10);
    expect(statuses.filter((s) => s === 429).length).toBe(30 - checked);
  });
});

describe("the password change's current-password check", () => {
  it("is throttled like sign-in: 10 wrong current passwords answer 400, then 429 naming currentPassword with Retry-After", async () => {
    const f = await courseWithPeople();
    const c = await clientFor(f.people.student.email);
    const statuses: number[] = [];
    let last: { status: number; body: any } | undefined;
    for (let i = 0; i < 12; i++) {
      last = await c.post("/api/me/password", { currentPassword: `wrong-current-${i}`, newPassword: "another-password-1", confirm: "another-password-1" });
      statuses.push(last.status);
    }
    expect(statuses).toEqual([...Array(10).fill(400), 429, 429]);
    expect(last!.body.error.fields.currentPassword[0]).toMatch(/Too many sign-in attempts/);
    // even the right current password waits now
    expect((await c.post("/api/me/password", { currentPassword: "fixture-password-1", newPassword: "another-password-1", confirm: "another-password-1" })).status).toBe(429);
  });
});
