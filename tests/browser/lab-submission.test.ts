// Flow 1 in a real browser: a demo student opens a published lab, reads the handout with their own
// values, types readings with units (one refused for its unit, then fixed), attaches a logged trace with
// upload progress, double-clicks submit (one attempt), and sees per-question feedback with a score, the
// trace analysis and a worked solution; then asks for a review. The instructor sees the attempt in the
// lab's table. The lab is made here through the API, so the test does not depend on the demo's labs.
import { AxeBuilder } from "@axe-core/playwright";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { formatQuantity, templates, type Params } from "@/lib/grader";
import { squareWaveCsv } from "@/lib/trace";
import { baseURL, demo, launch, newPage, signIn } from "./harness";

let browser: Browser;
// One signed-in context per person for the whole file: sign-in hashes a password, which is slow on a busy machine.
let staff: { context: BrowserContext; page: Page };
let student: { context: BrowserContext; page: Page };
let labId: string;
let attemptId: string;
const TITLE = `Browser lab: a sleeping node ${Date.now().toString(36)}`;

async function apiJson(context: BrowserContext, method: "GET" | "POST" | "PATCH", url: string, data?: unknown) {
  const res = await context.request.fetch(url, { method, data, headers: data ? { "content-type": "application/json", origin: baseURL } : undefined });
  return { status: res.status(), body: await res.json().catch(() => null) };
}

async function seriousViolations(page: Page, include?: string): Promise<string[]> {
  let axe = new AxeBuilder({ page });
  if (include) axe = axe.include(include);
  const results = await axe.analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

beforeAll(async () => {
  browser = await launch();
  // The demo instructor makes and publishes a duty-cycle lab: currents drawn per student, a 10 ms wake
  // every second (so a generated trace samples the edges exactly).
  staff = await newPage(browser);
  student = await newPage(browser);
  await signIn(staff.page, demo.instructor);
  await signIn(student.page, demo.student);
  const context = staff.context;
  const courses = await apiJson(context, "GET", "/api/courses");
  expect(courses.status).toBe(200);
  const course = (courses.body.courses as { id: string; code: string; role: string }[]).find((c) => c.code === "ELM-214" && c.role === "instructor");
  expect(course).toBeDefined();
  const created = await apiJson(context, "POST", `/api/courses/${course!.id}/labs`, {
    title: TITLE,
    templateKey: "duty-cycle",
    spec: {
      template: "duty-cycle",
      parameters: {
        sleepCurrent: { mode: "range", min: 2e-6, max: 9e-6 },
        activeCurrent: { mode: "range", min: 0.01, max: 0.04 },
        activeTime: { mode: "fixed", value: 0.01 },
        period: { mode: "fixed", value: 1 },
        batteryCapacity: { mode: "fixed", value: 792 },
        usableFraction: { mode: "fixed", value: 0.8 },
      },
    },
    questions: [
      { quantity: "averageCurrent", kind: "bench", points: 2 },
      { quantity: "chargePerWake", kind: "prediction", points: 1 },
      { quantity: "batteryLife", kind: "prediction", points: 1 },
    ],
    policy: {},
    attemptsAllowed: 3,
    counting: "best",
    opensAt: null,
    dueAt: "2099-06-30T17:00:00Z",
    latePenaltyPercentPerDay: 10,
    lateFloorPercent: 50,
    showExpected: "after_attempt",
    instructions: "Log the node's supply current for a few seconds, then answer from your own values.",
    safetyNotes: "Keep the supply off while you change the shunt.",
  });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  labId = created.body.lab.id;
  const published = await apiJson(context, "PATCH", `/api/labs/${labId}`, { status: "published" });
  expect(published.status, JSON.stringify(published.body)).toBe(200);
});

afterAll(async () => {
  await staff?.context.close();
  await student?.context.close();
  await browser?.close();
});

describe("lab submission in the browser (flow 1)", () => {
  it("a student reads their handout, types readings with units, attaches a trace, submits once and sees graded feedback", async () => {
    const { context, page } = student;
    const handout = await apiJson(context, "GET", `/api/labs/${labId}/handout`);
    expect(handout.status).toBe(200);
    const params = handout.body.handout.params as Params;
    const expected = templates["duty-cycle"].compute(params) as Record<string, number>;

    await page.goto(`/labs/${labId}`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(TITLE);
    // the handout shows this student's own values
    for (const p of handout.body.handout.parameters as { key: string; shown: string }[]) {
      expect(await page.getByTestId(`value-${p.key}`).textContent()).toBe(p.shown);
    }
    expect(await page.getByTestId("attempts-left").textContent()).toBe("3 of 3 attempts left.");
    const submit = page.getByRole("button", { name: "Submit for grading" });
    await expect.poll(() => submit.isEnabled(), { timeout: 20_000 }).toBe(true); // hydrated: typing is kept

    // a wrong dimension is refused as it is typed, with a message naming what is wanted
    const average = page.getByLabel("1. Average current");
    await average.fill("0.2 mV");
    const echo = page.getByTestId("echo-readings.q1");
    await expect.poll(() => echo.textContent()).toMatch(/asks for a current/);
    expect(await average.getAttribute("aria-invalid")).toBe("true");
    expect(await echo.getAttribute("aria-live")).toBe("polite");

    // fixed: typed in mA, read back in µA
    const avgText = `${(expected.averageCurrent * 1e3).toPrecision(4)} mA`;
    await average.fill(avgText);
    await expect.poll(() => echo.textContent()).toBe(`✓ Read as ${formatQuantity(Number((expected.averageCurrent * 1e3).toPrecision(4)) * 1e-3, "A")}`);
    expect(await average.getAttribute("aria-invalid")).toBeNull();
    await page.getByLabel("2. Charge per wake").fill(`${(expected.chargePerWake * 1e6).toPrecision(4)} uC`);
    await page.getByLabel("3. Battery life").fill(`${(expected.batteryLife / 3600).toPrecision(4)} h`);
    await expect.poll(() => page.getByTestId("echo-readings.q3").textContent()).toMatch(/^✓ Read as .* h( \(= .*\))?$/);

    // a file of the wrong type is refused where it was attached, and the readings stay
    await page.getByLabel("Scope capture").setInputFiles({ name: "notes.txt", mimeType: "text/plain", buffer: Buffer.from("not an image at all") });
    await expect.poll(() => page.getByTestId("file-image").getByRole("alert").textContent(), { timeout: 15_000 }).toMatch(/PNG or JPEG/);
    await page.getByTestId("file-image").getByRole("button", { name: "Remove file" }).click();
    expect(await average.inputValue()).toBe(avgText);

    // the logged trace: five periods sampled every millisecond, with a few garbage lines
    const csv = squareWaveCsv({
      sleepCurrent: params.sleepCurrent as number,
      activeCurrent: params.activeCurrent as number,
      activeTime: 0.01,
      period: 1,
      cycles: 5,
      sampleInterval: 0.001,
      units: { time: "ms", current: "mA" },
      garbageEvery: 1500,
    });
    await page.getByLabel("Logged current trace").setInputFiles({ name: "node-trace.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
    const traceField = page.getByTestId("file-trace");
    await traceField.getByText("Attached node-trace.csv").waitFor({ timeout: 20_000 });
    const bar = traceField.getByRole("progressbar");
    expect(await bar.getAttribute("aria-valuenow")).toBe("100");
    expect(await traceField.textContent()).toMatch(/bad rows? skipped/);

    // a double click makes one attempt
    await submit.dblclick();
    await page.waitForURL(/\/attempts\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    attemptId = page.url().split("/").pop()!;

    // feedback fetched in the page: score, one verdict per question, expected values, solution
    const score = page.getByTestId("score-value");
    await score.waitFor({ timeout: 20_000 });
    expect((await score.textContent())?.replace(/\s+/g, " ")).toBe("4 of 4 points");
    const results = page.getByTestId("result");
    expect(await results.count()).toBe(3);
    for (let k = 0; k < 3; k++) {
      expect(await results.nth(k).getAttribute("data-verdict")).toBe("correct");
      expect(await results.nth(k).getByTestId("verdict").textContent()).toMatch(/Correct/);
    }
    // two attempts are left and the lab is open: no expected value, band or worked solution yet
    expect(await results.first().textContent()).not.toMatch(/Expected/);
    expect(await results.first().getByText("Worked solution with your numbers").count()).toBe(0);
    expect(await page.getByTestId("score").textContent()).toMatch(/stay hidden while you can still earn points/);
    expect(await results.first().textContent()).toMatch(/trace averages .* agrees/);

    // the trace's analysis and plot
    const trace = page.getByTestId("trace-analysis");
    await trace.waitFor({ timeout: 15_000 });
    expect(await trace.getByTestId("trace-rows").textContent()).toMatch(/rows read; [1-9]\d* bad rows? skipped/);
    await trace.locator("canvas").first().waitFor({ state: "attached", timeout: 15_000 });
    await expect.poll(() => page.getByTestId("attempt-history").textContent()).toMatch(/Attempt 1: 4 of 4 points \(this one\)/);
    expect(await seriousViolations(page)).toEqual([]);

    // exactly one attempt was made
    const list = await apiJson(context, "GET", `/api/labs/${labId}/attempts`);
    expect(list.body.attempts.map((a: { id: string }) => a.id)).toEqual([attemptId]);

    // asking for a review: too short is refused with a message, then sent
    const review = page.getByTestId("review");
    const box = review.getByLabel("What should the staff look at again?");
    await box.fill("hi");
    await review.getByRole("button", { name: "Ask for a review" }).click();
    await expect.poll(() => review.textContent()).toMatch(/at least 5 characters/);
    await box.fill("Please check question 3: I used the usable fraction from the handout.");
    await review.getByRole("button", { name: "Ask for a review" }).click();
    await expect.poll(() => review.textContent(), { timeout: 15_000 }).toMatch(/You asked for a review on/);

    // back on the lab page: the attempt is listed and one attempt is used
    await page.goto(`/labs/${labId}`);
    expect(await page.getByTestId("attempts-left").textContent()).toBe("2 of 3 attempts left.");
    expect(await page.getByRole("link", { name: /Attempt 1: 4 of 4 points/ }).getAttribute("href")).toBe(`/attempts/${attemptId}`);
    expect(await seriousViolations(page, '[data-testid="submission-form"]')).toEqual([]);
  });

  it("an answer that does not read is refused before sending, naming the field and keeping what was typed", async () => {
    const { context, page } = student;
    await page.goto(`/labs/${labId}`);
    const submit = page.getByRole("button", { name: "Submit for grading" });
    await expect.poll(() => submit.isEnabled(), { timeout: 20_000 }).toBe(true); // hydrated: typing is kept
    const average = page.getByLabel("1. Average current");
    await average.fill("9.1");
    await submit.click();
    const alert = page.getByTestId("submission-form").getByRole("alert").first();
    await expect.poll(() => alert.textContent()).toMatch(/Check this answer before submitting: Average current/);
    expect(await average.inputValue()).toBe("9.1");
    expect(await page.getByTestId("echo-readings.q1").textContent()).toMatch(/Add a unit/);
    // nothing was submitted
    const list = await apiJson(context, "GET", `/api/labs/${labId}/attempts`);
    expect(list.body.attempts).toHaveLength(1);
  });

  it("what is typed before the page's scripts arrive is kept and checked; the submit button waits for them", async () => {
    const page = await student.context.newPage();
    let release: () => void = () => undefined;
    const scriptsHeld = new Promise<void>((resolve) => (release = resolve));
    await page.route("**/_next/static/chunks/*.js", async (route) => {
      await scriptsHeld;
      await route.continue();
    });
    try {
      await page.goto(`/labs/${labId}`, { waitUntil: "domcontentloaded" });
      const submit = page.getByRole("button", { name: "Submit for grading", exact: true });
      expect(await submit.isDisabled()).toBe(true);
      const average = page.getByLabel("1. Average current", { exact: true });
      await average.fill("9.1");
      release();
      await expect.poll(() => submit.isEnabled(), { timeout: 30_000 }).toBe(true);
      expect(await average.inputValue()).toBe("9.1");
      await submit.click();
      const alert = page.getByTestId("submission-form").getByRole("alert").first();
      await expect.poll(() => alert.textContent(), { timeout: 20_000 }).toMatch(/Check this answer before submitting: Average current/);
      expect(await page.getByTestId("echo-readings.q1").textContent()).toMatch(/Add a unit/);
      const list = await apiJson(student.context, "GET", `/api/labs/${labId}/attempts`);
      expect(list.body.attempts).toHaveLength(1);
    } finally {
      release();
      await page.close();
    }
  });

  it("the instructor sees the attempt in the lab's table and opens its feedback", async () => {
    const { page } = staff;
    await page.goto(`/labs/${labId}`);
    const table = page.getByTestId("attempts-table");
    const row = table.getByRole("row", { name: /Noor Halvorsen/ });
    expect(await row.textContent()).toMatch(/4 \/ 4/);
    expect(await row.textContent()).toMatch(/3 correct/);
    expect(await row.textContent()).toMatch(/Requested/);
    await row.getByRole("link", { name: /Feedback on attempt 1/ }).click();
    await page.waitForURL(`**/attempts/${attemptId}`);
    await page.getByTestId("score-value").waitFor({ timeout: 20_000 });
    expect(await page.getByTestId("review").textContent()).toMatch(/The student asked for a review/);
    // staff always see the expected values and the worked solution
    const first = page.getByTestId("result").first();
    expect(await first.textContent()).toMatch(/Expected/);
    await first.getByText("Worked solution with your numbers").click();
    expect(await first.getByTestId("worked-solution").locator(".katex").count()).toBeGreaterThan(0);
  });

  it("the instructor holds the lab's grades from its page (the student then sees no score) and releases them", async () => {
    const hold = staff.page.getByRole("region", { name: "Grades released as they are graded" });
    await staff.page.goto(`/labs/${labId}`);
    await hold.getByRole("button", { name: "Hold grades", exact: true }).click();
    const held = staff.page.getByRole("region", { name: "Grades held" });
    await expect.poll(() => held.getByRole("status").textContent(), { timeout: 20_000 }).toBe("Grades are held.");

    await student.page.goto(`/labs/${labId}`);
    expect(await student.page.getByRole("link", { name: "Attempt 1: graded, not yet released", exact: true }).getAttribute("href")).toBe(`/attempts/${attemptId}`);

    await held.getByRole("button", { name: "Release grades", exact: true }).click();
    await expect.poll(() => hold.getByRole("status").textContent(), { timeout: 20_000 }).toMatch(/^Released: \d+ messages? queued\.$/);
    await student.page.goto(`/labs/${labId}`);
    await expect.poll(() => student.page.getByRole("link", { name: /^Attempt 1: 4 of 4 points/ }).count()).toBe(1);
  });
});
