// Flow 4 in a real browser: a demo student submits an attempt; the site admin finds the graded message
// in the development mailbox (HTML and text), follows its link to the attempt page; the student opens the
// same link and sees the graded attempt. The lab (a fixed circuit) is made here through the API.
import fs from "node:fs";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { fixedLabBody } from "../support/mail";
import { baseURL, demo, launch, newPage, signIn } from "./harness";

let browser: Browser;
let staff: { context: BrowserContext; page: Page };
let student: { context: BrowserContext; page: Page };
let admin: { context: BrowserContext; page: Page };
let labId: string;
const TITLE = `Mail lab ${Date.now().toString(36)}`;
const shots = path.join(import.meta.dirname, "..", ".artifacts");

async function apiJson(context: BrowserContext, method: "GET" | "POST" | "PATCH", url: string, data?: unknown) {
  const res = await context.request.fetch(url, { method, data, headers: data ? { "content-type": "application/json", origin: baseURL } : undefined });
  return { status: res.status(), body: await res.json().catch(() => null) };
}

beforeAll(async () => {
  fs.mkdirSync(shots, { recursive: true });
  browser = await launch();
  staff = await newPage(browser);
  student = await newPage(browser);
  admin = await newPage(browser);
  await signIn(staff.page, demo.instructor);
  await signIn(student.page, demo.student2);
  await signIn(admin.page, demo.admin);
  const courses = await apiJson(staff.context, "GET", "/api/courses");
  const course = (courses.body.courses as { id: string; code: string; role: string }[]).find((c) => c.code === "ELM-214" && c.role === "instructor");
  const created = await apiJson(staff.context, "POST", `/api/courses/${course!.id}/labs`, fixedLabBody(TITLE));
  expect(created.status).toBe(201);
  labId = created.body.lab.id;
  expect((await apiJson(staff.context, "PATCH", `/api/labs/${labId}`, { status: "published" })).status).toBe(200);
});

afterAll(async () => {
  await browser?.close();
});

describe("flow 4: graded e-mail", () => {
  it("from a submission to the message in the development mailbox and its link back to the attempt", async () => {
    const page = student.page;
    await page.goto(`/labs/${labId}`);
    // the form registers its fields when it hydrates (the button is enabled then): type after that
    const submit = page.getByRole("button", { name: "Submit for grading" });
    await expect.poll(() => submit.isEnabled(), { timeout: 20_000 }).toBe(true);
    // Ohm's law on the fixed circuit: 3.3 V / 1 kΩ = 3.3 mA (2 points); "1 A" for the metered current is wrong (0 of 3)
    await page.getByLabel("1. Current without the meter").fill("3.3 mA");
    await page.getByLabel("2. Current the meter shows").fill("1 A");
    await submit.click();
    // the attempt's page; while it has not come, what the form says (a failure then names the reason)
    const arrived = async () => (/\/attempts\/[0-9a-f-]{36}$/.test(page.url()) ? "on the attempt page" : `on ${page.url()}: ${(await page.getByTestId("submission-form").innerText().catch(() => "")).slice(-300)}`);
    await expect.poll(arrived, { timeout: 60_000 }).toBe("on the attempt page");
    const attemptPath = new URL(page.url()).pathname;

    // the admin's mailbox: the message arrives through the queue, the worker and the local SMTP server
    const box = admin.page;
    const message = box.getByTestId("mail-message").filter({ hasText: TITLE });
    await expect
      .poll(
        async () => {
          await box.goto(`/dev/mailbox?to=${encodeURIComponent(demo.student2)}`);
          return message.count();
        },
        { timeout: 40_000, interval: 1000 },
      )
      .toBe(1);
    expect(await message.getByRole("heading").textContent()).toContain("2 / 5");
    await message.getByText("As plain text").click();
    expect(await message.locator("pre").textContent()).toContain("Score: 2 / 5 points");
    await box.screenshot({ path: path.join(shots, "mailbox.png"), fullPage: false });

    // the link in the HTML message opens the attempt page
    const frame = message.frameLocator("iframe");
    const link = frame.getByRole("link", { name: "Open the attempt" });
    const href = await link.getAttribute("href");
    expect(new URL(href!).pathname).toBe(attemptPath);
    const [opened] = await Promise.all([admin.context.waitForEvent("page", { timeout: 20_000 }), link.click()]);
    await opened.waitForURL((u) => u.pathname === attemptPath, { timeout: 20_000 });
    await opened.close();

    // the student, following the same link, sees the graded attempt
    await page.goto(href!);
    await expect.poll(() => page.getByTestId("score-value").textContent()).toMatch(/^2\b/);
    await page.screenshot({ path: path.join(shots, "mail-link-attempt.png") });
  });
});
