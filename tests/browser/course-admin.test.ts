// Running a course in a real browser: the site admin creates a course for the demo instructor, who
// publishes a lab and imports two students from a CSV (one with an account, one invited by e-mail); the
// invited one follows the e-mailed link, chooses a password and finds the course home with the lab that
// is due next.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseURL, demo, launch, newPage, signIn } from "./harness";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const DAY = 24 * 3600 * 1000;

describe("a new course from creation to a student's course home", () => {
  it("admin creates, instructor imports two students, one joins and sees the next lab due", async () => {
    const tag = Date.now().toString(36).slice(-5).toUpperCase();
    const code = `ELM-9${tag}`;
    const title = `Bench Practice ${tag}`;
    const joining = { name: `Rowan Joiner ${tag}`, email: `rowan.${tag.toLowerCase()}@larkmoor-tech.example`, password: "a-long-password-1" };
    const invited = { name: `Sam Invitee ${tag}`, email: `sam.${tag.toLowerCase()}@larkmoor-tech.example` };

    // The joining student has an account already (they signed up for the demo course with its join code).
    const s = await newPage(browser);
    await s.page.goto("/signup");
    await s.page.getByLabel("Your name").fill(joining.name);
    await s.page.getByLabel("E-mail").fill(joining.email);
    await s.page.getByLabel("Password").fill(joining.password);
    await s.page.getByLabel("Course join code").fill("LARK-214");
    await s.page.getByRole("button", { name: /create|sign up|join/i }).click();
    await s.page.waitForURL((u) => !u.pathname.startsWith("/signup"), { timeout: 20_000 });
    await s.context.close();

    // 1. The site admin lands on a page listing every course and creates one.
    const a = await newPage(browser);
    await signIn(a.page, demo.admin);
    await a.page.getByRole("heading", { name: "Every course on the site" }).waitFor();
    await a.page.getByRole("link", { name: "Create a course" }).click();
    await a.page.waitForURL(/\/admin\/courses$/);
    const form = a.page.getByRole("form", { name: "Create a course" });
    await form.getByLabel("Course code").fill(code);
    await form.getByLabel("Title").fill(title);
    await form.getByLabel("Term").fill("Summer 2027");
    await form.getByLabel("Institution").fill("Larkmoor Technical College");
    await form.getByLabel("Instructor's e-mail").fill(demo.instructor);
    await form.getByRole("button", { name: "Create course" }).click();
    await a.page.getByText(`${code} is created with join code`).waitFor();
    await a.page.getByRole("row", { name: new RegExp(code) }).waitFor();
    await a.context.close();

    // 2. The instructor finds the course, publishes a lab due in three days, and imports two students.
    const i = await newPage(browser);
    await signIn(i.page, demo.instructor);
    await i.page.getByRole("link", { name: title }).click();
    await i.page.waitForURL(/\/courses\/[0-9a-f-]{36}$/);
    const courseUrl = i.page.url();
    const courseId = courseUrl.split("/").pop()!;
    const lab = await i.context.request.post(`/api/courses/${courseId}/labs`, {
      headers: { origin: baseURL },
      data: {
        title: "Burden on the bench",
        templateKey: "shunt-burden",
        spec: { template: "shunt-burden", parameters: { supplyVoltage: { mode: "fixed", value: 5 }, loadResistance: { mode: "range", min: 100, max: 470, series: "E12", tolerancePercent: 1 }, shuntResistance: { mode: "fixed", value: 10, tolerancePercent: 1 } } },
        questions: [{ quantity: "trueCurrent", kind: "prediction", points: 2 }],
        attemptsAllowed: 3,
        counting: "best",
        latePenaltyPercentPerDay: 10,
        lateFloorPercent: 50,
        showExpected: "after_attempt",
        opensAt: new Date(Date.now() - DAY).toISOString(),
        dueAt: new Date(Date.now() + 3 * DAY + 3600_000).toISOString(),
      },
    });
    expect(lab.status()).toBe(201);
    const labId = (await lab.json()).lab.id;
    expect((await i.context.request.patch(`/api/labs/${labId}`, { headers: { origin: baseURL }, data: { status: "published" } })).status()).toBe(200);

    await i.page.getByRole("link", { name: "Roster" }).click();
    await i.page.waitForURL(/\/roster$/);
    await i.page.getByLabel("Or paste the rows").fill(`name,email,section\n${joining.name},${joining.email},B1\n${invited.name},${invited.email},B2\n`);
    await i.page.getByRole("button", { name: "Preview import" }).click();
    const preview = i.page.getByRole("table", { name: "Import preview" });
    await preview.waitFor();
    expect(await preview.getByRole("row", { name: /existing account to add/ }).count()).toBe(1);
    expect(await preview.getByRole("row", { name: /new account to invite/ }).count()).toBe(1);
    await i.page.getByRole("button", { name: "Import 2 students" }).click();
    await i.page.getByText("2 students added to the course").waitFor();
    await i.page.getByRole("cell", { name: invited.email }).waitFor();
    await i.context.close();

    // 3. The invited student's message arrives (queue, worker, local SMTP); its link sets a password.
    const admin = await newPage(browser);
    await signIn(admin.page, demo.admin);
    let link = "";
    await expect
      .poll(
        async () => {
          const r = await admin.context.request.get(`/api/dev/mail?to=${encodeURIComponent(invited.email)}`);
          const messages = r.ok() ? ((await r.json()).messages as { html: string }[]) : [];
          // the message's button: <a href="http://…/reset-password/TOKEN">
          link = /href="[^"]*?(\/reset-password\/[^"]+)"/.exec(messages[0]?.html ?? "")?.[1] ?? "";
          return link;
        },
        { timeout: 40_000, interval: 1000 },
      )
      .not.toBe("");
    await admin.context.close();

    const j = await newPage(browser);
    await j.page.goto(link);
    await j.page.getByLabel("New password", { exact: true }).fill(joining.password);
    await j.page.getByLabel("New password again").fill(joining.password);
    await j.page.getByRole("button", { name: "Save the new password" }).click();
    await j.page.getByRole("status").getByRole("link", { name: "Sign in" }).waitFor();

    // 4. The student signs in and opens the course: the next lab due, with the time left.
    await signIn(j.page, invited.email, joining.password);
    await j.page.getByRole("link", { name: title }).click();
    await j.page.waitForURL(courseUrl);
    const next = j.page.getByRole("region", { name: "Next lab due" });
    await next.waitFor();
    expect(await next.getByRole("link", { name: "Burden on the bench" }).count()).toBe(1);
    expect(await next.textContent()).toMatch(/3 days( 0 hours| 1 hour)? left/);
    expect(await j.page.getByText(/Your section: B2/).count()).toBe(1);
    await j.page.screenshot({ path: "tests/.artifacts/course-home-student.png", fullPage: true });
    await j.context.close();
  });
});
