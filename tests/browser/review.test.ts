// Flow 3 in a real browser: a student's attempt with a review request waits in the queue; the demo
// teaching assistant opens the queue from the course page, opens the request, changes one question's
// points with a reason and answers; the student then sees the new score, the answer and the timeline.
// The lab and the attempt are made here through the API on a fixed circuit (5 V, 470 Ω, 10 Ω), so the
// check values are Ohm's law by hand (lib/grader/PHYSICS.md §2): indicated 5/480 A = 10.4167 mA, burden 0.10417 V.
import { AxeBuilder } from "@axe-core/playwright";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseURL, demo, launch, newPage, signIn } from "./harness";
import { attemptWithReview, fixedCircuitLab, publishedLab } from "../http/fixtures";

let browser: Browser;
let ta: { context: BrowserContext; page: Page };
let student: { context: BrowserContext; page: Page };
let courseId: string;
let attemptId: string;
const TITLE = `Review lab ${Date.now().toString(36)}`;

async function apiJson(context: BrowserContext, method: "GET" | "POST" | "PATCH", url: string, data?: unknown) {
  const res = await context.request.fetch(url, { method, data, headers: data ? { "content-type": "application/json", origin: baseURL } : undefined });
  return { status: res.status(), body: await res.json().catch(() => null) };
}

beforeAll(async () => {
  browser = await launch();
  const instructor = await newPage(browser);
  ta = await newPage(browser);
  student = await newPage(browser);
  await signIn(instructor.page, demo.instructor);
  await signIn(ta.page, demo.ta);
  await signIn(student.page, demo.student);
  const courses = await apiJson(instructor.context, "GET", "/api/courses");
  courseId = (courses.body.courses as { id: string; code: string }[]).find((c) => c.code === "ELM-214")!.id;
  const labId = await publishedLab((m, url, data) => apiJson(instructor.context, m, url, data), courseId, fixedCircuitLab({ title: TITLE }));
  await instructor.context.close();
  attemptId = await attemptWithReview((m, url, data) => apiJson(student.context, m, url, data), labId, "Question 2: I think my method was right.");
});

afterAll(async () => {
  await browser?.close();
});

describe("review and regrade in the browser", () => {
  it("a TA opens the queue, opens the request, changes one question's points with a reason and answers", async () => {
    const page = ta.page;
    await page.goto(`/courses/${courseId}`);
    const link = page.getByTestId("review-queue-link");
    await expect.poll(async () => (await link.textContent()) ?? "").toMatch(/Review queue \(\d+ open\)/);
    await link.click();
    await page.waitForURL(`**/courses/${courseId}/reviews`);
    await page.getByLabel("Lab", { exact: true }).selectOption({ label: TITLE });
    const item = page.getByTestId("review-queue").locator("li", { hasText: TITLE });
    await item.waitFor({ timeout: 20_000 });
    expect(await item.getAttribute("data-status")).toBe("open");
    expect(await item.textContent()).toContain("Question 2: I think my method was right.");
    const queueViolations = (await new AxeBuilder({ page }).analyze()).violations.filter((v) => v.impact === "serious" || v.impact === "critical");
    expect(queueViolations.map((v) => v.id)).toEqual([]);
    await page.screenshot({ path: "tests/.artifacts/review-queue.png", fullPage: true });

    await item.getByRole("link").click();
    await page.waitForURL(`**/courses/${courseId}/reviews/${attemptId}`);
    await page.getByTestId("staff-review").waitFor();
    expect(await page.getByTestId("student-message").textContent()).toContain("my method was right");

    const form = page.getByRole("form", { name: "Change one question's points" });
    await form.getByLabel("Question").selectOption("q2");
    await form.getByLabel("New points").fill("1.5");
    // a reason is required
    await form.getByRole("button", { name: "Save the points" }).click();
    await expect.poll(async () => (await form.locator(".field-error").allTextContents()).join(" ")).toMatch(/reason/i);
    await form.getByLabel(/Reason/).fill("Right method, the wrong resistor value");
    await form.getByRole("button", { name: "Save the points" }).click();
    await expect.poll(async () => (await form.getByRole("status").textContent()) ?? "", { timeout: 20_000 }).toContain("8.5 of 10");
    await expect.poll(async () => (await page.getByTestId("score-value").textContent()) ?? "").toMatch(/^8\.5/);

    const answer = page.getByRole("form", { name: "Answer the student" });
    await answer.getByLabel("Your answer").fill("Half the points back for question 2: the method was right, the value was not.");
    await answer.getByRole("button", { name: /Send the answer/ }).click();
    await expect.poll(async () => (await answer.getByRole("status").textContent()) ?? "", { timeout: 20_000 }).toContain("Answer sent");
    await expect.poll(async () => page.getByTestId("grade-timeline").locator("li").evaluateAll((els) => els.map((e) => e.getAttribute("data-kind")))).toEqual(["graded", "override", "review_answer"]);
    await page.screenshot({ path: "tests/.artifacts/review-attempt.png", fullPage: true });
  });

  it("the student sees the new score, the staff's points and reason, the answer and the timeline", async () => {
    const page = student.page;
    await page.goto(`/attempts/${attemptId}`);
    await expect.poll(async () => (await page.getByTestId("score-value").textContent()) ?? "").toMatch(/^8\.5/);
    expect(await page.getByTestId("override").textContent()).toContain("Right method, the wrong resistor value");
    expect(await page.getByTestId("review-answer").textContent()).toContain("Half the points back for question 2");
    const timeline = page.getByTestId("grade-timeline");
    await timeline.locator("li").nth(2).waitFor({ timeout: 20_000 });
    const text = (await timeline.textContent()) ?? "";
    expect(text).toContain("Bram Eskildsen set the points of question 2");
    expect(text).toContain("score 7 → 8.5");
    expect(text).toContain("answered the review request");
    const violations = (await new AxeBuilder({ page }).analyze()).violations.filter((v) => v.impact === "serious" || v.impact === "critical");
    expect(violations.map((v) => v.id)).toEqual([]);
    await page.screenshot({ path: "tests/.artifacts/review-student.png", fullPage: true });
  });

  it("the student asks again after the answer, with a new message, and the request is open again in the TA's queue", async () => {
    const page = student.page;
    await page.goto(`/attempts/${attemptId}`);
    const again = page.getByRole("form", { name: "Ask for a review again" });
    await again.waitFor({ timeout: 20_000 });
    await again.getByLabel("What is still open after the answer?").fill("Question 2 again: I used the resistor value printed on my handout.");
    await again.getByRole("button", { name: "Ask again" }).click();
    const review = page.getByTestId("review");
    await expect.poll(async () => (await review.textContent()) ?? "", { timeout: 20_000 }).toContain("The course staff will look at it");
    expect(await review.textContent()).toContain("Question 2 again: I used the resistor value printed on my handout.");
    // the earlier answer stays, marked as earlier; no second form while the request waits
    expect(await page.getByTestId("review-answer").textContent()).toContain("The staff's earlier answer");
    expect(await page.getByRole("form", { name: /Ask for a review/ }).count()).toBe(0);
    const own = await apiJson(student.context, "GET", `/api/attempts/${attemptId}`);
    expect(own.body.attempt.reviewOpen).toBe(true);
    await page.screenshot({ path: "tests/.artifacts/review-again-student.png", fullPage: true });

    const queue = await apiJson(ta.context, "GET", `/api/courses/${courseId}/reviews?status=open`);
    const mine = (queue.body.reviews as { attemptId: string; message: string; status: string }[]).find((r) => r.attemptId === attemptId);
    expect(mine).toMatchObject({ status: "open", message: "Question 2 again: I used the resistor value printed on my handout." });
  });
});
