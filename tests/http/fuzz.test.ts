// Fuzzing through HTTP: fast-check generates request bodies for every mutation's zod schema
// (lib/validation/*) and for the quantity reader (lib/grader's parse, reached through the submission
// route's readings) and sends them to the running app as the signed-in people who may make each change.
// Half the bodies are random JSON, half are a valid body with one field changed (replaced by odd JSON,
// removed, or an unknown field added). No answer may be a 5xx; every 4xx is `{ error: { code, message,
// fields } }` naming at least one field (the body itself, its content type or its origin count).
//
// `npm test` sends SHUNTWISE_FUZZ_RUNS bodies (1,000 unless set) with a fixed seed; `npm run fuzz` sends
// 10,000. A failure prints the seed and the bodies that failed; SHUNTWISE_FUZZ_SEED=<seed> replays them.
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { Client } from "../support/http";
import { pool } from "../support/pool";
import { addPerson, clientFor, courseWithPeople, fixedCircuitLab, serverActionIds } from "./fixtures";

const RUNS = Number(process.env.SHUNTWISE_FUZZ_RUNS ?? 1000);
const SEED = Number(process.env.SHUNTWISE_FUZZ_SEED ?? 20261202);
const CONCURRENCY = 20;

type Who = "student" | "ta" | "instructor" | "admin" | "anonymous";
interface Target {
  name: string;
  who: Who;
  method: string;
  path: () => string;
  /** a body the route accepts (near-valid bodies change one field of it) */
  valid: () => unknown;
  /** share of the bodies */
  weight: number;
  /** value generators for some paths of the valid body ("readings.*" matches every reading) */
  values?: Record<string, fc.Arbitrary<unknown>>;
  /** a query string instead of a JSON body */
  query?: boolean;
  /** a string of the valid body made unique in every request (a per-e-mail throttle counts the valid ones) */
  unique?: string;
  /** a server action ("file#export") called as its form calls it, on `path`: its answer is the action's result */
  action?: string;
}

let as: Record<Who, Client>;
let actionIds: Record<string, string>;
let w: {
  courseId: string;
  labId: string; // published, with attempts
  draftLabId: string; // no attempts: PATCHed freely
  questions: { id: string; quantity: string }[];
  attemptId: string;
  memberId: string;
  instructorEmail: string;
};

// --- generators

/** Text a student might type for a quantity, and text no one should: the quantity reader's input. */
const quantityText = fc.oneof(
  fc
    .tuple(
      fc.oneof(fc.double({ noNaN: false }).map(String), fc.integer().map(String), fc.constantFrom("1e-400", "1e400", "-0", ".5", "5.", "1,5", "1 000", "0x10", "--1", "½", "١٢", "∞", "Infinity", "NaN", "")),
      fc.constantFrom("", " ", "  ", "\t", "\u00a0"),
      fc.constantFrom("A", "mA", "µA", "μA", "uA", "nA", "pA", "kA", "V", "mV", "µV", "Ω", "kΩ", "ohm", "W", "%", "s", "mA mA", "a", "MA", "Amps", "amp", "mAh", "°C", "e", "E3", "x10^-3 A", "×10⁻³ A", ""),
    )
    .map(([n, sp, u]) => `${n}${sp}${u}`),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: "grapheme", maxLength: 20 }),
  fc.string({ unit: "binary", maxLength: 20 }),
  fc.string({ minLength: 190, maxLength: 260 }),
);

const oddJson: fc.Arbitrary<unknown> = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  fc.constantFrom(null, true, false, 0, -1, 1e308, -1e308, 5e-324, 0.5, 2 ** 53 + 1, "", " ", "\u0000", "null", "true", "[]", "{}", [], {}, [null], { "": null }, "2026-13-45T99:99:99Z", "2026-12-02T10:00:00", "1970-01-01T00:00:00Z", "9999-12-31T23:59:59Z", "00000000-0000-4000-8000-000000000000", "__proto__", "constructor", "a".repeat(5000)),
  fc.string({ maxLength: 30 }),
  fc.integer(),
  fc.double(),
);

type Mutation = { path: string[]; how: "replace" | "delete" | "extra"; value: unknown; key: string };

/** Every path to a value inside `v` (objects and arrays), the root excluded. */
function paths(v: unknown, at: string[] = []): string[][] {
  if (v === null || typeof v !== "object") return [];
  const out: string[][] = [];
  for (const [k, x] of Object.entries(v)) {
    out.push([...at, k]);
    out.push(...paths(x, [...at, k]));
  }
  return out;
}

function mutate(base: unknown, m: Mutation): unknown {
  const copy = structuredClone(base) as Record<string, unknown>;
  let node: Record<string, unknown> = copy;
  for (const k of m.path.slice(0, -1)) node = node[k] as Record<string, unknown>;
  const last = m.path[m.path.length - 1];
  if (m.how === "delete") delete node[last];
  else if (m.how === "replace") node[last] = m.value;
  else {
    const target = node[last];
    if (target && typeof target === "object" && !Array.isArray(target)) (target as Record<string, unknown>)[m.key] = m.value;
    else if (Array.isArray(target)) target.push(m.value);
    else node[m.key] = m.value;
  }
  return copy;
}

function valuesFor(t: Target, path: string[]): fc.Arbitrary<unknown> {
  const exact = path.join(".");
  const star = [...path.slice(0, -1), "*"].join(".");
  return t.values?.[exact] ?? t.values?.[star] ?? oddJson;
}

/** A valid body with one field replaced, removed, or joined by an unknown one. */
function nearValid(t: Target): fc.Arbitrary<unknown> {
  const base = t.valid();
  const all = paths(base);
  if (!all.length) return fc.jsonValue();
  return fc.constantFrom(...all).chain((path) =>
    fc
      .record({ how: fc.constantFrom("replace", "replace", "delete", "extra" as const), value: valuesFor(t, path), key: fc.oneof(fc.string({ maxLength: 12 }), fc.constantFrom("__proto__", "constructor", "id", "userId", "courseId")) })
      .map(({ how, value, key }) => mutate(base, { path, how: how as Mutation["how"], value, key })),
  );
}

/** Random JSON: anything, or an object with random keys. */
const randomJson: fc.Arbitrary<unknown> = fc.oneof(fc.jsonValue({ maxDepth: 4 }), fc.object({ maxDepth: 3, values: [fc.jsonValue({ maxDepth: 2 })] }));

interface Case {
  target: string;
  body: unknown;
  /** the field (path) whose text had a control character put into it: the answer must be 400 naming it */
  control?: string;
  /** sent as it is (not JSON.stringify'd): unreadable JSON, or a wrong content type */
  raw?: { text: string; type: string };
}

/** Control characters no text field may hold (C0 but tab, LF and CR; DEL; C1). */
const controlChar = fc.oneof(
  fc.constantFrom("\u0000", "\u0001", "\u0007", "\u0008", "\u000b", "\u000c", "\u001b", "\u001f", "\u007f", "\u0085", "\u009f"),
  fc.integer({ min: 0, max: 0x9f }).filter((c) => (c < 0x20 && ![9, 10, 13].includes(c)) || c >= 0x7f).map((c) => String.fromCharCode(c)),
);

/** Every path to a string inside `v`. */
function stringPaths(v: unknown, at: string[] = []): string[][] {
  if (typeof v === "string") return at.length ? [at] : [];
  if (v === null || typeof v !== "object") return [];
  return Object.entries(v).flatMap(([k, x]) => stringPaths(x, [...at, k]));
}

/** A valid body with a control character put into one of its texts (every text field gets its turn). */
function withControl(t: Target): fc.Arbitrary<Case> | null {
  const base = t.valid();
  const all = stringPaths(base);
  if (!all.length) return null;
  return fc.record({ path: fc.constantFrom(...all), ch: controlChar, at: fc.nat() }).map(({ path, ch, at }) => {
    let node = base as Record<string, unknown>;
    for (const k of path) node = node[k] as Record<string, unknown>;
    const text = node as unknown as string;
    const i = at % (text.length + 1);
    return { target: t.name, body: mutate(base, { path, how: "replace", value: text.slice(0, i) + ch + text.slice(i), key: "" }), control: path.join(".") };
  });
}

function casesFor(t: Target, n: number, seed: number): Case[] {
  const control = withControl(t);
  const arb: fc.Arbitrary<Case> = fc.oneof(
    ...(control ? [{ weight: 2, arbitrary: control }] : []),
    { weight: 5, arbitrary: nearValid(t).map((body) => ({ target: t.name, body })) },
    { weight: 4, arbitrary: randomJson.map((body) => ({ target: t.name, body })) },
    {
      weight: t.query ? 0 : 1,
      arbitrary: fc
        .record({ text: fc.oneof(fc.string({ maxLength: 40 }), fc.constant("{"), fc.constant("")), type: fc.constantFrom("application/json", "text/plain", "application/x-www-form-urlencoded", "") })
        .map((raw) => ({ target: t.name, body: null, raw })),
    },
  );
  return fc.sample(arb, { numRuns: n, seed });
}

// --- the targets: every JSON mutation route, the review and gradebook queries

const TARGETS: Target[] = [
  {
    name: "POST /api/labs/{labId}/attempts (the quantity reader)",
    who: "student",
    method: "POST",
    path: () => `/api/labs/${w.labId}/attempts`,
    // an attempt already made: a valid body answers 200 with it and uses no attempt
    valid: () => ({ idempotencyKey: "fuzz-key-0", readings: Object.fromEntries(w.questions.map((q) => [q.id, q.quantity === "burdenVoltage" ? "3 mV" : "1 mA"])), measured: {}, uploadIds: [] }),
    weight: 25,
    values: {
      "readings.*": quantityText,
      "measured.*": quantityText,
      // new keys make new attempts: two at most (the lab allows 20, and a 409 for none left names no field)
      idempotencyKey: fc.constantFrom("fuzz-key-0", "fuzz-key-1", "fuzz-key-2", "short", "", "k".repeat(101), null, 12345678, true, [], {}),
    },
  },
  {
    // asking for an upload sent straight to storage (issue 26): a valid body starts a small multipart upload
    name: "POST /api/uploads (JSON: an upload straight to storage)",
    who: "student",
    method: "POST",
    path: () => "/api/uploads",
    valid: () => ({ labId: w.labId, name: "fuzzed-trace.csv", size: 2048, type: "text/csv" }),
    weight: 6,
    values: {
      size: fc.oneof(fc.integer(), fc.double(), fc.constantFrom(0, -1, 1, 2 ** 31, 2 ** 53, 200 * 1024 * 1024 + 1, "2048", null)),
      type: fc.oneof(fc.constantFrom("text/csv", "image/png", "image/jpeg", "application/pdf", "", "TEXT/CSV", "text/csv; charset=utf-8"), fc.string({ maxLength: 30 })),
    },
  },
  {
    name: "POST /api/courses/{courseId}/labs",
    who: "instructor",
    method: "POST",
    path: () => `/api/courses/${w.courseId}/labs`,
    valid: () => labBody(),
    weight: 12,
  },
  {
    name: "PATCH /api/labs/{labId}",
    who: "instructor",
    method: "PATCH",
    path: () => `/api/labs/${w.draftLabId}`,
    valid: () => ({ ...labBody(), status: "draft" }),
    weight: 10,
  },
  {
    name: "POST /api/attempts/{attemptId}/regrades",
    who: "ta",
    method: "POST",
    path: () => `/api/attempts/${w.attemptId}/regrades`,
    valid: () => ({ questionId: w.questions[0].id, points: 2, reason: "Fuzzed reason" }),
    weight: 4,
  },
  {
    name: "POST /api/attempts/{attemptId}/regrades (rerun)",
    who: "ta",
    method: "POST",
    path: () => `/api/attempts/${w.attemptId}/regrades`,
    valid: () => ({ rerun: true, reason: "Fuzzed reason" }),
    weight: 2,
  },
  {
    name: "POST /api/attempts/{attemptId}/review",
    who: "student",
    method: "POST",
    path: () => `/api/attempts/${w.attemptId}/review`,
    valid: () => ({ message: "Please look at question one again." }),
    weight: 3,
  },
  {
    name: "POST /api/attempts/{attemptId}/review/answer",
    who: "ta",
    method: "POST",
    path: () => `/api/attempts/${w.attemptId}/review/answer`,
    valid: () => ({ message: "Looked again; the grade stands." }),
    weight: 3,
  },
  {
    name: "PATCH /api/courses/{courseId}",
    who: "instructor",
    method: "PATCH",
    path: () => `/api/courses/${w.courseId}`,
    valid: () => ({ title: "Fuzzed course", term: "Fuzz term", joiningOpen: false, defaultLatePenaltyPercentPerDay: 10, defaultLateFloorPercent: 50 }),
    weight: 4,
  },
  {
    name: "POST /api/courses/{courseId}/copy",
    who: "instructor",
    method: "POST",
    path: () => `/api/courses/${w.courseId}/copy`,
    valid: () => ({ code: "FZ-COPY", term: "Next term", title: "Fuzzed copy", shiftDays: 120 }),
    weight: 1,
  },
  {
    name: "POST /api/courses",
    who: "admin",
    method: "POST",
    path: () => "/api/courses",
    valid: () => ({ code: "FZ-NEW", title: "Fuzzed new course", term: "Fuzz term", institution: "Fuzz college", instructorEmail: w.instructorEmail, instructorName: "" }),
    weight: 1,
  },
  {
    name: "PUT /api/courses/{courseId}/gradebook/weights",
    who: "instructor",
    method: "PUT",
    path: () => `/api/courses/${w.courseId}/gradebook/weights`,
    valid: () => ({ weights: [{ labId: w.labId, weight: 2 }] }),
    weight: 3,
    values: { "weights.0.weight": fc.oneof(fc.string({ maxLength: 12 }), oddJson) },
  },
  {
    name: "PUT /api/courses/{courseId}/lessons",
    who: "instructor",
    method: "PUT",
    path: () => `/api/courses/${w.courseId}/lessons`,
    valid: () => ({ lessons: [{ slug: "no-such-lesson-yet", visible: true, opensAt: null }] }),
    weight: 3,
  },
  {
    name: "POST /api/courses/{courseId}/members",
    who: "instructor",
    method: "POST",
    path: () => `/api/courses/${w.courseId}/members`,
    valid: () => ({ email: "nobody.fuzzed@test.example", role: "student", section: "A" }),
    weight: 3,
  },
  {
    name: "PATCH /api/courses/{courseId}/members/{userId}",
    who: "instructor",
    method: "PATCH",
    path: () => `/api/courses/${w.courseId}/members/${w.memberId}`,
    valid: () => ({ role: "student", section: "B" }),
    weight: 3,
  },
  {
    name: "POST /api/courses/{courseId}/members/import",
    who: "instructor",
    method: "POST",
    path: () => `/api/courses/${w.courseId}/members/import`,
    valid: () => ({ csv: "name,email,section\nFuzz Person,fuzz.person@test.example,A\n", confirm: false }),
    weight: 3,
  },
  {
    name: "PUT /api/courses/{courseId}/benches",
    who: "instructor",
    method: "PUT",
    path: () => `/api/courses/${w.courseId}/benches`,
    valid: () => ({ benches: [{ name: "Bench 01", section: "A", memberIds: [w.memberId] }, { name: "Bench 02", memberIds: [] }] }),
    weight: 3,
  },
  {
    name: "PUT /api/labs/{labId}/exceptions/{userId}",
    who: "instructor",
    method: "PUT",
    path: () => `/api/labs/${w.labId}/exceptions/${w.memberId}`,
    valid: () => ({ dueAt: "2031-05-01T12:00:00Z", closesAt: "2031-05-03T12:00:00Z", extraAttempts: 1, reason: "Fuzzed reason" }),
    weight: 3,
  },
  {
    name: "PUT /api/courses/{courseId}/stock",
    who: "instructor",
    method: "PUT",
    path: () => `/api/courses/${w.courseId}/stock`,
    valid: () => ({ items: [{ kind: "resistor", value: 4700, tolerancePercent: 1, quantity: 12 }, { kind: "capacitor", value: 1e-7, tolerancePercent: 10, quantity: 3 }] }),
    weight: 3,
  },
  {
    name: "PUT /api/labs/{labId}/grades-held",
    who: "instructor",
    method: "PUT",
    path: () => `/api/labs/${w.draftLabId}/grades-held`,
    valid: () => ({ held: true }),
    weight: 1,
  },
  { name: "PATCH /api/me/preferences", who: "ta", method: "PATCH", path: () => "/api/me/preferences", valid: () => ({ gradeMail: true }), weight: 2 },
  {
    name: "POST /api/me/password",
    who: "ta",
    method: "POST",
    path: () => "/api/me/password",
    valid: () => ({ currentPassword: "not-the-current-one", newPassword: "a-new-password-1" }),
    weight: 2,
  },
  { name: "POST /api/password-reset", who: "anonymous", method: "POST", path: () => "/api/password-reset", valid: () => ({ email: "fuzz.reset@test.example" }), weight: 1, unique: "fuzz.reset@" },
  {
    name: "POST /api/password-reset/confirm",
    who: "anonymous",
    method: "POST",
    path: () => "/api/password-reset/confirm",
    valid: () => ({ token: "x".repeat(43), password: "a-new-password-1" }),
    weight: 2,
  },
  {
    // the sign-up form's server action: a wrong join code, so no account is ever made
    name: "sign-up action (POST /signup, Next-Action)",
    who: "anonymous",
    method: "POST",
    path: () => "/signup",
    action: "app/(auth)/signup/actions.ts#signUpAction",
    valid: () => ({ name: "Fuzz Person", email: "fuzz.signup@test.example", password: "a-long-password-1", joinCode: "NO-SUCH-CODE" }),
    weight: 2,
  },
  // the site admin enables (or, with a changed body, disables) a member of the fuzzed course
  { name: "PATCH /api/admin/users/{userId}", who: "admin", method: "PATCH", path: () => `/api/admin/users/${w.memberId}`, valid: () => ({ disabled: false }), weight: 1 },
  { name: "GET /api/admin/users?…", who: "admin", method: "GET", query: true, path: () => "/api/admin/users", valid: () => ({ query: "fuzz" }), weight: 1 },
  { name: "GET /api/courses/{courseId}/reviews?…", who: "ta", method: "GET", query: true, path: () => `/api/courses/${w.courseId}/reviews`, valid: () => ({ status: "open", labId: w.labId, section: "A", mistake: "true", late: "0", changed: "" }), weight: 2 },
  { name: "GET /api/courses/{courseId}/gradebook?…", who: "ta", method: "GET", query: true, path: () => `/api/courses/${w.courseId}/gradebook`, valid: () => ({ format: "json" }), weight: 1 },
];

/**
 * The fixtures' lab with more of the lab schema for near-valid bodies to change: a list and two ranges
 * (series, tolerances) instead of fixed values, a bench question, 20 attempts and a late penalty.
 */
function labBody() {
  return fixedCircuitLab({
    title: "Fuzz lab",
    spec: {
      template: "shunt-burden",
      parameters: {
        supplyVoltage: { mode: "list", values: [3.3, 5] },
        loadResistance: { mode: "range", min: 100, max: 470, series: "E24", tolerancePercent: 1 },
        shuntResistance: { mode: "range", min: 22, max: 47, series: "E12", tolerancePercent: 1 },
      },
    },
    questions: [
      { quantity: "indicatedCurrent", kind: "prediction", points: 4 },
      { quantity: "trueCurrent", kind: "prediction", points: 3 },
      { quantity: "burdenVoltage", kind: "bench", points: 3 },
    ],
    attemptsAllowed: 20,
    latePenaltyPercentPerDay: 10,
    lateFloorPercent: 50,
  });
}

beforeAll(async () => {
  const f = await courseWithPeople();
  const [admin, member] = await Promise.all([addPerson("fuzz-admin", { isAdmin: true }), addPerson("fuzz-member", { courseId: f.courseId, role: "student" })]);
  const [student, ta, instructor, adminClient] = await Promise.all([clientFor(f.people.student.email), clientFor(f.people.ta.email), clientFor(f.people.instructor.email), clientFor(admin.email)]);
  as = { student, ta, instructor, admin: adminClient, anonymous: new Client() };
  actionIds = serverActionIds();
  const make = async () => {
    const r = await instructor.post(`/api/courses/${f.courseId}/labs`, labBody());
    expect(r.status).toBe(201);
    return r.body.lab.id as string;
  };
  const [labId, draftLabId] = await Promise.all([make(), make()]);
  const pub = await instructor.json(`/api/labs/${labId}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ status: "published" }) });
  expect(pub.status).toBe(200);
  w = { courseId: f.courseId, labId, draftLabId, questions: pub.body.lab.questions, attemptId: "", memberId: member.id, instructorEmail: f.people.instructor.email };
  const first = await student.post(`/api/labs/${labId}/attempts`, TARGETS[0].valid());
  expect(first.status).toBe(201);
  w.attemptId = first.body.attempt.id;
  expect((await student.post(`/api/attempts/${w.attemptId}/review`, { message: "Please look again." })).status).toBe(201);
});

// --- sending

interface Outcome {
  c: Case;
  status: number;
  text: string;
}

const RUN_TAG = Math.random().toString(36).slice(2, 8);
let sent = 0;

async function send(t: Target, c: Case): Promise<Outcome> {
  const client = as[t.who];
  const n = sent++;
  const stringify = (v: unknown) => {
    const text = JSON.stringify(v);
    return t.unique && text ? text.replaceAll(t.unique, t.unique.replace("@", `.${RUN_TAG}.${n}@`)) : text;
  };
  let res: { status: number; text: string };
  if (t.query) {
    const q = new URLSearchParams();
    const body = c.body;
    if (body && typeof body === "object" && !Array.isArray(body)) for (const [k, v] of Object.entries(body)) q.append(k, typeof v === "string" ? v : JSON.stringify(v) ?? "");
    else q.append("q", JSON.stringify(body) ?? "");
    res = await client.json(`${t.path()}?${q}`);
  } else if (t.action) {
    // as React encodes an action's arguments: a string that starts with "$" is escaped as "$$…"
    const args = JSON.stringify([c.raw ? c.raw.text : c.body], (_k, v: unknown) => (typeof v === "string" && v.startsWith("$") ? `$${v}` : v));
    res = await client.json(t.path(), { method: "POST", headers: { "next-action": actionIds[t.action], "content-type": "text/plain;charset=UTF-8", accept: "text/x-component" }, body: args });
  } else if (c.raw) {
    res = await client.json(t.path(), { method: t.method, headers: c.raw.type ? { "content-type": c.raw.type } : {}, body: c.raw.text });
  } else {
    res = await client.json(t.path(), { method: t.method, headers: { "content-type": "application/json" }, body: stringify(c.body) });
  }
  return { c, status: res.status, text: res.text };
}

/** What is wrong with an answer, or null. */
function fault(t: Target, o: Outcome): string | null {
  if (o.status >= 500) return `answered ${o.status}`;
  if (o.c.control) {
    // a control character in a text: refused, naming that field
    const named = t.action ? o.text.includes(`"fields":{`) && o.text.includes(`"${o.c.control}":[`) : o.status === 400 && (() => {
      try {
        return Object.keys(JSON.parse(o.text).error?.fields ?? {}).includes(o.c.control!);
      } catch {
        return false;
      }
    })();
    if (!named) return `answered ${o.status} to a control character in "${o.c.control}" without a 400 naming it`;
  }
  if (t.action) {
    // the action answers its result in the page's payload: a refusal names at least one field
    if (o.status !== 200) return `answered ${o.status}`;
    if (!/"ok":false,"message":"[^"]+","fields":\{"/.test(o.text)) return "answered without a refusal naming a field";
    return null;
  }
  if (o.status < 400) return null;
  let body: { error?: { code?: unknown; message?: unknown; fields?: Record<string, unknown> } };
  try {
    body = JSON.parse(o.text);
  } catch {
    return `answered ${o.status} with a body that is not JSON`;
  }
  const e = body.error;
  if (!e || typeof e.code !== "string" || typeof e.message !== "string") return `answered ${o.status} without { error: { code, message } }`;
  if (!e.fields || typeof e.fields !== "object" || Object.keys(e.fields).length === 0) return `answered ${o.status} (${e.code}) naming no field`;
  return null;
}

describe(`fuzzing the mutations through HTTP (${RUNS} bodies, seed ${SEED})`, () => {
  it("answers no body with a 5xx, and every 4xx names the field", { timeout: 600_000 }, async () => {
    const totalWeight = TARGETS.reduce((s, t) => s + t.weight, 0);
    const counts = TARGETS.map((t) => Math.max(10, Math.floor((RUNS * t.weight) / totalWeight)));
    counts[0] += Math.max(0, RUNS - counts.reduce((s, n) => s + n, 0)); // the rest to the quantity reader
    const lists = TARGETS.map((t, i) => casesFor(t, counts[i], SEED + i).map((c) => [t, c] as [Target, Case]));
    // interleaved, so no route is hit by a long run of one kind
    const work: [Target, Case][] = [];
    for (let k = 0; lists.some((l) => k < l.length); k++) for (const l of lists) if (k < l.length) work.push(l[k]);
    const started = Date.now();
    const outcomes = await pool(work, CONCURRENCY, ([t, c]) => send(t, c));
    const seconds = (Date.now() - started) / 1000;
    const byTarget = new Map<string, Record<number, number>>();
    for (const o of outcomes) {
      const s = byTarget.get(o.c.target) ?? {};
      s[o.status] = (s[o.status] ?? 0) + 1;
      byTarget.set(o.c.target, s);
    }
    console.log(`fuzz: ${outcomes.length} bodies in ${seconds.toFixed(1)} s (seed ${SEED}, ${CONCURRENCY} at a time)`);
    for (const [name, s] of byTarget) console.log(`  ${name}: ${Object.entries(s).map(([k, v]) => `${k}×${v}`).join(" ")}`);
    const faults = outcomes.flatMap((o) => {
      const f = fault(TARGETS.find((t) => t.name === o.c.target)!, o);
      return f ? [`${o.c.target}: ${f}\n    sent: ${JSON.stringify(o.c.raw ?? o.c.body)}\n    got: ${o.text.slice(0, 300)}`] : [];
    });
    expect(faults.slice(0, 20), `${faults.length} of ${outcomes.length} answers are wrong (replay with SHUNTWISE_FUZZ_SEED=${SEED} SHUNTWISE_FUZZ_RUNS=${RUNS})`).toEqual([]);
    expect(outcomes.length).toBeGreaterThanOrEqual(RUNS);
  });
});
