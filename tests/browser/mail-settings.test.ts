// In a real browser: a student who forgot their password asks for a link, finds it in the development
// mailbox (as the site admin), chooses a new password (which signs out the session open elsewhere) and
// signs in with it; turns graded e-mails off on the settings page; the admin's outbox page shows the
// day's counts. The student is made here, so the demo logins keep their password.
import path from "node:path";
import { hash } from "@node-rs/argon2";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { e2eDb } from "../support/db";
import { demo, launch, newPage, signIn } from "./harness";

let browser: Browser;
const email = `forgetful.${Date.now().toString(36)}@test.example`;
const OLD = "old bench password 1";
const NEW = "new bench password 2";
const shots = path.join(import.meta.dirname, "..", ".artifacts");

beforeAll(async () => {
  browser = await launch();
  const db = e2eDb();
  try {
    await db.insertInto("users").values({ email, name: "Noor Forgetwell", password_hash: await hash(OLD) }).execute();
  } finally {
    await db.destroy();
  }
});

afterAll(async () => {
  await browser?.close();
});

describe("password reset and settings in the browser", () => {
  it("forgot password: the link from the mailbox sets a new password and signs out the other session", async () => {
    const elsewhere = await newPage(browser);
    await signIn(elsewhere.page, email, OLD);

    const { page } = await newPage(browser);
    await page.goto("/signin");
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    // the form registers its fields when it hydrates (the button is enabled then): type after that
    const send = page.getByRole("button", { name: "Send me a link" });
    await expect.poll(() => send.isEnabled()).toBe(true);
    await page.getByLabel("E-mail").fill(email);
    await send.click();
    await expect.poll(() => page.getByRole("status").textContent()).toContain("If an account uses that address");

    const admin = await newPage(browser);
    await signIn(admin.page, demo.admin);
    const message = admin.page.getByTestId("mail-message").filter({ hasText: "Choose a new Shuntwise password" });
    await expect
      .poll(
        async () => {
          await admin.page.goto(`/dev/mailbox?to=${encodeURIComponent(email)}`);
          return message.count();
        },
        { timeout: 40_000, interval: 1000 },
      )
      .toBe(1);
    const href = await message.frameLocator("iframe").getByRole("link", { name: "Choose a password" }).getAttribute("href");
    expect(href).toMatch(/\/reset-password\//);

    await page.goto(href!);
    await page.getByLabel("New password", { exact: true }).fill(NEW);
    await page.getByLabel("New password again").fill(NEW);
    await page.getByRole("button", { name: "Save the new password" }).click();
    await expect.poll(() => page.getByRole("status").textContent()).toContain("Your new password is set");
    await page.screenshot({ path: path.join(shots, "reset-done.png") });

    // the session opened before the reset is gone: the home page sends it to sign in
    await elsewhere.page.goto("/");
    await elsewhere.page.waitForURL(/\/signin/, { timeout: 20_000 });
    // the link works once
    await page.goto(href!);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("This link no longer works");

    await signIn(page, email, NEW);
    await page.goto("/settings");
    const box = page.getByRole("checkbox", { name: /E-mail me when an attempt is graded/ });
    expect(await box.isChecked()).toBe(true);
    await box.uncheck();
    await expect.poll(() => page.getByText("Graded-attempt e-mails are off.").count()).toBe(1);
    await page.reload();
    expect(await page.getByRole("checkbox", { name: /E-mail me when an attempt is graded/ }).isChecked()).toBe(false);
    await page.screenshot({ path: path.join(shots, "settings.png"), fullPage: true });

    await admin.page.goto("/admin/outbox");
    expect(await admin.page.getByRole("table", { name: "Messages per day" }).getByText(new Date().toISOString().slice(0, 10)).count()).toBe(1);
    await admin.page.screenshot({ path: path.join(shots, "outbox.png"), fullPage: true });
  }, 180_000); // five sign-ins, each hashing a password on a busy machine
});
