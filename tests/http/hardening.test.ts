// Headers, cross-site refusal, body limits and revocable sessions, over HTTP against the test server.
import { beforeAll, describe, expect, it } from "vitest";
import { e2eDb } from "../support/db";
import { Client, baseURL } from "../support/http";
import { attemptWithReview, clientFor, courseWithPeople, fixedCircuitLab, PASSWORD, publishedLab, sendAs, serverActionIds } from "./fixtures";

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
    // an Origin that matches a Host or X-Forwarded-Host the client wrote itself is still another site
    for (const forged of [{ "x-forwarded-host": "evil.example", "x-forwarded-proto": "https" }, { "x-forwarded-host": "evil.example", "x-forwarded-proto": "http" }] as Record<string, string>[]) {
      const r = await instructor.json(path(), { method: "POST", headers: { "content-type": "application/json", origin: `${forged["x-forwarded-proto"]}://evil.example`, ...forged }, body: body() });
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
    // the browser that changed it stays signed in
    expect((await mine.json("/api/courses")).status).toBe(200);
    expect(await new Client().signIn(email, PASSWORD)).toBe(false);
    expect(await new Client().signIn(email, "a-new-bench-password")).toBe(true);
  });
});

describe("answers that depend on the caller", () => {
  // the PNG signature (ISO/IEC 15948, 5.2) and an IHDR chunk
  const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde]);

  it("carry Cache-Control: no-store (JSON, the session, a signed URL, a CSV, an error)", async () => {
    const student = await clientFor(f.people.student.email);
    const labId = await publishedLab(sendAs(instructor), f.courseId, fixedCircuitLab({ title: "No-store lab" }));
    const form = new FormData();
    form.set("labId", labId);
    form.set("file", new Blob([PNG], { type: "text/html" }), "poly.html");
    const up = await student.json("/api/uploads", { method: "POST", body: form });
    expect(up.status).toBe(201);
    const paths: [Client, string][] = [
      [student, "/api/courses"],
      [student, "/api/auth/session"],
      [student, `/api/uploads/${up.body.upload.id}`],
      [instructor, `/api/labs/${labId}/parts?format=csv`],
      [instructor, `/api/courses/${f.courseId}/gradebook?format=csv`],
      [new Client(), "/api/courses"],
    ];
    for (const [c, p] of paths) {
      const res = await c.fetch(p);
      expect(res.headers.get("cache-control"), p).toMatch(/no-store/);
    }
  });

  it("a download is named with the extension of the type read from its bytes, not the one the student typed", async () => {
    const student = await clientFor(f.people.student.email);
    const labId = await publishedLab(sendAs(instructor), f.courseId, fixedCircuitLab({ title: "Download name lab" }));
    const form = new FormData();
    form.set("labId", labId);
    form.set("file", new Blob([PNG], { type: "text/html" }), "poly.html");
    const up = await student.json("/api/uploads", { method: "POST", body: form });
    expect(up.status).toBe(201);
    const view = await student.json(`/api/uploads/${up.body.upload.id}`);
    const disposition = new URL(view.body.upload.url).searchParams.get("response-content-disposition");
    expect(disposition).toBe('attachment; filename="poly.png"');
    // the object store answers the signed URL with that name
    const file = await fetch(view.body.upload.url);
    expect(file.headers.get("content-disposition")).toBe('attachment; filename="poly.png"');
  });
});

describe("control characters", () => {
  it("a NUL in a review message or a lab title answers 400 naming the field, and nothing is saved", async () => {
    const student = await clientFor(f.people.student.email);
    const labId = await publishedLab(sendAs(instructor), f.courseId, fixedCircuitLab({ title: "Control lab" }));
    const attemptId = await attemptWithReview(sendAs(student), labId, "A first look, please.");
    const review = await student.post(`/api/attempts/${attemptId}/review`, { message: "Please look\u0000 again" });
    expect(review.status).toBe(400);
    expect(Object.keys(review.body.error.fields)).toEqual(["message"]);
    const title = await instructor.json(`/api/labs/${labId}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ title: "Shunt\u0000 lab" }) });
    expect(title.status).toBe(400);
    expect(Object.keys(title.body.error.fields)).toEqual(["title"]);
    expect((await instructor.json(`/api/labs/${labId}`)).body.lab.title).toBe("Control lab");
    // a tab and a line break are text, not control characters to refuse
    expect((await instructor.json(`/api/labs/${labId}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ instructions: "Step one.\n\tStep two." }) })).status).toBe(200);
  });
});

describe("server-side sessions", () => {
  async function signedInTwice() {
    const g = await courseWithPeople();
    const email = g.people.student.email;
    return { email, userId: g.people.student.id, a: await clientFor(email), b: await clientFor(email) };
  }
  /** Sets a column of the user's sessions as a clock that moved on would (the app reads PostgreSQL's now()). */
  async function age(userId: string, column: "last_seen_at" | "created_at", hours: number) {
    const db = e2eDb();
    try {
      await db.updateTable("sessions").set({ [column]: new Date(Date.now() - hours * 3600_000) }).where("user_id", "=", userId).execute();
    } finally {
      await db.destroy();
    }
  }

  it('"Sign out" in the header ends the session on the server: a copy of its cookie no longer works', async () => {
    const { a, b } = await signedInTwice();
    const copied = a.copy();
    const id = serverActionIds()["lib/auth/sign-out.ts#signOutHere"];
    const res = await a.fetch("/", { method: "POST", headers: { "next-action": id, "content-type": "text/plain;charset=UTF-8", accept: "text/x-component" }, body: "[]" });
    expect([200, 303]).toContain(res.status);
    expect((await copied.json("/api/courses")).status).toBe(401);
    expect((await copied.json("/api/auth/session")).body).not.toHaveProperty("user");
    // the other browser is not signed out
    expect((await b.json("/api/courses")).status).toBe(200);
  });

  it("the settings list the caller's sessions with their browser; signing one out ends only that one", async () => {
    const { a, b, email } = await signedInTwice();
    const list = await a.json("/api/me/sessions");
    expect(list.status).toBe(200);
    expect(list.body.sessions).toHaveLength(2);
    expect(list.body.sessions.filter((s: { current: boolean }) => s.current)).toHaveLength(1);
    for (const s of list.body.sessions) {
      expect(typeof s.createdAt).toBe("string");
      expect(typeof s.lastSeenAt).toBe("string");
      expect(s.userAgent).toEqual(expect.any(String));
    }
    const other = list.body.sessions.find((s: { current: boolean }) => !s.current);
    // someone else cannot end it, nor learn that it exists
    const stranger = await clientFor((await courseWithPeople()).people.student.email);
    expect((await stranger.json(`/api/me/sessions/${other.id}`, { method: "DELETE" })).status).toBe(404);
    expect((await b.json("/api/courses")).status).toBe(200);
    expect((await a.json(`/api/me/sessions/${other.id}`, { method: "DELETE" })).status).toBe(200);
    expect((await b.json("/api/courses")).status).toBe(401);
    expect((await a.json("/api/courses")).status).toBe(200);
    expect((await a.json(`/api/me/sessions/${other.id}`, { method: "DELETE" })).status).toBe(404);
    const page = await (await a.fetch("/settings")).text();
    expect(page).toContain("Where you are signed in");
    expect(page).toContain(email);
  });

  it("a session ends after 12 hours without a request (OWASP ASVS 4.0.3 V3.3.2, level 2)", async () => {
    const { a, userId } = await signedInTwice();
    await age(userId, "last_seen_at", 11.5);
    expect((await a.json("/api/courses")).status).toBe(200);
    await age(userId, "last_seen_at", 12.1);
    expect((await a.json("/api/courses")).status).toBe(401);
  });

  it("a session ends 14 days after signing in, however busy (OWASP ASVS 4.0.3 V3.3.2, level 2)", async () => {
    const { a, userId } = await signedInTwice();
    await age(userId, "created_at", 13.9 * 24);
    expect((await a.json("/api/courses")).status).toBe(200);
    await age(userId, "created_at", 14.1 * 24);
    expect((await a.json("/api/courses")).status).toBe(401);
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
