// Fuzzing through HTTP the two mutations that take no JSON.
//
// Uploads: fast-check generates multipart bodies for POST /api/uploads and the trace reader behind it (a CSV
// of time and current is analysed as it is accepted). Files are logged traces a student might export
// (headers with and without units, decimal commas, semicolons, tabs, blank and broken rows, a byte-order
// mark, huge and odd numbers), images with and without a real signature, and random bytes; names with
// paths, Unicode and odd lengths; the lab named by a good id, a stranger's id, text or not at all; the
// form's own structure broken at times. No answer may be a 5xx; a 201 carries the stored upload; every 4xx
// is `{ error: { code, message, fields } }` naming a field.
//
// Sign-in: URL-encoded forms to the credentials sign-in (odd e-mails and passwords, very long ones,
// missing or wrong CSRF tokens, repeated and unknown fields). No answer may be a 5xx, a 429 carries
// Retry-After, and no such form ever gets a session.
//
// `npm test` sends a tenth of SHUNTWISE_FUZZ_RUNS (1,000 unless set) to each with a fixed seed; `npm run
// fuzz` a tenth of 10,000. SHUNTWISE_FUZZ_SEED=<seed> replays a failure.
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { baseURL, Client } from "../support/http";
import { pool } from "../support/pool";
import { clientFor, courseWithPeople, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

const RUNS = Math.max(50, Math.round(Number(process.env.SHUNTWISE_FUZZ_RUNS ?? 1000) / 10));
const SEED = Number(process.env.SHUNTWISE_FUZZ_SEED ?? 20261202);
const CONCURRENCY = 8;

let student: Client;
let labId: string;
let courseId: string;

beforeAll(async () => {
  const f = await courseWithPeople();
  courseId = f.courseId;
  const instructor = await clientFor(f.people.instructor.email);
  labId = await publishedLab(sendAs(instructor), f.courseId, fixedCircuitLab({ title: "Upload fuzz lab" }));
  student = await clientFor(f.people.student.email);
});

// --- generators

const number = fc.oneof(
  fc.double({ noNaN: false, min: -1e6, max: 1e6 }).map(String),
  fc.integer({ min: -1000, max: 100000 }).map(String),
  fc.constantFrom("", "NaN", "Infinity", "-", "1e400", "1,5", "0,001", "1 000", "12abc", "١٢", "0x1F", '"3"', "  7  "),
);
const separator = fc.constantFrom(",", ";", "\t", " ", "|");
const header = fc.constantFrom(
  "time_s,current_A",
  "time (ms),current (uA)",
  "t [s];I [mA]",
  "time,current",
  "\ufefftime_s,current_mA",
  "current,time",
  "a,b,c",
  "",
  "time_s",
  "zeit;strom",
  '"time, s","current, A"',
);
const traceText = fc
  .tuple(header, separator, fc.array(fc.array(number, { minLength: 0, maxLength: 4 }), { minLength: 0, maxLength: 60 }), fc.constantFrom("\n", "\r\n", "\r"))
  .map(([h, sep, rows, eol]) => [h, ...rows.map((r) => r.join(sep))].join(eol));
/** A regular trace (a square wave sampled evenly), sometimes broken at one row. */
const goodTrace = fc
  .tuple(fc.integer({ min: 2, max: 400 }), fc.double({ min: 1e-9, max: 1, noNaN: true }), fc.option(fc.nat(399)), fc.string({ maxLength: 12 }))
  .map(([n, high, brokenAt, junk]) => {
    const rows = Array.from({ length: n }, (_, i) => `${(i * 0.001).toFixed(3)},${i % 10 < 2 ? high : high / 1000}`);
    if (brokenAt !== null && brokenAt < n) rows[brokenAt] = junk;
    return ["time_s,current_A", ...rows].join("\n");
  });
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const JPEG_SIGNATURE = [0xff, 0xd8, 0xff, 0xe0];
const fileBytes = fc.oneof(
  { weight: 4, arbitrary: traceText.map((t) => new TextEncoder().encode(t)) },
  { weight: 3, arbitrary: goodTrace.map((t) => new TextEncoder().encode(t)) },
  { weight: 2, arbitrary: fc.uint8Array({ maxLength: 2048 }) },
  { weight: 1, arbitrary: fc.uint8Array({ maxLength: 512 }).map((b) => Uint8Array.from([...PNG_SIGNATURE, ...b])) },
  { weight: 1, arbitrary: fc.uint8Array({ maxLength: 512 }).map((b) => Uint8Array.from([...JPEG_SIGNATURE, ...b])) },
  { weight: 1, arbitrary: fc.constant(new Uint8Array()) },
);
const fileName = fc.oneof(
  fc.constantFrom("trace.csv", "scope.png", "photo.jpg", "../../etc/passwd", "a/b\\c.csv", "", ".csv", "trace.CSV", "名前.csv", "x".repeat(300) + ".csv", "<script>.png", "trace.csv\u0000.png"),
  fc.string({ maxLength: 40 }),
);
type Owner = "lab" | "course" | "stranger lab" | "text lab" | "none" | "both";
const owner = fc.constantFrom<Owner>("lab", "lab", "lab", "course", "stranger lab", "text lab", "none", "both");
const shape = fc.constantFrom("form", "form", "form", "form", "file as text", "no file", "broken boundary", "not multipart");

interface Case {
  bytes: Uint8Array;
  name: string;
  owner: Owner;
  shape: string;
  type: string;
}
const cases = fc.record({ bytes: fileBytes, name: fileName, owner, shape, type: fc.constantFrom("text/csv", "image/png", "application/octet-stream", "text/html", "") });

// --- sending

function form(c: Case): { body: BodyInit; headers: Record<string, string> } {
  const fd = new FormData();
  const ids: Record<Owner, [string, string][]> = {
    lab: [["labId", labId]],
    course: [["courseId", courseId]],
    "stranger lab": [["labId", crypto.randomUUID()]],
    "text lab": [["labId", "not-a-lab"]],
    none: [],
    both: [
      ["labId", labId],
      ["courseId", crypto.randomUUID()],
    ],
  };
  for (const [k, v] of ids[c.owner]) fd.append(k, v);
  if (c.shape === "file as text") fd.append("file", new TextDecoder().decode(c.bytes));
  else if (c.shape !== "no file") fd.append("file", new Blob([c.bytes as BlobPart], c.type ? { type: c.type } : {}), c.name);
  if (c.shape === "broken boundary") {
    const text = `--wrong\r\nContent-Disposition: form-data; name="file"; filename="x.csv"\r\n\r\n${new TextDecoder().decode(c.bytes)}`;
    return { body: text, headers: { "content-type": "multipart/form-data; boundary=other" } };
  }
  if (c.shape === "not multipart") return { body: c.bytes as BodyInit, headers: { "content-type": c.type || "text/csv" } };
  return { body: fd, headers: {} };
}

/** What is wrong with an answer, or null. */
function fault(status: number, text: string): string | null {
  if (status >= 500) return `answered ${status}`;
  let body: { upload?: { id?: unknown }; error?: { code?: unknown; message?: unknown; fields?: Record<string, unknown> } };
  try {
    body = JSON.parse(text);
  } catch {
    return `answered ${status} with a body that is not JSON`;
  }
  if (status === 201) return typeof body.upload?.id === "string" ? null : "answered 201 without the upload";
  if (status < 400) return `answered ${status}`;
  const e = body.error;
  if (!e || typeof e.code !== "string" || typeof e.message !== "string") return `answered ${status} without { error: { code, message } }`;
  if (!e.fields || Object.keys(e.fields).length === 0) return `answered ${status} (${e.code}) naming no field`;
  return null;
}

describe(`fuzzing uploads through HTTP (${RUNS} bodies, seed ${SEED})`, () => {
  it("answers no multipart body with a 5xx, stores what it accepts, and every 4xx names the field", { timeout: 600_000 }, async () => {
    const all = fc.sample(cases, { numRuns: RUNS, seed: SEED });
    const statuses: Record<number, number> = {};
    const faults: string[] = [];
    await pool(all, CONCURRENCY, async (c) => {
      const { body, headers } = form(c);
      const res = await student.json("/api/uploads", { method: "POST", body, headers });
      statuses[res.status] = (statuses[res.status] ?? 0) + 1;
      const f = fault(res.status, res.text);
      if (f) faults.push(`${f}\n    sent: ${c.shape}, ${c.owner}, "${c.name.slice(0, 40)}", ${c.type || "no type"}, ${c.bytes.length} bytes: ${JSON.stringify(new TextDecoder().decode(c.bytes.slice(0, 120)))}\n    got: ${res.text.slice(0, 300)}`);
    });
    console.log(`fuzz uploads: ${all.length} bodies to ${baseURL}/api/uploads: ${Object.entries(statuses).map(([k, v]) => `${k}×${v}`).join(" ")}`);
    expect(faults.slice(0, 20), `${faults.length} of ${all.length} answers are wrong (replay with SHUNTWISE_FUZZ_SEED=${SEED})`).toEqual([]);
    // the generators reach both sides: some files are stored, some refused
    expect(statuses[201] ?? 0).toBeGreaterThan(0);
    expect(Object.keys(statuses).some((s) => Number(s) >= 400)).toBe(true);
  });

  it("keeps a file name's last segment without control characters, and a lab id that is not the caller's names labId", async () => {
    const fd = new FormData();
    fd.append("labId", labId);
    fd.append("file", new Blob(["time_s,current_A\n0,1\n0.001,2\n"], { type: "text/csv" }), "../logs/run\u0000 1.csv");
    const stored = await student.json("/api/uploads", { method: "POST", body: fd });
    expect(stored.status).toBe(201);
    const view = await student.json(`/api/uploads/${stored.body.upload.id}`);
    expect(view.status).toBe(200);
    expect(view.body.upload.originalName).toBe("run 1.csv");

    const stranger = new FormData();
    stranger.append("labId", crypto.randomUUID());
    stranger.append("file", new Blob(["time_s,current_A\n0,1\n"], { type: "text/csv" }), "trace.csv");
    const refused = await student.json("/api/uploads", { method: "POST", body: stranger });
    expect(refused.status).toBe(404);
    expect(Object.keys(refused.body.error.fields)).toEqual(["labId"]);
  });
});

// --- sign-in

const RUN_TAG = Math.random().toString(36).slice(2, 8);
const text = fc.oneof(
  fc.string({ maxLength: 60 }),
  fc.string({ unit: "grapheme", maxLength: 30 }),
  fc.constantFrom("", " ", "a@b", "@", "x@y.z", "ADMIN@EXAMPLE.EXAMPLE", "' or 1=1 --", "%00", "\u0000", "a".repeat(5000), "é@ü.example"),
);
const signInCase = fc.record({
  email: fc.oneof(text, fc.nat().map((n) => `fuzz.${n}@test.example`)),
  password: fc.oneof(text, fc.constant("x".repeat(100_000))),
  csrf: fc.constantFrom("good", "good", "good", "wrong", "missing"),
  extra: fc.option(fc.dictionary(fc.constantFrom("email", "password", "callbackUrl", "json", "redirect", "role", "isAdmin"), text, { maxKeys: 3 })),
});

describe(`fuzzing sign-in through HTTP (${RUNS} forms, seed ${SEED})`, () => {
  it("answers no form with a 5xx, sends Retry-After with a 429, and never signs anyone in", { timeout: 600_000 }, async () => {
    const all = fc.sample(signInCase, { numRuns: RUNS, seed: SEED + 1 });
    const statuses: Record<number, number> = {};
    const faults: string[] = [];
    await pool(all, CONCURRENCY, async (c, n) => {
      const client = new Client();
      const csrf = await client.json("/api/auth/csrf");
      const form = new URLSearchParams();
      if (c.csrf !== "missing") form.append("csrfToken", c.csrf === "good" ? csrf.body.csrfToken : "0".repeat(64));
      // an e-mail made unique per form, so the per-account throttle of one does not decide another's answer
      form.append("email", c.email.includes("@test.example") ? c.email.replace("@", `.${RUN_TAG}.${n}@`) : c.email);
      form.append("password", c.password);
      form.append("json", "true");
      for (const [k, v] of Object.entries(c.extra ?? {})) form.append(k, v);
      const res = await client.fetch("/api/auth/callback/credentials", { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded" }, body: form.toString() });
      await res.arrayBuffer();
      statuses[res.status] = (statuses[res.status] ?? 0) + 1;
      const session = res.headers.getSetCookie().some((k) => /next-auth\.session-token=[^;]/.test(k));
      const sent = `csrf ${c.csrf}, e-mail ${JSON.stringify(c.email.slice(0, 60))}, password of ${c.password.length} characters, extra ${JSON.stringify(c.extra)?.slice(0, 120)}`;
      if (res.status >= 500) faults.push(`answered ${res.status}\n    sent: ${sent}`);
      if (res.status === 429 && !(Number(res.headers.get("retry-after")) > 0)) faults.push(`answered 429 without Retry-After\n    sent: ${sent}`);
      if (session) faults.push(`answered with a session\n    sent: ${sent}`);
    });
    console.log(`fuzz sign-in: ${all.length} forms: ${Object.entries(statuses).map(([k, v]) => `${k}×${v}`).join(" ")}`);
    expect(faults.slice(0, 20), `${faults.length} of ${all.length} answers are wrong (replay with SHUNTWISE_FUZZ_SEED=${SEED})`).toEqual([]);
  });
});
