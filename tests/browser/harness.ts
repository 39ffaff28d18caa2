// Shared set-up for browser tests: Debian's chromium driven by playwright-core against the production
// build that scripts/test.ts serves (SHUNTWISE_TEST_URL). Each test file opens one browser.
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";

export const baseURL = process.env.SHUNTWISE_TEST_URL ?? "http://127.0.0.1:3100";

export const demo = {
  password: "bench-demo-2026",
  admin: "admin@larkmoor-tech.example",
  instructor: "instructor@larkmoor-tech.example",
  ta: "ta.one@larkmoor-tech.example",
  student: "student.one@larkmoor-tech.example",
  student2: "student.two@larkmoor-tech.example",
};

export async function launch(): Promise<Browser> {
  // playwright gives every launch a fresh, empty profile folder of its own.
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

export async function newPage(browser: Browser): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL });
  const page = await context.newPage();
  return { context, page };
}

/** Signs in through the real sign-in form and waits for the home page. */
export async function signIn(page: Page, email: string, password = demo.password): Promise<void> {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/signin"), { timeout: 20_000 });
}
