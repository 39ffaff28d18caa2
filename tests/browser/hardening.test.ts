// In a real browser: the content security policy lets the app's own scripts run (sign-in, a lesson's
// check question, the settings page) with no violation reported, and `?next=` never leaves the site.
import type { Browser, ConsoleMessage, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseURL, demo, launch, newPage } from "./harness";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

function watchViolations(page: Page): string[] {
  const seen: string[] = [];
  page.on("console", (m: ConsoleMessage) => {
    if (/Content Security Policy|Refused to (execute|load|apply|connect)/i.test(m.text())) seen.push(m.text());
  });
  page.on("pageerror", (e) => seen.push(`page error: ${e.message}`));
  return seen;
}

describe("content security policy in the browser", () => {
  it("sign-in with ?next=/\\evil.example lands on the site's home page, and nothing is refused on the way", async () => {
    const { context, page } = await newPage(browser);
    const violations = watchViolations(page);
    try {
      await page.goto("/signin?next=/%5Cevil.example");
      await page.getByLabel("E-mail").fill(demo.student);
      await page.getByLabel("Password").fill(demo.password);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL((url) => !url.pathname.startsWith("/signin"), { timeout: 20_000 });
      const url = new URL(page.url());
      expect(url.origin).toBe(new URL(baseURL).origin);
      expect(url.pathname).toBe("/");
      await page.getByRole("heading", { name: "My courses" }).waitFor();

      // a lesson's check question runs a server action from a hydrated client component
      await page.goto("/lessons/burden-voltage");
      const q = page.locator('[data-question="burden-low-rail"]');
      await q.getByLabel(/Your answer/).fill("16.36 mA"); // DOMAIN §2 2c [FORMULA]
      await q.getByRole("button", { name: "Check" }).click();
      await q.getByText("Correct.").waitFor({ timeout: 15_000 });

      await page.goto("/settings");
      await page.getByRole("heading", { name: "Settings" }).waitFor();
      expect(violations).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
