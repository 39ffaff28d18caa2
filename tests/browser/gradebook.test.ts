// The instructor's gradebook in a real browser: filter a section, sort by a lab, open a cell's attempt,
// download the CSV. The demo course has forty students in sections A and B (scripts/seed/demo.ts).
import fs from "node:fs";
import Papa from "papaparse";
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

describe("the gradebook page", () => {
  it("the instructor filters a section, sorts by a lab, opens a cell's attempt and downloads the CSV", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, demo.instructor);
    await page.getByRole("link", { name: "Measuring Small Currents" }).click();
    await page.getByRole("link", { name: "Gradebook" }).first().click();
    await page.waitForURL(/\/courses\/[0-9a-f-]{36}\/gradebook$/);
    const table = page.getByRole("table", { name: /Counted scores of every student/ });
    await table.waitFor();
    const count = page.getByTestId("student-count");
    await count.waitFor();
    const total = Number((await count.textContent())!.match(/of (\d+) students/)![1]);
    expect(total).toBeGreaterThanOrEqual(40);
    await page.screenshot({ path: "tests/.artifacts/gradebook-full.png", fullPage: true });

    // Section A only: every visible row says A, and the count drops.
    await page.getByLabel("Section").selectOption("A");
    await expect.poll(async () => (await count.textContent())!.startsWith(`${total} of`)).toBe(false);
    const shown = Number((await count.textContent())!.split(" ")[0]);
    expect(shown).toBeLessThan(total);
    expect(shown).toBeGreaterThan(0);
    const sectionCells = await table.locator("tbody tr[data-student] td:nth-of-type(1)").allTextContents();
    expect(sectionCells.length).toBeGreaterThan(0);
    expect(new Set(sectionCells)).toEqual(new Set(["A"]));

    // Sort by the first lab: descending first, scores never increase down the rows.
    const labHeader = table.locator("thead th").nth(2);
    const labName = (await labHeader.getByRole("button").textContent())!;
    await labHeader.getByRole("button").click();
    await expect.poll(() => labHeader.getAttribute("aria-sort")).toBe("descending");
    const scores = (await table.locator("tbody tr[data-student] td:nth-of-type(2)").allTextContents())
      .map((t) => parseFloat(t))
      .map((n) => (Number.isNaN(n) ? -1 : n));
    expect(scores.length).toBeGreaterThan(1);
    for (let i = 1; i < scores.length; i++) expect(scores[i]).toBeLessThanOrEqual(scores[i - 1]);
    expect(labName.length).toBeGreaterThan(0);

    // Open the top cell's attempt.
    const cell = table.locator("tbody tr[data-student] td:nth-of-type(2) a").first();
    const href = (await cell.getAttribute("href"))!;
    expect(href).toMatch(/^\/attempts\/[0-9a-f-]{36}$/);
    await cell.click();
    await page.waitForURL(new RegExp(`${href}$`));
    await page.getByRole("heading", { level: 1 }).waitFor();
    await page.goBack();
    await table.waitFor();
    await page.screenshot({ path: "tests/.artifacts/gradebook.png" });

    // Download the CSV.
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Download CSV" }).click()]);
    const file = await download.path();
    const rows = Papa.parse<string[]>(fs.readFileSync(file, "utf8").replace(/^\uFEFF/, ""), { skipEmptyLines: true }).data;
    expect(rows[0].slice(0, 3)).toEqual(["name", "email", "section"]);
    expect(rows[0].at(-1)).toBe("total");
    expect(rows.length - 1).toBe(total);
    await context.close();
  });

  it("a student is refused the gradebook but sees their own row on the course page", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, demo.student);
    await page.getByRole("link", { name: "Measuring Small Currents" }).click();
    await page.getByTestId("student-grades").waitFor();
    expect(await page.getByTestId("student-total").textContent()).toMatch(/%|no lab counts yet/);
    const courseUrl = page.url();
    const res = await page.goto(`${courseUrl}/gradebook`);
    expect(res?.status()).toBe(403);
    await context.close();
  });
});
