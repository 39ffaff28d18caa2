// Every demo login lands on a page with something to do: the student's next lab due, the staff's review
// requests and labs due, the site admin's list of every course with a way to create one.
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

async function landing(email: string, shot: string) {
  const { context, page } = await newPage(browser);
  await signIn(page, email);
  await page.getByRole("heading", { level: 1 }).waitFor();
  return { context, page, done: async () => { await page.screenshot({ path: `tests/.artifacts/${shot}.png`, fullPage: true }); await context.close(); } };
}

describe("where each demo login lands", () => {
  it("the student sees the next lab due in their course and can open it", async () => {
    const { page, done } = await landing(demo.student, "landing-student");
    const card = page.getByRole("listitem").filter({ hasText: "Measuring Small Currents" });
    await card.getByText(/Next due:/).waitFor();
    await card.getByText(/Next due:/).getByRole("link").click();
    await page.waitForURL(/\/labs\/[0-9a-f-]{36}$/);
    await done();
  });

  it("the instructor sees review requests and labs closing per course, and the course home lists what to do", async () => {
    const { page, done } = await landing(demo.instructor, "landing-instructor");
    const card = page.getByRole("listitem").filter({ hasText: "Measuring Small Currents" });
    await card.getByText(/open review requests?/).waitFor();
    await card.getByText(/closes .*submitted, \d+ missing/).first().waitFor();
    await card.getByRole("link", { name: "Measuring Small Currents" }).click();
    await page.getByRole("region", { name: /Open review requests/ }).waitFor();
    await page.getByRole("region", { name: "Labs closing this week" }).waitFor();
    await page.getByRole("region", { name: "Drafts to finish" }).getByRole("link").first().waitFor();
    expect(await page.getByRole("region", { name: "Join code" }).textContent()).toContain("LARK-214");
    await page.screenshot({ path: "tests/.artifacts/course-home-instructor.png", fullPage: true });
    // the bench parts list of a lab whose circuits have resistors, from the lab's page
    const courseId = new URL(page.url()).pathname.split("/")[2];
    const labs = (await (await page.context().request.get(`/api/courses/${courseId}/labs`)).json()).labs as { id: string; templateKey: string; status: string }[];
    const withResistors = labs.find((l) => l.status === "published" && l.templateKey === "shunt-burden")!;
    await page.goto(`/labs/${withResistors.id}`);
    await page.getByRole("link", { name: "Bench parts list" }).click();
    await page.waitForURL(/\/parts$/);
    const parts = page.getByRole("table", { name: "Resistors per value and per section" });
    await parts.waitFor();
    expect(await parts.getByRole("row").count()).toBeGreaterThan(1);
    await page.getByRole("link", { name: "Download CSV" }).waitFor();
    await page.screenshot({ path: "tests/.artifacts/parts-list.png", fullPage: true });
    await done();
  });

  it("the TA sees their staff course and the course they take as a student", async () => {
    const { page, done } = await landing(demo.ta, "landing-ta");
    await page.getByRole("listitem").filter({ hasText: "Measuring Small Currents" }).getByText(/open review requests?/).waitFor();
    // a student in the second demo course: that card says what is due there
    const other = page.getByRole("listitem").filter({ hasText: "Precision Instrumentation Workshop" });
    await other.getByText(/Next due:|open lab|Nothing is due/).waitFor();
    await done();
  });

  it("the site admin sees every course with its counts and a way to create one", async () => {
    const { page, done } = await landing(demo.admin, "landing-admin");
    const table = page.getByRole("table", { name: "Every course" });
    await table.waitFor();
    expect(await table.getByRole("row").count()).toBeGreaterThanOrEqual(3); // header and the two demo courses
    await page.getByRole("link", { name: "Create a course" }).waitFor();
    await done();
  });
});
