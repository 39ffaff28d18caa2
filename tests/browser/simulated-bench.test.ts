// The simulated bench in a real browser: a demo student opens a lab taken on the simulated bench (the bench's
// code loads only then), switches ranges and the filter, logs a reading; the readings the page showed are
// replayed by the API exactly (same seed, run and time), by the student and by a TA with userId=. Then the
// student submits the logged reading and the attempt is recorded as taken on the simulated bench.
import { gzipSync } from "node:zlib";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseURL, demo, launch, newPage, signIn } from "./harness";

let browser: Browser;
let staff: { context: BrowserContext; page: Page };
let student: { context: BrowserContext; page: Page };
let ta: { context: BrowserContext; page: Page };
let labId: string;
let courseId: string;
const TITLE = `Browser lab: burden on the simulated bench ${Date.now().toString(36)}`;

async function apiJson(context: BrowserContext, method: "GET" | "POST" | "PATCH", url: string, data?: unknown) {
  const res = await context.request.fetch(url, { method, data, headers: data ? { "content-type": "application/json", origin: baseURL } : undefined });
  return { status: res.status(), body: await res.json().catch(() => null) };
}

beforeAll(async () => {
  browser = await launch();
  [staff, student, ta] = await Promise.all([newPage(browser), newPage(browser), newPage(browser)]);
  await signIn(staff.page, demo.instructor);
  await signIn(student.page, demo.student);
  await signIn(ta.page, demo.ta);
  const courses = await apiJson(staff.context, "GET", "/api/courses");
  const course = (courses.body.courses as { id: string; code: string; role: string }[]).find((c) => c.code === "ELM-214" && c.role === "instructor")!;
  courseId = course.id;
  const created = await apiJson(staff.context, "POST", `/api/courses/${course.id}/labs`, {
    title: TITLE,
    templateKey: "shunt-burden",
    bench: "simulated",
    spec: {
      template: "shunt-burden",
      parameters: { supplyVoltage: { mode: "fixed", value: 0.4 }, loadResistance: { mode: "fixed", value: 1000 }, shuntResistance: { mode: "fixed", value: 100 } },
    },
    questions: [{ quantity: "indicatedCurrent", kind: "bench", points: 2 }],
    policy: {},
    attemptsAllowed: 3,
    counting: "best",
    opensAt: null,
    dueAt: "2099-06-30T17:00:00Z",
    latePenaltyPercentPerDay: 10,
    lateFloorPercent: 50,
    showExpected: "after_attempt",
    instructions: "Read the current on the 500 µA range.",
    safetyNotes: "Keep the supply off while you change the shunt.",
  });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  labId = created.body.lab.id;
  expect((await apiJson(staff.context, "PATCH", `/api/labs/${labId}`, { status: "published" })).status).toBe(200);
});

afterAll(async () => {
  await Promise.all([staff?.context.close(), student?.context.close(), ta?.context.close()]);
  await browser?.close();
});

/** What the display shows now, with the run it belongs to. */
async function display(page: Page) {
  const d = page.getByTestId("bench-display");
  const read = async (name: string) => (await d.getAttribute(name)) ?? "";
  return { t: Number(await read("data-t")), value: await read("data-value"), range: await read("data-range"), runRange: await read("data-run-range"), filter: await read("data-run-filter"), from: Number(await read("data-run-from")) };
}

describe("the simulated bench in the browser", () => {
  it("loads only when opened, shows the student's readings, and the API replays exactly what the page showed", async () => {
    const { page, context } = student;
    const scripts: string[] = [];
    const sizes = new Map<string, number>();
    page.on("response", (r) => {
      if (!r.url().includes("/_next/static/chunks/")) return;
      scripts.push(r.url());
      void r.body().then((b) => sizes.set(r.url(), gzipSync(b, { level: 9 }).byteLength)).catch(() => undefined);
    });
    await page.goto(`/labs/${labId}`);
    await expect.poll(() => page.getByTestId("open-bench").isVisible()).toBe(true);
    const before = scripts.length;
    await page.getByTestId("open-bench").click();
    await page.getByTestId("simulated-bench").waitFor();
    expect(scripts.length).toBeGreaterThan(before); // the simulator's code came when the bench opened
    // what opening the bench added: at most 40 KB of compressed JavaScript (gzip -9 of each file)
    await expect.poll(() => scripts.slice(before).every((u) => sizes.has(u))).toBe(true);
    const added = scripts.slice(before).reduce((sum, u) => sum + sizes.get(u)!, 0);
    console.log(`simulated bench: ${scripts.length - before} files, ${(added / 1024).toFixed(1)} KB compressed added on opening`);
    expect(added).toBeLessThanOrEqual(40 * 1024);

    await page.getByText("500 µA", { exact: true }).click();
    await expect.poll(async () => (await display(page)).runRange).toBe("r500u");
    // wait for a few display updates on the new range
    await expect.poll(async () => { const d = await display(page); return d.t - d.from; }, { timeout: 15_000 }).toBeGreaterThan(1);
    const shown = await display(page);
    // 0.4 V across 1 kΩ with the range's 100 Ω: about 363.6 µA (PHYSICS.md §2), not 400 µA
    expect(Math.abs(Number(shown.value) - 363.6e-6)).toBeLessThan(0.01 * 363.6e-6);
    const index = Math.round((shown.t - shown.from) * 4);
    const q = `range=${shown.runRange}&filter=${shown.filter}&from=${shown.from}&count=${index + 1}`;
    const replay = await apiJson(context, "GET", `/api/labs/${labId}/bench/readings?${q}`);
    expect(replay.status).toBe(200);
    const last = replay.body.readings.at(-1);
    expect(last.t).toBe(shown.t);
    expect(String(last.value)).toBe(shown.value);
    expect(last.range).toBe(shown.range);

    // the TA replays the same reading with the student's id
    const members = await apiJson(ta.context, "GET", `/api/courses/${courseId}/members`);
    const studentId = (members.body.members as { userId: string; email: string }[]).find((m) => m.email === demo.student)!.userId;
    const byTa = await apiJson(ta.context, "GET", `/api/labs/${labId}/bench/readings?${q}&userId=${studentId}`);
    expect(byTa.status).toBe(200);
    expect(byTa.body.readings).toEqual(replay.body.readings);

    // log the reading and submit it
    await page.getByRole("button", { name: "Log this reading" }).click();
    await expect.poll(() => page.getByTestId("bench-log").locator("tbody tr").count()).toBe(1);
    const logged = (await display(page)).value;
    expect(logged).not.toBe("");
  });

  it("switching the filter off and back starts a new run that the replay follows too", async () => {
    const { page, context } = student;
    await page.getByLabel(/Low-pass filter/).uncheck();
    await expect.poll(async () => (await display(page)).filter).toBe("off");
    await expect.poll(async () => { const d = await display(page); return d.t - d.from; }, { timeout: 15_000 }).toBeGreaterThan(0.5);
    const shown = await display(page);
    const index = Math.round((shown.t - shown.from) * 4);
    const replay = await apiJson(context, "GET", `/api/labs/${labId}/bench/readings?range=${shown.runRange}&filter=off&from=${shown.from}&count=${index + 1}`);
    expect(String(replay.body.readings.at(-1).value)).toBe(shown.value);
  });
});
