// Flow 2 in a real browser: the demo instructor builds a lab from a template (ranges typed with units,
// questions, dates), previews it with a sample student's values ("Draw another" changes them) and
// publishes it; a demo student then finds it in the course's labs list and opens it. After the student
// submits, an edit that changes grading warns first and shows the regrade's progress bar to the end.
// A teaching assistant is refused the builder.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseURL, demo, launch, newPage, signIn } from "./harness";

let browser: Browser;
let courseId = "";
let labId = "";
const title = `Burden of a shunt, bench ${Date.now().toString(36)}`;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

function localInput(d: Date): string {
  const p = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}T${p(d.getHours())}:${p(d.getMinutes())}`;
}

async function openCourse(page: Page): Promise<string> {
  await page.getByRole("link", { name: "Measuring Small Currents" }).click();
  await page.waitForURL(/\/courses\/[0-9a-f-]{36}$/);
  return new URL(page.url()).pathname.split("/")[2];
}

/** The builder's form is hydrated (typing before that could be overwritten). */
async function builderReady(page: Page): Promise<void> {
  await page.locator('form[data-ready="true"]').waitFor({ timeout: 20_000 });
}

async function valuesTable(page: Page): Promise<string> {
  const table = page.getByTestId("handout-values");
  await table.waitFor();
  return (await table.locator("tbody").innerText()).trim();
}

describe("lab builder (flow 2)", () => {
  it("the instructor builds a lab, previews it, draws another sample and publishes it", async () => {
    const { context, page } = await newPage(browser);
    try {
      await signIn(page, demo.instructor);
      courseId = await openCourse(page);
      await page.goto(`/courses/${courseId}/labs`);
      await page.getByRole("link", { name: "New lab" }).click();
      await page.waitForURL(/\/labs\/new$/);
      await builderReady(page);

      // Nothing typed yet: the form says what is missing, in place.
      await page.getByRole("button", { name: "Save draft" }).click();
      await expect(page.getByRole("alert").filter({ hasText: "Some fields need attention" }).count()).resolves.toBe(1);
      const titleInput = page.getByLabel("Title", { exact: true });
      expect(await titleInput.getAttribute("aria-invalid")).toBe("true");
      const described = (await titleInput.getAttribute("aria-describedby")) ?? "";
      expect(await page.locator(`[id="${described.split(" ").pop()}"]`).innerText()).toContain("Give the lab a title.");

      await titleInput.fill(title);
      await page.getByLabel("Circuit template").selectOption({ label: "Burden voltage of a shunt ammeter" });

      // Supply voltage drawn from a range; a wrong unit is refused as it is typed.
      const supply = page.getByRole("group", { name: "Supply voltage" });
      await supply.getByLabel("How students get this value").selectOption("range");
      await supply.getByLabel("Smallest value").fill("2 mA");
      await supply.getByText(/That is a current/).waitFor();
      await supply.getByLabel("Smallest value").fill("2 V");
      await supply.getByText("Read as 2 V").waitFor();
      await supply.getByLabel("Largest value").fill("5000 mV");
      await supply.getByText("Read as 5 V").waitFor();

      // Load resistance: a range snapped to E12, 5 % parts.
      const load = page.getByRole("group", { name: "Load resistance" });
      await load.getByLabel("How students get this value").selectOption("range");
      await load.getByLabel("Smallest value").fill("1k");
      await load.getByText("Read as 1 kΩ").waitFor();
      await load.getByLabel("Largest value").fill("47 kΩ");
      await load.getByLabel("Resistor series").selectOption("E12");
      await load.getByLabel("Tolerance (%)").fill("5");

      // Shunt: picked from a list.
      const shunt = page.getByRole("group", { name: "Shunt (meter input) resistance" });
      await shunt.getByLabel("How students get this value").selectOption("list");
      await shunt.getByLabel("Values to pick from").fill("1 Ω; 10 Ω; 100 Ω");

      // Questions: keep the true current and the burden voltage; the burden is a bench reading worth 2 points.
      await page.getByRole("button", { name: "Remove question 4" }).click();
      await page.getByRole("button", { name: "Remove question 2" }).click();
      const q2 = page.getByRole("group", { name: "Question 2" });
      expect(await q2.getByLabel("Quantity asked").inputValue()).toBe("burdenVoltage");
      await q2.getByLabel("Kind of answer").selectOption("bench");
      await q2.getByLabel("Points").fill("2");
      await q2.getByLabel("Tolerance (%)").fill("3");

      const now = Date.now();
      await page.getByLabel("Opens", { exact: true }).fill(localInput(new Date(now - 24 * 3600e3)));
      await page.getByLabel("Due", { exact: true }).fill(localInput(new Date(now + 7 * 24 * 3600e3)));
      await page.getByLabel("Attempts allowed").fill("3");
      await page.getByLabel("Instructions (Markdown)").fill("Build the circuit on the breadboard.\n\n- Measure the **burden voltage** across the shunt.\n- Note `I_meas`.");
      await page.getByLabel("Safety notes").fill("Keep the supply below 6 V.");

      await page.getByRole("button", { name: "Save and preview" }).click();
      await page.waitForURL(/\/labs\/[0-9a-f-]{36}\/preview$/, { timeout: 20_000 });
      labId = new URL(page.url()).pathname.split("/")[2];

      // The handout as a student sees it.
      expect(await page.getByRole("heading", { level: 1 }).innerText()).toBe(title);
      await page.getByText("Sample student 1.").waitFor();
      expect(await page.getByRole("note", { name: /Safety/ }).innerText()).toContain("Keep the supply below 6 V.");
      expect(await page.locator("article strong").filter({ hasText: "burden voltage" }).count()).toBe(1);
      expect(await page.locator('svg[role="img"][data-template="shunt-burden"]').count()).toBe(1);
      expect(await page.locator("[data-question]").count()).toBe(2);
      expect(await page.locator("[data-question]").nth(1).innerText()).toMatch(/Burden voltage[\s\S]*bench reading · 2 points/);
      const first = await valuesTable(page);
      expect(first).toMatch(/Load resistance/);
      const shuntValue = await page.getByTestId("value-shuntResistance").innerText();
      expect(["1.00 Ω", "10.0 Ω", "100 Ω"]).toContain(shuntValue);

      // Another sample student: different values.
      await page.getByRole("link", { name: "Draw another" }).click();
      await page.waitForURL(/\?sample=2$/);
      await page.getByText("Sample student 2.").waitFor();
      const second = await valuesTable(page);
      expect(second).not.toBe(first);

      // Back to the builder, publish.
      await page.getByRole("link", { name: "Back to editing" }).click();
      await page.waitForURL(/\/edit$/);
      await builderReady(page);
      expect(await page.getByLabel("Title", { exact: true }).inputValue()).toBe(title);
      expect(await page.getByRole("group", { name: "Load resistance" }).getByLabel("Largest value").inputValue()).toBe("47 kΩ");
      await page.getByRole("button", { name: "Publish" }).click();
      await page.waitForURL(new RegExp(`/courses/${courseId}/labs\\?notice=published$`), { timeout: 20_000 });
      const row = page.locator(`tr[data-lab="${labId}"]`);
      expect(await row.innerText()).toMatch(/Open/);
      expect(await row.innerText()).toMatch(/published/);
    } finally {
      await context.close();
    }
  });

  it("a student sees the published lab in the course's labs list and opens it", async () => {
    expect(labId).not.toBe("");
    const { context, page } = await newPage(browser);
    try {
      await signIn(page, demo.student);
      await page.goto(`/courses/${courseId}/labs`);
      const row = page.locator(`tr[data-lab="${labId}"]`);
      expect(await row.innerText()).toMatch(/Open/);
      expect(await page.getByRole("link", { name: "Edit" }).count()).toBe(0);
      expect(await page.getByText("Draft", { exact: true }).count()).toBe(0);
      await row.getByRole("link", { name: title }).click();
      await page.waitForURL(new RegExp(`/labs/${labId}$`));
      await page.getByRole("heading", { name: title }).first().waitFor();
      // Publishing kept the instructions and safety notes.
      await page.getByText("Keep the supply below 6 V.").first().waitFor();
      await page.getByText("burden voltage", { exact: true }).first().waitFor();

      // The student is refused the builder and the preview.
      await page.goto(`/labs/${labId}/edit`);
      await page.getByRole("alert").filter({ hasText: "Not available to you" }).waitFor();
      await page.goto(`/labs/${labId}/preview`);
      await page.getByRole("alert").filter({ hasText: "Not available to you" }).waitFor();

      // One attempt, so that the next test's edit recomputes a grade.
      const res = await page.request.post(`/api/labs/${labId}/attempts`, {
        headers: { origin: baseURL },
        data: { idempotencyKey: `builder-test-${labId}`, readings: { q1: "1 mA", q2: "10 mV" } },
      });
      expect(res.status()).toBe(201);
    } finally {
      await context.close();
    }
  });

  it("editing the published lab with an attempt warns, then shows the regrade's progress to the end", async () => {
    expect(labId).not.toBe("");
    const { context, page } = await newPage(browser);
    try {
      await signIn(page, demo.instructor);
      await page.goto(`/labs/${labId}/edit`);
      await builderReady(page);
      await page.getByText("Published, with 1 attempt.").waitFor();
      // A title change alone recomputes nothing and asks nothing.
      await page.getByLabel("Title", { exact: true }).fill(`${title} (v2)`);
      await page.getByRole("button", { name: "Save changes" }).click();
      await page.getByRole("status").filter({ hasText: /^Saved at/ }).waitFor();
      expect(await page.getByRole("alertdialog").count()).toBe(0);
      expect(await page.getByRole("progressbar").count()).toBe(0);

      await page.getByRole("group", { name: "Question 1" }).getByLabel("Points").fill("3");
      await page.getByRole("button", { name: "Save changes" }).click();
      const dialog = page.getByRole("alertdialog", { name: "Recompute grades?" });
      expect(await dialog.innerText()).toContain("the grades of 1 attempt will be recomputed");
      await dialog.getByRole("button", { name: "Save and recompute 1 attempt" }).click();
      const bar = page.getByRole("progressbar", { name: "Attempts recomputed" });
      await bar.waitFor({ timeout: 20_000 });
      await page.getByText("Regrade finished: 1 attempt recomputed.").waitFor({ timeout: 30_000 });
      expect(await bar.getAttribute("aria-valuenow")).toBe("1");
      expect(await bar.getAttribute("aria-valuemax")).toBe("1");
    } finally {
      await context.close();
    }
  });

  it("a teaching assistant is refused the builder", async () => {
    const { context, page } = await newPage(browser);
    try {
      await signIn(page, demo.ta);
      const id = courseId || (await openCourse(page));
      expect((await page.goto(`/courses/${id}/labs/new`))?.status()).toBe(403);
      const refusal = page.getByRole("alert").filter({ hasText: "Not available to you" });
      expect(await refusal.innerText()).toContain("Only the course's instructors build and edit labs.");
      expect(await page.getByRole("button", { name: "Save draft" }).count()).toBe(0);
      if (labId) {
        await page.goto(`/labs/${labId}/edit`);
        expect(await page.getByRole("alert").filter({ hasText: "Not available to you" }).innerText()).toContain("Only the course's instructors");
        // …but, as course staff, may preview it.
        await page.goto(`/labs/${labId}/preview`);
        await page.getByRole("link", { name: "Draw another" }).waitFor();
        expect(await page.getByRole("link", { name: "Back to editing" }).count()).toBe(0);
      }
      await page.goto(`/courses/${id}/labs`);
      expect(await page.getByRole("link", { name: "New lab" }).count()).toBe(0);
    } finally {
      await context.close();
    }
  });
});
