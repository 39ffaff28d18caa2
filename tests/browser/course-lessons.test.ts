import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demo, launch, newPage, signIn } from "./harness";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("a course's lessons", () => {
  it("a student follows the course's lesson list into a lesson and on to the next one in the course", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, demo.student);
    await page.getByRole("link", { name: "Measuring Small Currents" }).click();
    await page.getByRole("link", { name: "Lessons" }).first().click();
    await page.waitForURL(/\/courses\/[0-9a-f-]{36}\/lessons$/);
    const items = page.locator("main ol > li");
    expect(await items.count()).toBe(15);
    // the demo plan opens the last three lessons over the coming weeks
    expect(await page.getByText(/^opens /).count()).toBe(3);
    await items.first().getByRole("link").click();
    await page.waitForURL(/\/lessons\/bench-safety\?course=/);
    const courseNav = page.getByRole("navigation", { name: "This course's lessons" });
    await courseNav.waitFor();
    await courseNav.getByRole("link", { name: /In your course: What an ammeter does/ }).click();
    await page.waitForURL(/\/lessons\/burden-voltage\?course=/);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toMatch(/ammeter/i);
    await context.close();
  });

  it("the instructor hides a lesson and students no longer see it in the list", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, demo.instructor);
    await page.getByRole("link", { name: "Measuring Small Currents" }).click();
    await page.getByRole("link", { name: "Lessons" }).first().click();
    const plan = page.getByRole("form", { name: "Lesson plan" });
    const noise = plan.getByRole("checkbox", { name: /noise floor/i });
    await noise.uncheck();
    await plan.getByRole("button", { name: "Save lesson plan" }).click();
    await page.getByText("The lesson plan is saved.").waitFor();
    await context.close();

    const s = await newPage(browser);
    await signIn(s.page, demo.student2);
    await s.page.getByRole("link", { name: "Measuring Small Currents" }).click();
    await s.page.getByRole("link", { name: "Lessons" }).first().click();
    await s.page.waitForURL(/\/lessons$/);
    // the demo plan shows fifteen lessons; one is now hidden
    expect(await s.page.locator("main ol > li").count()).toBe(14);
    expect(await s.page.getByText(/noise floor/i).count()).toBe(0);
    await s.context.close();
  });
});
