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

describe("signing in", () => {
  it("a demo student signs in and sees their course with their role", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, demo.student);
    await page.getByRole("heading", { name: "My courses" }).waitFor();
    const course = page.getByRole("link", { name: "Measuring Small Currents" });
    await course.click();
    await page.waitForURL(/\/courses\/[0-9a-f-]{36}$/);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("Measuring Small Currents");
    expect(await page.getByText("You are in this course as: Student.").count()).toBe(1);
    await context.close();
  });

  it("a demo student opening the roster is refused (403) inside the app's header, with the way back to the course", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, demo.student);
    await page.getByRole("link", { name: "Measuring Small Currents" }).click();
    await page.waitForURL(/\/courses\/[0-9a-f-]{36}$/);
    const courseUrl = page.url();
    expect(await page.getByRole("link", { name: "Roster" }).count()).toBe(0);
    const res = await page.goto(courseUrl + "/roster");
    expect(res?.status()).toBe(403);
    const refusal = page.getByRole("alert").filter({ hasText: "Not available to you" });
    expect(await refusal.textContent()).toContain("Only the course staff can see this.");
    expect(await refusal.textContent()).toContain("ask the course's instructor");
    expect(await page.getByRole("table").count()).toBe(0);
    // the header stays: the person can still reach their settings and sign out
    await page.getByRole("banner").getByRole("link", { name: "Settings", exact: true }).waitFor();
    await refusal.getByRole("link", { name: "Back to the course", exact: true }).click();
    await page.waitForURL(courseUrl);
    await page.getByText("You are in this course as: Student.").waitFor();
    await context.close();
  });

  it("a TA sees the roster of about forty students", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, demo.ta);
    await page.getByRole("link", { name: "Measuring Small Currents" }).click();
    await page.getByRole("link", { name: "Roster" }).click();
    await page.waitForURL(/\/roster$/);
    const rows = await page.locator("tbody tr").count();
    expect(rows).toBeGreaterThanOrEqual(40);
    await context.close();
  });

  it("a wrong password shows the error message and stays on the sign-in page", async () => {
    const { context, page } = await newPage(browser);
    await page.goto("/signin");
    await page.getByLabel("E-mail").fill(demo.student);
    await page.getByLabel("Password").fill("not the password");
    await page.getByRole("button", { name: "Sign in" }).click();
    const alert = page.getByRole("alert").filter({ hasText: "do not match" });
    await alert.waitFor();
    expect(await alert.textContent()).toContain("That e-mail and password do not match an account.");
    expect(new URL(page.url()).pathname).toBe("/signin");
    await context.close();
  });

  it("an anonymous visitor is sent to the sign-in page", async () => {
    const { context, page } = await newPage(browser);
    await page.goto("/");
    expect(new URL(page.url()).pathname).toBe("/signin");
    await context.close();
  });

  it("a new student signs up with the join code and lands in the course", async () => {
    const { context, page } = await newPage(browser);
    await page.goto("/signup");
    await page.getByLabel("Your name").fill("Wren Calder");
    await page.getByLabel("E-mail").fill(`wren.${Date.now()}@test.example`);
    await page.getByLabel("Password").fill("a long enough password");
    await page.getByLabel("Course join code").fill("LARK-000");
    await page.getByRole("button", { name: "Create account and join" }).click();
    await page.getByText("That join code does not match any course.").first().waitFor();
    await page.getByLabel("Course join code").fill("lark-214");
    await page.getByRole("button", { name: "Create account and join" }).click();
    await page.waitForURL(/\/courses\/[0-9a-f-]{36}$/);
    expect(await page.getByText("You are in this course as: Student.").count()).toBe(1);
    await context.close();
  });
});
