// Headers, cross-site refusal, body limits and revocable sessions, over HTTP against the test server.
import { beforeAll, describe, expect, it } from "vitest";
import { Client, baseURL } from "../support/http";
import { clientFor, courseWithPeople, PASSWORD } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let instructor: Client;

beforeAll(async () => {
  f = await courseWithPeople();
  instructor = await clientFor(f.people.instructor.email);
});

function directives(csp: string): Map<string, string[]> {
  return new Map(csp.split(";").map((d) => d.trim().split(/\s+/)).filter((d) => d[0]).map(([k, ...v]) => [k, v]));
}

describe("security headers", () => {
  it("a page carries a content security policy with a fresh nonce on its scripts, nosniff and a referrer policy", async () => {
    const pages = await Promise.all([fetch(`${baseURL}/signin`), fetch(`${baseURL}/signin`)]);
    const nonces: string[] = [];
    for (const res of pages) {
      expect(res.status).toBe(200);
      const csp = res.headers.get("content-security-policy")!;
      const d = directives(csp);
      expect(d.get("object-src")).toEqual(["'none'"]);
      expect(d.get("base-uri")).toEqual(["'self'"]);
      expect(d.get("form-action")).toEqual(["'self'"]);
      expect(d.get("frame-ancestors")).toEqual(["'none'"]);
      expect(csp).not.toContain("unsafe-eval");
      expect(d.get("script-src")).not.toContain("'unsafe-inline'");
      const nonce = /'nonce-([^']+)'/.exec(d.get("script-src")!.join(" "))![1];
      nonces.push(nonce);
      const html = await res.text();
      const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
      expect(scripts.length).toBeGreaterThan(0);
      for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
      expect(res.headers.get("x-content-type-options")).toBe("nosniff");
      expect(res.headers.get("referrer-policy")).toBe("same-origin");
      // the test server's public address is http: no HSTS
      expect(res.headers.get("strict-transport-security")).toBeNull();
    }
    expect(nonces[0]).not.toBe(nonces[1]);
  });

  it("JSON answers carry them too", async () => {
    const res = await fetch(`${baseURL}/api/health`);
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(directives(res.headers.get("content-security-policy")!).get("frame-ancestors")).toEqual(["'none'"]);
  });
});

describe("state-changing JSON routes", () => {
  const path = () => `/api/courses/${f.courseId}/members`;
  const body = () => JSON.stringify({ email: f.people.outsider.email, role: "student" });

  it("refuse a body that is not application/json (415 naming content-type)", async () => {
    const r = await instructor.json(path(), { method: "POST", headers: { "content-type": "text/plain" }, body: body() });
    expect(r.status).toBe(415);
    expect(r.body.error.fields).toHaveProperty("content-type");
  });

  it("refuse a request without Origin or from another site (403 naming origin)", async () => {
    for (const origin of ["https://evil.example", "null"]) {
      const r = await instructor.json(path(), { method: "POST", headers: { "content-type": "application/json", origin }, body: body() });
      expect(r.status).toBe(403);
      expect(r.body.error.fields).toHaveProperty("origin");
    }
    // no Origin at all (a Client adds one unless told otherwise, so go around it)
    const res = await fetch(baseURL + path(), { method: "POST", headers: { "content-type": "application/json" }, body: body() });
    expect(res.status).toBe(403);
  });

  it("cut a body over 256 KB at the limit, with or without Content-Length (413)", async () => {
    const big = JSON.stringify({ email: "x@test.example", role: "student", section: "s".repeat(300 * 1024) });
    const json = { "content-type": "application/json" };
    const declared = await instructor.streamPost(path(), { ...json, "content-length": String(Buffer.byteLength(big)) }, () => [Buffer.from(big)]);
    expect(declared.status).toBe(413);
    expect(declared.body.error.code).toBe("payload_too_large");
    // chunked: no Content-Length, the server must count the bytes as they come
    // 320 KB sent and the request left open: the answer cannot wait for the body's end
    const chunked = await instructor.streamPost(
      path(),
      json,
      function* () {
        for (let i = 0; i < 40; i++) yield Buffer.from("x".repeat(16 * 1024));
      },
      { holdAfter: 320 * 1024 },
    );
    expect(chunked.status).toBe(413);
  });

  it("still accept a proper same-origin JSON request", async () => {
    const r = await instructor.post(path(), { email: f.people.outsider.email, role: "student" });
    expect(r.status).toBe(201);
  });
});

describe("sessions", () => {
  async function freshUser() {
    const g = await courseWithPeople();
    return g.people.student.email;
  }

  it("sign out everywhere ends every session of the user, copied cookies included; signing in again works", async () => {
    const email = await freshUser();
    const laptop = await clientFor(email);
    const lab = await clientFor(email);
    const copied = laptop.copy();
    expect((await copied.json("/api/courses")).status).toBe(200);

    expect((await lab.post("/api/me/sign-out-everywhere", {})).status).toBe(200);
    for (const c of [laptop, lab, copied]) expect((await c.json("/api/courses")).status).toBe(401);
    // a page shows none of the account and sends the visitor to the sign-in page
    const page = await (await copied.fetch("/settings")).text();
    expect(page).not.toContain(email);
    expect(page).toContain("/signin?next=%2Fsettings");

    const again = await clientFor(email);
    expect((await again.json("/api/courses")).status).toBe(200);
  });

  it("a password change ends the other sessions; the old password no longer signs in", async () => {
    const email = await freshUser();
    const mine = await clientFor(email);
    const other = await clientFor(email);
    const wrong = await mine.post("/api/me/password", { currentPassword: "not-it-at-all", newPassword: "a-new-bench-password", confirm: "a-new-bench-password" });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty("currentPassword");
    expect((await other.json("/api/courses")).status).toBe(200);

    const changed = await mine.post("/api/me/password", { currentPassword: PASSWORD, newPassword: "a-new-bench-password", confirm: "a-new-bench-password" });
    expect(changed.status).toBe(200);
    expect((await other.json("/api/courses")).status).toBe(401);
    expect(await new Client().signIn(email, PASSWORD)).toBe(false);
    expect(await new Client().signIn(email, "a-new-bench-password")).toBe(true);
  });
});

describe("uploads", () => {
  // a multipart-looking body of `mb` megabytes, streamed without a Content-Length
  const chunks = (mb: number) =>
    function* () {
      yield Buffer.from("--b\r\ncontent-disposition: form-data; name=\"file\"; filename=\"big.png\"\r\n\r\n");
      for (let i = 0; i < mb * 16; i++) yield Buffer.alloc(64 * 1024, 1);
    };
  // every byte sent and the request left open: the answer cannot wait for the body's end
  const held = (mb: number) => ({ holdAfter: mb * 1024 * 1024 });
  const multipart = { "content-type": "multipart/form-data; boundary=b" };

  it("refuse an anonymous caller before reading the body (401)", async () => {
    const r = await new Client().streamPost("/api/uploads", multipart, chunks(1), held(1));
    expect(r.status).toBe(401);
  });

  it("cut a streamed body without Content-Length at the limit (413 naming file)", async () => {
    const r = await instructor.streamPost("/api/uploads", multipart, chunks(11), held(11));
    expect(r.status).toBe(413);
    expect(r.body.error.fields).toHaveProperty("file");
  });
});
