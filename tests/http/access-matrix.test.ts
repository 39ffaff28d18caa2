// The access matrix: every route handler (each exported method of app/**/route.ts), every page
// (app/**/page.tsx) and every server action ("use server" files) against seven callers: anonymous, an
// outsider (signed in, not in the course), the student, another student of the same course, a TA, the
// instructor and a site admin who is not a member. Each cell asserts the status (or the page's refusal,
// sign-in redirect or not-found) and that the body carries no other person's data: the student's and the
// other student's names, e-mails and review messages carry unique marks, and a caller who may not see a
// person's data must not find that person's mark anywhere in the answer.
//
// The list of routes, pages and actions is read from the app/ tree when the test runs: one without a row
// in ROWS fails the first test, naming it. Mutations that the caller may make are sent a body that fails
// validation (a JSON array where an object belongs), so an allowed cell answers 400 naming the field and
// nothing changes: the caller got past the access check and reached the schema. The few routes without a
// body are sent to a harmless target (a member who is not in the course, a message that does not exist).
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { questions as lessonQuestions } from "@/lib/lessons/questions";
import { e2eDb } from "../support/db";
import { Client } from "../support/http";
import { addPerson, attemptWithReview, clientFor, courseWithPeople, fixedCircuitLab, publishedLab, sendAs, serverActionIds } from "./fixtures";

const ROLES = ["anonymous", "outsider", "student", "peer", "ta", "instructor", "admin"] as const;
type Role = (typeof ROLES)[number];

const root = path.resolve(import.meta.dirname, "../..");
const appDir = path.join(root, "app");

// ---------------------------------------------------------------------------------------------------
// What the app/ tree holds

/** "/courses/[courseId]/labs" from "app/(app)/courses/[courseId]/labs/page.tsx" (route groups dropped). */
function urlPattern(file: string): string {
  const segs = path.relative(appDir, path.dirname(file)).split(path.sep).filter((s) => s && !/^\(.*\)$/.test(s));
  return "/" + segs.join("/");
}

function sourceFiles(dir: string): string[] {
  return (readdirSync(dir, { recursive: true }) as string[]).filter((f) => /\.(ts|tsx)$/.test(f)).map((f) => path.join(dir, f));
}

const METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"];

function exportedMethods(src: string): string[] {
  const found = new Set<string>();
  for (const m of src.matchAll(/export\s+(?:const|let|async\s+function|function)\s+([A-Z]+)\b/g)) if (METHODS.includes(m[1])) found.add(m[1]);
  for (const m of src.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const part of m[1].split(",")) {
      const name = part.trim().split(/\s+as\s+/).pop()!.trim();
      if (METHODS.includes(name)) found.add(name);
    }
  }
  return [...found];
}

/** Every route method, page and server action of the app, as the keys ROWS uses. */
function discovered(): string[] {
  const keys: string[] = [];
  const files = sourceFiles(appDir);
  for (const f of files.filter((f) => path.basename(f) === "route.ts")) {
    for (const m of exportedMethods(readFileSync(f, "utf8"))) keys.push(`${m} ${urlPattern(f)}`);
  }
  for (const f of files.filter((f) => path.basename(f) === "page.tsx")) keys.push(`page ${urlPattern(f)}`);
  // server actions: a file that starts with "use server" exports them; an inline "use server" in a
  // function body is one too (listed by file, so it cannot go unnoticed)
  for (const f of [...files, ...sourceFiles(path.join(root, "components")), ...sourceFiles(path.join(root, "lib"))]) {
    const src = readFileSync(f, "utf8");
    if (!/["']use server["']/.test(src)) continue;
    const rel = path.relative(root, f);
    const body = src.replace(/^(\s*\/\/[^\n]*\n|\s*\/\*[\s\S]*?\*\/)*/, "");
    if (/^\s*["']use server["']/.test(body)) {
      for (const m of src.matchAll(/export\s+(?:async\s+)?function\s+(\w+)/g)) keys.push(`action ${rel}#${m[1]}`);
      for (const m of src.matchAll(/export\s+const\s+(\w+)\s*=/g)) keys.push(`action ${rel}#${m[1]}`);
    } else {
      keys.push(`action ${rel}#(inline)`);
    }
  }
  return keys.sort();
}

// ---------------------------------------------------------------------------------------------------
// The fixture: one course for the whole file

interface World {
  courseId: string;
  labId: string;
  attemptId: string; // the student's attempt, with a review request
  peerAttemptId: string;
  uploadId: string; // the student's upload
  student: { id: string; email: string };
  peer: { id: string; email: string };
  outsider: { id: string; email: string };
  hiddenLesson: string; // a lesson the course hides from students
  hiddenQuestion: string; // a "Check yourself" question of that lesson
  actionIds: Record<string, string>; // "components/lesson/check-question-action.ts#checkAnswer" → the build's action id
}

let w: World;
const as = {} as Record<Role, Client>;
/** Unique marks in the student's and the other student's data; who may see whose is asserted per cell. */
const MARK = { student: `mark-s-${Math.random().toString(36).slice(2, 10)}`, peer: `mark-p-${Math.random().toString(36).slice(2, 10)}` };

// the eight-byte PNG signature (ISO/IEC 15948, 5.2) followed by an IHDR chunk, as in labs.test.ts
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde]);

function uploadForm(labId: string, bytes: Uint8Array, name: string): FormData {
  const form = new FormData();
  form.set("labId", labId);
  form.set("file", new Blob([new Uint8Array(bytes)], { type: "application/octet-stream" }), name);
  return form;
}

beforeAll(async () => {
  const f = await courseWithPeople();
  const db = e2eDb();
  try {
    await db.updateTable("users").set({ name: `Student ${MARK.student}` }).where("id", "=", f.people.student.id).execute();
  } finally {
    await db.destroy();
  }
  const [peer, admin] = await Promise.all([
    addPerson("peer", { courseId: f.courseId, role: "student", name: `Peer ${MARK.peer}` }),
    addPerson("admin", { isAdmin: true, name: "Fixture site admin" }),
  ]);
  const adminEmail = admin.email;
  const signedIn = await Promise.all([
    clientFor(f.people.outsider.email),
    clientFor(f.people.student.email),
    clientFor(peer.email),
    clientFor(f.people.ta.email),
    clientFor(f.people.instructor.email),
    clientFor(adminEmail),
  ]);
  [as.outsider, as.student, as.peer, as.ta, as.instructor, as.admin] = signedIn;
  as.anonymous = new Client();

  // either bench: the simulated bench's routes answer on it too
  const labId = await publishedLab(sendAs(as.instructor), f.courseId, fixedCircuitLab({ title: "Matrix lab", bench: "either" }));

  // both students submit and ask for a review with their mark in the message; the student uploads a file
  // named with their mark
  const submit = (c: Client, mark: string) => attemptWithReview(sendAs(c), labId, `Please look again (${mark}).`);
  const [attemptId, peerAttemptId] = await Promise.all([submit(as.student, MARK.student), submit(as.peer, MARK.peer)]);
  const up = await as.student.json("/api/uploads", { method: "POST", body: uploadForm(labId, PNG, `${MARK.student}.png`) });
  expect(up.status).toBe(201);

  // the course shows every lesson but the last one, which it hides
  const all = await as.instructor.json(`/api/courses/${f.courseId}/lessons`);
  const slugs = (all.body.lessons as { slug: string }[]).map((l) => l.slug);
  const hiddenLesson = slugs.find((s) => lessonQuestions.some((q) => q.lesson === s) && s !== slugs[0])!;
  const plan = await as.instructor.json(`/api/courses/${f.courseId}/lessons`, {
    method: "PUT",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ lessons: slugs.map((slug) => ({ slug, visible: slug !== hiddenLesson })) }),
  });
  expect(plan.status).toBe(200);

  w = {
    courseId: f.courseId,
    labId,
    attemptId,
    peerAttemptId,
    uploadId: up.body.upload.id,
    student: f.people.student,
    peer,
    outsider: f.people.outsider,
    hiddenLesson,
    hiddenQuestion: lessonQuestions.find((q) => q.lesson === hiddenLesson)!.id,
    actionIds: serverActionIds(),
  };
});

// ---------------------------------------------------------------------------------------------------
// The table

/**
 * A cell: the status, or for pages "page" (rendered), "notFound" (the not-found page), "signin" (sent to
 * the sign-in page); a page that refuses a member answers 403 with its forbidden page. A page that
 * streams (a loading state) has sent 200 before it reads any data, so its not-found page and its
 * redirect come with 200: the redirect as a refresh to /signin, which the browser follows.
 */
type Cell = number | "page" | "notFound" | "signin" | ((r: Answer) => void);
type Cells = Record<Role, Cell>;
interface Answer {
  status: number;
  location: string | null;
  setCookie: string[];
  text: string;
}
interface Row {
  /** how the request is made: a path, or a full request (`c` is the client that will send it) */
  req: (w: World, c: Client) => string | { path: string; init: RequestInit } | Promise<{ path: string; init: RequestInit }>;
  cells: Cells;
  /** made after every other row (it ends sessions) */
  last?: boolean;
  /** made with a copy of the caller's client (the answer may set cookies the other rows must not get) */
  copy?: boolean;
}

const cells = (anonymous: Cell, outsider: Cell, student: Cell, peer: Cell, ta: Cell, instructor: Cell, admin: Cell): Cells => ({ anonymous, outsider, student, peer, ta, instructor, admin });
/** Course members read it. */
const members = (ok: Cell = 200) => cells(401, 404, ok, ok, ok, ok, ok);
/** The course staff (and the site admin, who acts as instructor). */
const staff = (ok: Cell = 200) => cells(401, 404, 403, 403, ok, ok, ok);
const instructors = (ok: Cell = 200) => cells(401, 404, 403, 403, 403, ok, ok);
/** The student's own resource: its owner and the staff; the other student is told it does not exist. */
const owner = (ok: Cell = 200) => cells(401, 404, ok, 404, ok, ok, ok);
/** Anyone signed in, about their own account. */
const signedIn = (ok: Cell = 200) => cells(401, ok, ok, ok, ok, ok, ok);
const admins = (ok: Cell = 200) => cells(401, 403, 403, 403, 403, 403, ok);
const everyone = (ok: Cell = 200) => cells(ok, ok, ok, ok, ok, ok, ok);

// pages
const pMembers = cells("signin", "notFound", "page", "page", "page", "page", "page");
const pStaff = cells("signin", "notFound", 403, 403, "page", "page", "page");
const pInstructors = cells("signin", "notFound", 403, 403, 403, "page", "page");
const pOwner = cells("signin", "notFound", "page", "notFound", "page", "page", "page");
const pSignedIn = cells("signin", "page", "page", "page", "page", "page", "page");
const pAdmins = cells("signin", 403, 403, 403, 403, 403, "page");

/** A JSON body no schema accepts (every mutation takes an object). */
const BAD = "[]";
const send = (method: string, p: string, body: string | FormData = BAD) => ({
  path: p,
  init: { method, body, headers: typeof body === "string" ? { "content-type": "application/json" } : {} } as RequestInit,
});
const action = (page: (w: World) => string, id: (w: World) => string, args: unknown[]) => (w: World) => ({
  path: page(w),
  init: { method: "POST", headers: { "next-action": id(w), "content-type": "text/plain;charset=UTF-8", accept: "text/x-component" }, body: JSON.stringify(args) } as RequestInit,
});
const says = (status: number, pattern: RegExp) => (r: Answer) => {
  expect(r.status).toBe(status);
  expect(r.text).toMatch(pattern);
};

const UNKNOWN = "00000000-0000-4000-8000-000000000000";
const c = (w: World) => `/api/courses/${w.courseId}`;
const l = (w: World) => `/api/labs/${w.labId}`;
const a = (w: World) => `/api/attempts/${w.attemptId}`;

const ROWS: Record<string, Row> = {
  // --- API
  "GET /api/health": { req: () => "/api/health", cells: everyone(200) },
  "GET /api/auth/[...nextauth]": { req: () => "/api/auth/session", cells: everyone(200) },
  // a credentials sign-in for an e-mail no account has: refused alike for everyone (a session is never handed out)
  "POST /api/auth/[...nextauth]": {
    req: async (_w, c) => {
      const csrf = await c.json("/api/auth/csrf");
      const form = new URLSearchParams({ csrfToken: csrf.body.csrfToken, email: `matrix-nobody-${MARK.student}@test.example`, password: "wrong-password-1", json: "true" });
      return { path: "/api/auth/callback/credentials", init: { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded" }, body: form.toString() } };
    },
    cells: everyone((r) => {
      expect([200, 302, 401]).toContain(r.status);
      expect(r.text + (r.location ?? "")).toMatch(/error=CredentialsSignin/);
      expect(r.setCookie.join("\n")).not.toMatch(/session-token=[^;]/);
    }),
    copy: true,
  },
  "GET /api/courses": { req: () => "/api/courses", cells: signedIn(200) },
  "POST /api/courses": { req: () => send("POST", "/api/courses"), cells: admins(400) },
  "GET /api/courses/[courseId]": { req: (w) => c(w), cells: members(200) },
  "PATCH /api/courses/[courseId]": { req: (w) => send("PATCH", c(w)), cells: instructors(400) },
  "POST /api/courses/[courseId]/copy": { req: (w) => send("POST", `${c(w)}/copy`), cells: instructors(400) },
  "GET /api/courses/[courseId]/benches": { req: (w) => `${c(w)}/benches`, cells: staff(200) },
  "PUT /api/courses/[courseId]/benches": { req: (w) => send("PUT", `${c(w)}/benches`), cells: instructors(400) },
  "GET /api/courses/[courseId]/stock": { req: (w) => `${c(w)}/stock`, cells: staff(200) },
  "PUT /api/courses/[courseId]/stock": { req: (w) => send("PUT", `${c(w)}/stock`), cells: instructors(400) },
  "GET /api/courses/[courseId]/gradebook": { req: (w) => `${c(w)}/gradebook`, cells: staff(200) },
  "GET /api/courses/[courseId]/gradebook/weights": { req: (w) => `${c(w)}/gradebook/weights`, cells: instructors(200) },
  "PUT /api/courses/[courseId]/gradebook/weights": { req: (w) => send("PUT", `${c(w)}/gradebook/weights`), cells: instructors(400) },
  // a new join code: harmless here (no one joins this course by code)
  "POST /api/courses/[courseId]/join-code": { req: (w) => send("POST", `${c(w)}/join-code`, ""), cells: instructors(200) },
  "GET /api/courses/[courseId]/labs": { req: (w) => `${c(w)}/labs`, cells: members(200) },
  "POST /api/courses/[courseId]/labs": { req: (w) => send("POST", `${c(w)}/labs`), cells: instructors(400) },
  "GET /api/courses/[courseId]/lessons": { req: (w) => `${c(w)}/lessons`, cells: members(200) },
  "PUT /api/courses/[courseId]/lessons": { req: (w) => send("PUT", `${c(w)}/lessons`), cells: instructors(400) },
  "GET /api/courses/[courseId]/members": { req: (w) => `${c(w)}/members`, cells: staff(200) },
  "POST /api/courses/[courseId]/members": { req: (w) => send("POST", `${c(w)}/members`), cells: instructors(400) },
  "POST /api/courses/[courseId]/members/import": { req: (w) => send("POST", `${c(w)}/members/import`), cells: instructors(400) },
  "PATCH /api/courses/[courseId]/members/[userId]": { req: (w) => send("PATCH", `${c(w)}/members/${w.peer.id}`), cells: instructors(400) },
  // the outsider is no member: an allowed caller is told so, and no one is removed
  "DELETE /api/courses/[courseId]/members/[userId]": { req: (w) => send("DELETE", `${c(w)}/members/${w.outsider.id}`, ""), cells: instructors(404) },
  "GET /api/courses/[courseId]/reviews": { req: (w) => `${c(w)}/reviews`, cells: staff(200) },
  "GET /api/labs/[labId]": { req: (w) => l(w), cells: members(200) },
  "PATCH /api/labs/[labId]": { req: (w) => send("PATCH", l(w)), cells: instructors(400) },
  "GET /api/labs/[labId]/attempts": { req: (w) => `${l(w)}/attempts`, cells: members(200) },
  "POST /api/labs/[labId]/attempts": { req: (w) => send("POST", `${l(w)}/attempts`), cells: members(400) },
  "PUT /api/labs/[labId]/exceptions/[userId]": { req: (w) => send("PUT", `${l(w)}/exceptions/${w.student.id}`), cells: instructors(400) },
  // the outsider has no exception (and is no student): an allowed caller is told so, nothing changes
  "DELETE /api/labs/[labId]/exceptions/[userId]": { req: (w) => send("DELETE", `${l(w)}/exceptions/${w.outsider.id}`, ""), cells: instructors(404) },
  "PUT /api/labs/[labId]/grades-held": { req: (w) => send("PUT", `${l(w)}/grades-held`), cells: instructors(400) },
  "GET /api/labs/[labId]/handout": { req: (w) => `${l(w)}/handout`, cells: members(200) },
  "GET /api/labs/[labId]/kits": { req: (w) => `${l(w)}/kits`, cells: staff(200) },
  "GET /api/labs/[labId]/parts": { req: (w) => `${l(w)}/parts`, cells: staff(200) },
  "GET /api/labs/[labId]/bench": { req: (w) => `${l(w)}/bench`, cells: members(200) },
  // the student's replay: the student and the staff; the other student is told it does not exist
  "GET /api/labs/[labId]/bench/readings": { req: (w) => `${l(w)}/bench/readings?range=r50m&count=3&userId=${w.student.id}`, cells: owner(200) },
  "GET /api/attempts/[attemptId]": { req: (w) => a(w), cells: owner(200) },
  "GET /api/attempts/[attemptId]/history": { req: (w) => `${a(w)}/history`, cells: owner(200) },
  "POST /api/attempts/[attemptId]/regrades": { req: (w) => send("POST", `${a(w)}/regrades`), cells: cells(401, 404, 403, 404, 400, 400, 400) },
  // only the attempt's own student asks for its review; the staff are refused, the other student told it does not exist
  "POST /api/attempts/[attemptId]/review": { req: (w) => send("POST", `${a(w)}/review`), cells: cells(401, 404, 400, 404, 403, 403, 403) },
  "POST /api/attempts/[attemptId]/review/answer": { req: (w) => send("POST", `${a(w)}/review/answer`), cells: cells(401, 404, 403, 404, 400, 400, 400) },
  // an empty file for the lab: past the access check, refused as empty
  "POST /api/uploads": { req: (w) => send("POST", "/api/uploads", uploadForm(w.labId, new Uint8Array(), "empty.png")), cells: cells(401, 404, 400, 400, 400, 400, 400) },
  "GET /api/uploads/[uploadId]": { req: (w) => `/api/uploads/${w.uploadId}`, cells: owner(200) },
  // completing is its owner's alone; an upload completed before answers as it is
  "POST /api/uploads/[uploadId]/complete": { req: (w) => send("POST", `/api/uploads/${w.uploadId}/complete`, ""), cells: cells(401, 404, 200, 404, 404, 404, 404) },
  // the parts the store holds of an upload still being sent: its owner's alone (none left for a completed one)
  "GET /api/uploads/[uploadId]/parts": { req: (w) => `/api/uploads/${w.uploadId}/parts`, cells: cells(401, 404, 200, 404, 404, 404, 404) },
  // a window of a logged trace: the owner and the staff are told an image has no samples to zoom into
  "GET /api/uploads/[uploadId]/trace": { req: (w) => `/api/uploads/${w.uploadId}/trace?from=0&to=1&points=100`, cells: owner(409) },
  "GET /api/templates": { req: () => "/api/templates", cells: signedIn(200) },
  "GET /api/me/preferences": { req: () => "/api/me/preferences", cells: signedIn(200) },
  "PATCH /api/me/preferences": { req: () => send("PATCH", "/api/me/preferences"), cells: signedIn(400) },
  "POST /api/me/password": { req: () => send("POST", "/api/me/password"), cells: signedIn(400) },
  "GET /api/me/sessions": { req: () => "/api/me/sessions", cells: signedIn(200) },
  // a session that does not exist: an allowed caller is told so, and no session ends
  "DELETE /api/me/sessions/[sessionId]": { req: () => send("DELETE", `/api/me/sessions/${UNKNOWN}`, ""), cells: signedIn(404) },
  "POST /api/me/sign-out-everywhere": { req: () => send("POST", "/api/me/sign-out-everywhere", ""), cells: signedIn(200), last: true },
  "POST /api/password-reset": { req: () => send("POST", "/api/password-reset"), cells: everyone(400) },
  "POST /api/password-reset/confirm": { req: () => send("POST", "/api/password-reset/confirm"), cells: everyone(400) },
  "GET /api/admin/outbox": { req: () => "/api/admin/outbox", cells: admins(200) },
  "POST /api/admin/outbox/[mailId]/resend": { req: () => send("POST", `/api/admin/outbox/${UNKNOWN}/resend`, ""), cells: admins(404) },
  "GET /api/dev/mail": { req: () => "/api/dev/mail", cells: admins(200) },
  "GET /api/admin/users": { req: () => "/api/admin/users?query=fixture", cells: admins(200) },
  "PATCH /api/admin/users/[userId]": { req: (w) => send("PATCH", `/api/admin/users/${w.outsider.id}`), cells: admins(400) },

  // --- pages
  "page /": { req: () => "/", cells: pSignedIn },
  "page /signin": { req: () => "/signin", cells: everyone("page") },
  "page /signup": { req: () => "/signup", cells: everyone("page") },
  "page /forgot-password": { req: () => "/forgot-password", cells: everyone("page") },
  "page /reset-password/[token]": { req: () => "/reset-password/not-a-real-token", cells: everyone("page") },
  "page /settings": { req: () => "/settings", cells: pSignedIn },
  "page /admin/courses": { req: () => "/admin/courses", cells: pAdmins },
  "page /admin/outbox": { req: () => "/admin/outbox", cells: pAdmins },
  "page /admin/users": { req: () => "/admin/users?query=fixture", cells: pAdmins },
  "page /dev/mailbox": { req: () => "/dev/mailbox", cells: pAdmins },
  "page /lessons": { req: () => "/lessons", cells: pSignedIn },
  // a lesson the course hides: its staff read it, its students and outsiders are told it does not exist
  "page /lessons/[slug]": { req: (w) => `/lessons/${w.hiddenLesson}`, cells: cells("signin", "notFound", "notFound", "notFound", "page", "page", "page") },
  "page /courses/[courseId]": { req: (w) => `/courses/${w.courseId}`, cells: pMembers },
  "page /courses/[courseId]/labs": { req: (w) => `/courses/${w.courseId}/labs`, cells: pMembers },
  "page /courses/[courseId]/labs/new": { req: (w) => `/courses/${w.courseId}/labs/new`, cells: pInstructors },
  "page /courses/[courseId]/lessons": { req: (w) => `/courses/${w.courseId}/lessons`, cells: pMembers },
  "page /courses/[courseId]/reviews": { req: (w) => `/courses/${w.courseId}/reviews`, cells: pStaff },
  "page /courses/[courseId]/reviews/[attemptId]": { req: (w) => `/courses/${w.courseId}/reviews/${w.attemptId}`, cells: cells("signin", "notFound", 403, "notFound", "page", "page", "page") },
  "page /courses/[courseId]/benches": { req: (w) => `/courses/${w.courseId}/benches`, cells: pStaff },
  "page /courses/[courseId]/roster": { req: (w) => `/courses/${w.courseId}/roster`, cells: pStaff },
  "page /courses/[courseId]/settings": { req: (w) => `/courses/${w.courseId}/settings`, cells: pInstructors },
  "page /courses/[courseId]/gradebook": { req: (w) => `/courses/${w.courseId}/gradebook`, cells: pStaff },
  "page /courses/[courseId]/gradebook/students/[userId]": { req: (w) => `/courses/${w.courseId}/gradebook/students/${w.student.id}`, cells: pStaff },
  "page /labs/[labId]": { req: (w) => `/labs/${w.labId}`, cells: pMembers },
  "page /labs/[labId]/edit": { req: (w) => `/labs/${w.labId}/edit`, cells: pInstructors },
  "page /labs/[labId]/kits": { req: (w) => `/labs/${w.labId}/kits`, cells: pStaff },
  "page /labs/[labId]/parts": { req: (w) => `/labs/${w.labId}/parts`, cells: pStaff },
  "page /labs/[labId]/preview": { req: (w) => `/labs/${w.labId}/preview`, cells: pStaff },
  "page /attempts/[attemptId]": { req: (w) => `/attempts/${w.attemptId}`, cells: pOwner },

  // --- server actions, called as the page's form does (POST with the Next-Action header)
  // checking an answer of the hidden lesson: the staff get the verdict, everyone else learns nothing
  "action components/lesson/check-question-action.ts#checkAnswer": {
    req: action((w) => `/lessons/${w.hiddenLesson}`, (w) => w.actionIds["components/lesson/check-question-action.ts#checkAnswer"], []),
    cells: (() => {
      const gone = says(200, /no longer exists/);
      const graded = says(200, /"verdict"/);
      return cells("signin", gone, gone, gone, graded, graded, graded);
    })(),
  },
  // "Sign out" in the header: anyone may post it; it ends the caller's session on the server (so a copy
  // of its cookie ends too) and expires the cookie: made after the other rows, like signing out everywhere
  "action lib/auth/sign-out.ts#signOutHere": {
    req: action(() => "/", (w) => w.actionIds["lib/auth/sign-out.ts#signOutHere"], []),
    copy: true,
    last: true,
    cells: (() => {
      // an anonymous caller is sent to sign in before the action runs; a signed-in one is redirected by it
      const out = (r: Answer) => {
        // Next.js answers an action's redirect with 303, or 200 carrying the sign-in page it already rendered
        expect([200, 303], "the action's redirect to the sign-in page").toContain(r.status);
        expect(r.setCookie.some((c) => /next-auth\.session-token=;/.test(c) && /max-age=0/i.test(c)), "the session cookie expired").toBe(true);
      };
      return cells("signin", out, out, out, out, out, out);
    })(),
  },
  // signing up is open to everyone; a form that does not parse answers with its fields and nothing else
  "action app/(auth)/signup/actions.ts#signUpAction": {
    req: action(() => "/signup", (w) => w.actionIds["app/(auth)/signup/actions.ts#signUpAction"], [{}]),
    cells: everyone(says(200, /Check the highlighted fields/)),
  },
};

// the action rows need arguments from the world: filled in when the request is made
const ACTION_ARGS: Record<string, (w: World) => unknown[]> = {
  "action components/lesson/check-question-action.ts#checkAnswer": (w) => [w.hiddenQuestion, "1 mA"],
};

// ---------------------------------------------------------------------------------------------------
// Running the cells

/** At most this many requests at once: the server is one process on a small machine. */
const limit = (() => {
  let active = 0;
  const waiting: (() => void)[] = [];
  return async <T>(fn: () => Promise<T>): Promise<T> => {
    if (active >= 8) await new Promise<void>((r) => waiting.push(r));
    active++;
    try {
      return await fn();
    } finally {
      active--;
      waiting.shift()?.();
    }
  };
})();

async function ask(key: string, row: Row, role: Role, caller: Client = as[role]): Promise<Answer> {
  const client = row.copy ? caller.copy() : caller;
  return limit(async () => {
    let r = await row.req(w, client);
    if (ACTION_ARGS[key] && typeof r === "object") r = { ...r, init: { ...r.init, body: JSON.stringify(ACTION_ARGS[key](w)) } };
    const { path: p, init } = typeof r === "string" ? { path: r, init: {} } : r;
    const res = await client.fetch(p, init);
    return { status: res.status, location: res.headers.get("location"), setCookie: res.headers.getSetCookie(), text: await res.text() };
  });
}

/**
 * Whose marks each caller must never see. API answers must not even name the other student's attempt (a
 * page's payload repeats the address it was asked for, so pages are checked for names and messages).
 */
function forbiddenMarks(role: Role, api: boolean): string[] {
  const s = [MARK.student, w.student.email, ...(api ? [w.attemptId] : [])];
  const p = [MARK.peer, w.peer.email, ...(api ? [w.peerAttemptId] : [])];
  if (role === "anonymous" || role === "outsider") return [...s, ...p];
  if (role === "student") return p;
  if (role === "peer") return s;
  return [];
}

// What a page answered. notFound() and forbidden() leave Next.js's error digest, which the browser
// renders as the nearest not-found.tsx or forbidden.tsx (their words are in every page's payload, so
// they prove nothing); a redirect after the page began streaming is a refresh to the new address.
const NOT_FOUND = /NEXT_HTTP_ERROR_FALLBACK;404/;
const FORBIDDEN = /NEXT_HTTP_ERROR_FALLBACK;403/;
const TO_SIGNIN = /http-equiv="refresh" content="\d+;url=\/signin(\?|")/;
const REDIRECT = /NEXT_REDIRECT;/;

function check(key: string, role: Role, cell: Cell, r: Answer) {
  const where = `${key} as ${role} (expected ${typeof cell === "function" ? "see the row" : cell}): answered ${r.status} ${r.location ?? ""}`;
  if (typeof cell === "function") cell(r);
  else if (cell === "signin") {
    if (r.status === 200) expect(r.text, where).toMatch(TO_SIGNIN);
    else {
      expect([303, 307, 308], where).toContain(r.status);
      expect(r.location, where).toMatch(/\/signin(\?|$)/);
    }
  } else if (cell === "page") {
    expect(r.status, where).toBe(200);
    for (const not of [NOT_FOUND, FORBIDDEN, TO_SIGNIN, REDIRECT]) expect(not.test(r.text), `${where}: matches ${not}`).toBe(false);
  } else if (cell === "notFound") {
    expect([200, 404], where).toContain(r.status);
    expect(NOT_FOUND.test(r.text), `${where}: shows no not-found page`).toBe(true);
    expect(FORBIDDEN.test(r.text), `${where}: shows a refusal`).toBe(false);
  } else {
    expect(r.status, where).toBe(cell);
    if (key.startsWith("page ")) {
      if (cell === 403) expect(FORBIDDEN.test(r.text), `${where}: shows no refusal`).toBe(true);
    } else if (r.status >= 400) {
      // an API refusal is the JSON error shape; a 400 names the field
      const body = JSON.parse(r.text);
      expect(typeof body.error?.code, where).toBe("string");
      expect(typeof body.error?.message, where).toBe("string");
      if (r.status === 400) expect(Object.keys(body.error.fields ?? {}).length, where).toBeGreaterThan(0);
    }
  }
  for (const mark of forbiddenMarks(role, !key.startsWith("page ") && !key.startsWith("action "))) expect(r.text.includes(mark), `${where}: carries another person's data (${mark})`).toBe(false);
}

describe("access matrix", () => {
  it("has a row for every route handler, page and server action in app/ (and none for what is gone)", () => {
    const found = discovered();
    const missing = found.filter((k) => !(k in ROWS));
    const stale = Object.keys(ROWS).filter((k) => !found.includes(k));
    expect(missing, `no row in the access matrix (tests/http/access-matrix.test.ts) for: ${missing.join(", ")}`).toEqual([]);
    expect(stale, `rows for what app/ no longer has: ${stale.join(", ")}`).toEqual([]);
  });

  it("finds the build's id for every server action", () => {
    for (const k of Object.keys(ROWS).filter((k) => k.startsWith("action "))) expect(w.actionIds[k.slice("action ".length)], k).toMatch(/^[0-9a-f]{20,}$/);
  });

  const byOrder = Object.entries(ROWS);
  for (const [key, row] of byOrder.filter(([, r]) => !r.last)) {
    it.concurrent(key, async () => {
      const answers = await Promise.all(ROLES.map((role) => ask(key, row, role)));
      ROLES.forEach((role, i) => check(key, role, row.cells[role], answers[i]));
    });
  }
  // Grades held: the instructor holds the lab's grades; every route and page a student reads then
  // answers without the student's score, points, verdicts or grade history (the course has this one lab).
  it("grades held: no student-facing route or page shows a score", async () => {
    const hold = (held: boolean) => as.instructor.json(`/api/labs/${w.labId}/grades-held`, { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify({ held }) });
    expect((await hold(true)).status).toBe(200);
    try {
      const read = byOrder.filter(([key, row]) => (key.startsWith("GET ") || key.startsWith("page ")) && !row.last);
      const studentFacing = read.filter(([, row]) => row.cells.student === 200 || row.cells.student === "page");
      expect(studentFacing.map(([k]) => k)).toEqual(expect.arrayContaining(["GET /api/attempts/[attemptId]/history", "GET /api/labs/[labId]/attempts", "page /courses/[courseId]", "page /attempts/[attemptId]"]));
      const leaks: string[] = [];
      for (const [key, row] of studentFacing) {
        const r = await ask(key, row, "student");
        check(key, "student", row.cells.student, r);
        // JSON keys of a graded result (in API answers and in a page's payload alike) and the words pages use
        for (const leak of [/\\?"(score|rawScore|scoreBefore|scoreAfter|pointsBefore|pointsAfter|total)\\?"\s*:\s*-?\d/, /\\?"verdict\\?"\s*:/, /\b\d+(\.\d+)? of \d+(\.\d+)? points\b/]) {
          const m = r.text.match(leak);
          if (m) leaks.push(`${key}: ${m[0]}`);
        }
      }
      expect(leaks, "a student reads a held grade").toEqual([]);
    } finally {
      expect((await hold(false)).status).toBe(200);
    }
  });

  // A disabled account: the site admin disables a member who is signed in; from then on every route,
  // page and action answers that member's cookie as it answers someone not signed in.
  it("a disabled account: every route, page and action answers as to a caller not signed in", async () => {
    const member = await addPerson("disabled", { courseId: w.courseId, role: "student" });
    const client = await clientFor(member.email);
    expect((await client.json("/api/courses")).status).toBe(200);
    const r = await as.admin.json(`/api/admin/users/${member.id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ disabled: true }) });
    expect(r.status).toBe(200);
    expect(r.body.user).toEqual({ id: member.id, disabled: true });
    for (const [key, row] of byOrder) {
      const answer = await ask(key, row, "anonymous", client);
      // the proxy sees only that a cookie is there, so an action runs: "Check yourself" asks to sign in,
      // the others answer as to someone outside the course; routes and pages as to an anonymous caller
      if (key === "action components/lesson/check-question-action.ts#checkAnswer") check(key, "outsider", says(200, /Sign in to check your answers/), answer);
      else if (key.startsWith("action ")) check(key, "outsider", row.cells.outsider, answer);
      else check(key, "anonymous", row.cells.anonymous, answer);
    }
  });

  for (const [key, row] of byOrder.filter(([, r]) => r.last)) {
    it(key, async () => {
      const answers = await Promise.all(ROLES.map((role) => ask(key, row, role)));
      ROLES.forEach((role, i) => check(key, role, row.cells[role], answers[i]));
    });
  }
});
