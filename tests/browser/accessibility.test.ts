// Accessibility of the four flows (PRODUCT.md "The four flows"): axe-core runs in every page a student,
// an instructor, a teaching assistant, the site admin and a visitor use, signed in as the right demo
// role, and no serious or critical violation is allowed (WCAG 2.x A and AA rules plus axe's best
// practices). Then flow 1 is done with the keyboard alone: sign in, open the lab, type the readings,
// submit and read the feedback, with only Tab, Shift+Tab, Enter and Space, and a visible focus ring on
// every control that is reached; then it signs out from the header the same way.
// axe-core's own source is evaluated in the page (the page's content security policy allows only scripts
// with its per-request nonce, so a <script> tag would be refused; evaluation through the debugging
// protocol is not subject to it).
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseURL, demo, launch, newPage, signIn } from "./harness";

const axeSource = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");
const DAY = 24 * 3600 * 1000;
const TITLE = `Keyboard lab ${Date.now().toString(36)}`;

type Session = { context: BrowserContext; page: Page };
let browser: Browser;
const as: Record<"student" | "instructor" | "ta" | "admin" | "visitor", Session> = {} as never;
let courseId: string;
let openLabId: string;
let studentAttemptId: string;
let reviewAttemptId: string;
let studentUserId: string;
let keyboardLabId: string;

async function apiJson(context: BrowserContext, method: "GET" | "POST" | "PATCH", url: string, data?: unknown) {
  const res = await context.request.fetch(url, { method, data, headers: data ? { "content-type": "application/json", origin: baseURL } : undefined });
  return { status: res.status(), body: await res.json().catch(() => null) };
}

type Violation = { id: string; impact: string | null; help: string; nodes: { target: string[] }[] };

/** axe-core on the page as it is now: the serious and critical violations, one line per element. */
async function violations(page: Page): Promise<string[]> {
  if (!(await page.evaluate(() => "axe" in window))) await page.evaluate(axeSource);
  const found = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(ctx: Document, opts: object): Promise<{ violations: Violation[] }> } }).axe;
    const r = await axe.run(document, { resultTypes: ["violations"] });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => ({ target: n.target })) }));
  });
  return found
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .flatMap((v) => v.nodes.map((n) => `${v.id} (${v.impact}) at ${n.target.join(" ")}: ${v.help}`));
}

beforeAll(async () => {
  browser = await launch();
  for (const role of ["student", "instructor", "ta", "admin", "visitor"] as const) as[role] = await newPage(browser);
  await Promise.all([signIn(as.student.page, demo.student), signIn(as.instructor.page, demo.instructor)]);
  await Promise.all([signIn(as.ta.page, demo.ta), signIn(as.admin.page, demo.admin)]);

  const courses = await apiJson(as.instructor.context, "GET", "/api/courses");
  courseId = (courses.body.courses as { id: string; code: string }[]).find((c) => c.code === "ELM-214")!.id;

  // The lab of flow 1, made here on a fixed circuit (5 V, 470 Ω, 10 Ω), so the answers are Ohm's law by
  // hand (DOMAIN.md §2): indicated current 5/480 A = 10.4167 mA, burden voltage 10 Ω × that = 0.10417 V.
  const created = await apiJson(as.instructor.context, "POST", `/api/courses/${courseId}/labs`, labBody(TITLE));
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  keyboardLabId = created.body.lab.id;
  expect((await apiJson(as.instructor.context, "PATCH", `/api/labs/${keyboardLabId}`, { status: "published" })).status).toBe(200);

  // A second lab, for the pages of its attempts (feedback, review request, the TA's review): four
  // questions and two attempts, so the student's two attempts show every kind of verdict and, with no
  // attempt left, the expected values and worked solutions. Expected (Ohm's law by hand): true current
  // 5/470 A = 10.638 mA, indicated 10.417 mA, burden 0.10417 V.
  const other = await apiJson(as.instructor.context, "POST", `/api/courses/${courseId}/labs`, {
    ...labBody(`${TITLE} (pages)`),
    questions: [
      { quantity: "indicatedCurrent", kind: "prediction", points: 2 },
      { quantity: "trueCurrent", kind: "prediction", points: 2 },
      { quantity: "burdenVoltage", kind: "prediction", points: 2 },
      { quantity: "loadingErrorPercent", kind: "prediction", points: 2 },
    ],
    attemptsAllowed: 2,
  });
  expect(other.status, JSON.stringify(other.body)).toBe(201);
  openLabId = other.body.lab.id;
  expect((await apiJson(as.instructor.context, "PATCH", `/api/labs/${openLabId}`, { status: "published" })).status).toBe(200);
  // correct; close (10.8 mA is 1.5 % off, inside twice the 1 % band); a prefix slip (V for mV); wrong
  const sub = await apiJson(as.student.context, "POST", `/api/labs/${openLabId}/attempts`, {
    idempotencyKey: `a11y-${Date.now()}`,
    readings: { q1: "10.42 mA", q2: "10.8 mA", q3: "104.2 V", q4: "50 %" },
  });
  expect(sub.status, JSON.stringify(sub.body)).toBe(201);
  studentAttemptId = sub.body.attempt.id;
  // a second attempt with a review request waits in the TA's queue
  const sub2 = await apiJson(as.student.context, "POST", `/api/labs/${openLabId}/attempts`, {
    idempotencyKey: `a11y-2-${Date.now()}`,
    readings: { q1: "10.42 mA", q2: "10.64 mA", q3: "0.1042 V", q4: "2.08 %" },
  });
  expect(sub2.status, JSON.stringify(sub2.body)).toBe(201);
  reviewAttemptId = sub2.body.attempt.id;
  expect((await apiJson(as.student.context, "POST", `/api/attempts/${reviewAttemptId}/review`, { message: "Please look at question 4 again." })).status).toBeLessThan(300);
  const members = await apiJson(as.instructor.context, "GET", `/api/courses/${courseId}/members`);
  studentUserId = (members.body.members as { userId: string; email: string }[]).find((m) => m.email === demo.student)!.userId;
}, 180_000);

function labBody(title: string) {
  return {
    title,
    templateKey: "shunt-burden",
    spec: { template: "shunt-burden", parameters: { supplyVoltage: { mode: "fixed", value: 5 }, loadResistance: { mode: "fixed", value: 470 }, shuntResistance: { mode: "fixed", value: 10 } } },
    questions: [
      { quantity: "indicatedCurrent", kind: "prediction", points: 2 },
      { quantity: "burdenVoltage", kind: "prediction", points: 2 },
    ],
    policy: { relativeTolerance: 0.01 },
    attemptsAllowed: 3,
    counting: "best",
    opensAt: new Date(Date.now() - DAY).toISOString(),
    dueAt: "2099-06-30T17:00:00Z",
    latePenaltyPercentPerDay: 0,
    lateFloorPercent: 0,
    showExpected: "after_attempt",
    instructions: "Measure the current with the meter in the loop.",
    safetyNotes: "Set the supply's current limit before you connect the meter.",
  };
}

afterAll(async () => {
  for (const s of Object.values(as)) await s?.context.close();
  await browser?.close();
});

/** A lesson's calculators load as they come into view: bring each one in and wait until it has loaded. */
async function revealCalculators(page: Page): Promise<void> {
  const pending = page.locator("[data-calculator-pending]");
  for (let n = await pending.count(); n > 0; n = await pending.count()) {
    await pending.first().scrollIntoViewIfNeeded();
    await page.waitForFunction((before) => document.querySelectorAll("[data-calculator-pending]").length < before, n, { timeout: 20_000 });
  }
}

/** Opens each page and collects its violations; one failure lists every page's. */
async function audit(session: Session, paths: string[]): Promise<void> {
  const report: string[] = [];
  for (const path of paths) {
    const res = await session.page.goto(path);
    expect(res?.status(), `${path} answered ${res?.status()}`).toBeLessThan(400);
    await session.page.waitForLoadState("load");
    await revealCalculators(session.page);
    for (const v of await violations(session.page)) report.push(`${path}: ${v}`);
  }
  expect(report, `serious or critical accessibility violations:\n${report.join("\n")}`).toEqual([]);
}

describe("accessibility of the four flows (axe-core)", () => {
  it("a visitor's pages: sign-in, sign-up, forgot password, reset password", async () => {
    await audit(as.visitor, ["/signin", "/signup", "/forgot-password", "/reset-password/not-a-real-token"]);
  });

  it("a student's pages: home, course, lessons, a lab's handout and submission, feedback with the review request, settings", async () => {
    await audit(as.student, [
      "/",
      `/courses/${courseId}`,
      `/courses/${courseId}/lessons`,
      `/courses/${courseId}/labs`,
      "/lessons",
      "/lessons/burden-voltage",
      "/lessons/duty-cycled-loads",
      `/labs/${openLabId}`,
      `/attempts/${studentAttemptId}`,
      `/attempts/${reviewAttemptId}`,
      "/settings",
    ]);
  });

  it("an instructor's pages: course, lab builder and preview, parts, roster, gradebook, settings, reviews", async () => {
    await audit(as.instructor, [
      "/",
      `/courses/${courseId}`,
      `/courses/${courseId}/labs`,
      `/courses/${courseId}/labs/new`,
      `/labs/${openLabId}`,
      `/labs/${openLabId}/edit`,
      `/labs/${openLabId}/preview`,
      `/labs/${openLabId}/parts`,
      `/courses/${courseId}/lessons`,
      `/courses/${courseId}/roster`,
      `/courses/${courseId}/gradebook`,
      `/courses/${courseId}/gradebook/students/${studentUserId}`,
      `/courses/${courseId}/settings`,
      `/courses/${courseId}/reviews`,
    ]);
  });

  it("a teaching assistant's pages: the review queue, one attempt's review and regrade, its feedback", async () => {
    await audit(as.ta, ["/", `/courses/${courseId}/reviews`, `/courses/${courseId}/reviews/${reviewAttemptId}`, `/attempts/${reviewAttemptId}`]);
  });

  it("the site admin's pages: home, courses, the outbox, the development mailbox", async () => {
    await audit(as.admin, ["/", "/admin/courses", "/admin/outbox", "/dev/mailbox"]);
  });
});

type Focused = { tag: string; text: string; label: string; href: string | null; visibleRing: boolean };

/** What has the focus now, and whether a focus ring shows on it (:focus-visible with an outline or a shadow). */
async function focused(page: Page): Promise<Focused | null> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return null;
    const style = getComputedStyle(el);
    const ring = (style.outlineStyle !== "none" && parseFloat(style.outlineWidth) > 0) || style.boxShadow !== "none";
    const labelled = (el as HTMLInputElement).labels?.[0]?.textContent ?? el.getAttribute("aria-label") ?? "";
    return {
      tag: el.tagName.toLowerCase(),
      text: (el.textContent ?? "").replace(/\s+/g, " ").trim(),
      label: labelled.replace(/\s+/g, " ").trim(),
      href: el.getAttribute("href"),
      visibleRing: el.matches(":focus-visible") && ring,
    };
  });
}

/** Presses Tab (or Shift+Tab) until the focused element is the one wanted; asserts its focus ring shows. */
async function tabTo(page: Page, what: string, wanted: (f: Focused) => boolean, key: "Tab" | "Shift+Tab" = "Tab"): Promise<Focused> {
  const seen: string[] = [];
  for (let i = 0; i < 120; i++) {
    await page.keyboard.press(key);
    const f = await focused(page);
    if (f && wanted(f)) {
      expect(f.visibleRing, `no visible focus ring on ${what}`).toBe(true);
      return f;
    }
    seen.push(f ? `${f.tag} "${f.label || f.text.slice(0, 40)}"` : "(nothing)");
  }
  throw new Error(`${key} never reached ${what}; passed: ${seen.join(", ")}`);
}

describe("flow 1 with the keyboard alone", () => {
  it("a student signs in, opens the lab, types the readings, submits and reads the feedback with Tab, Shift+Tab, Enter and Space", async () => {
    const { context, page } = await newPage(browser);
    try {
      await page.goto("/signin");
      await page.getByLabel("E-mail").waitFor();
      await tabTo(page, "the e-mail field", (f) => f.tag === "input" && /E-mail/.test(f.label));
      await page.keyboard.type(demo.student);
      await tabTo(page, "the password field", (f) => f.tag === "input" && /Password/.test(f.label));
      await page.keyboard.type(demo.password);
      await page.keyboard.press("Enter");
      await page.waitForURL((url) => !url.pathname.startsWith("/signin"), { timeout: 20_000 });
      await page.getByRole("heading", { level: 1 }).waitFor();

      // home → the course → its labs → the lab
      await tabTo(page, "the course's link", (f) => f.tag === "a" && f.href === `/courses/${courseId}`);
      await page.keyboard.press("Enter");
      await page.waitForURL(`**/courses/${courseId}`);
      await tabTo(page, "the course's labs link", (f) => f.tag === "a" && f.href === `/courses/${courseId}/labs`);
      await page.keyboard.press("Enter");
      await page.waitForURL(`**/courses/${courseId}/labs`);
      await tabTo(page, "the lab's link", (f) => f.tag === "a" && f.href === `/labs/${keyboardLabId}`);
      await page.keyboard.press("Enter");
      await page.waitForURL(`**/labs/${keyboardLabId}`);
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(TITLE);
      await page.getByTestId("submission-form").waitFor();
      // the form registers its fields when it hydrates (the button is enabled then): type after that
      await expect.poll(() => page.getByRole("button", { name: "Submit for grading" }).isEnabled(), { timeout: 20_000 }).toBe(true);

      // the readings, typed into each field reached with Tab; Shift+Tab goes back to the first
      await tabTo(page, "the first reading", (f) => f.tag === "input" && /^1\. Current the meter shows/.test(f.label));
      await page.keyboard.type("10.42 mA");
      await tabTo(page, "the second reading", (f) => f.tag === "input" && /^2\. Burden voltage/.test(f.label));
      await page.keyboard.type("0.1042 V");
      await tabTo(page, "the first reading again", (f) => f.tag === "input" && /^1\. Current the meter shows/.test(f.label), "Shift+Tab");
      expect(await page.getByLabel("1. Current the meter shows").inputValue()).toBe("10.42 mA");
      await expect.poll(() => page.getByTestId("echo-readings.q1").textContent()).toMatch(/^✓ Read as/);

      // submit with Space on the button, then read the feedback
      await tabTo(page, "the submit button", (f) => f.tag === "button" && /Submit for grading/.test(f.text));
      await page.keyboard.press("Space");
      await page.waitForURL(/\/attempts\/[0-9a-f-]{36}$/, { timeout: 30_000 });
      const score = page.getByTestId("score-value");
      await score.waitFor({ timeout: 20_000 });
      // 10.42 mA and 0.1042 V are within 1 % of 10.4167 mA and 0.10417 V (Ohm's law by hand, above)
      expect((await score.textContent())?.replace(/\s+/g, " ")).toBe("4 of 4 points");
      const results = page.getByTestId("result");
      expect(await results.count()).toBe(2);
      for (let k = 0; k < 2; k++) expect(await results.nth(k).getAttribute("data-verdict")).toBe("correct");
      // the feedback's own controls are reachable too: the review request's box takes the focus, visibly
      await tabTo(page, "the review request box", (f) => f.tag === "textarea");
      const list = await apiJson(context, "GET", `/api/labs/${keyboardLabId}/attempts`);
      expect(list.body.attempts).toHaveLength(1);

      // and signs out from the header: back to the sign-in page, and the session is gone
      await tabTo(page, "the sign-out button", (f) => f.tag === "button" && f.text === "Sign out", "Shift+Tab");
      await page.keyboard.press("Enter");
      await page.waitForURL((url) => url.pathname === "/signin", { timeout: 20_000 });
      await page.goto("/");
      expect(new URL(page.url()).pathname).toBe("/signin");
    } finally {
      await context.close();
    }
  });
});
