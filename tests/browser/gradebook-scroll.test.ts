// A course of a thousand students: the gradebook renders a window of rows, not all of them, and scrolling
// to the bottom brings the last student's row into view while the page keeps answering (the search box
// still filters). Timing of the same scroll is in bench/gradebook.ts (`--browser`), not here.
import { hash } from "@node-rs/argon2";
import { sql } from "kysely";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { e2eDb, uniqueEmail } from "../support/db";
import { launch, newPage, signIn } from "./harness";

const STUDENTS = 1000;
const PASSWORD = "fixture-password-1";
let browser: Browser;
let courseId: string;
let instructor: string;
let tag: string;

beforeAll(async () => {
  const db = e2eDb();
  try {
    tag = Math.random().toString(36).slice(2, 8);
    const course = await db
      .insertInto("courses")
      .values({ code: `S-${tag}`, title: `Scroll course ${tag}`, term: "T", institution: "Fixture college", join_code: `JS-${tag}` })
      .returning("id")
      .executeTakeFirstOrThrow();
    courseId = course.id;
    instructor = uniqueEmail("scroll-instructor");
    const u = await db.insertInto("users").values({ email: instructor, name: "Scroll Instructor", password_hash: await hash(PASSWORD) }).returning("id").executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ course_id: courseId, user_id: u.id, role: "instructor" }).execute();
    // students "Scroll student 0001" … "1000" (the table lists them by name), sections S1 to S4
    await sql`
      with u as (
        insert into users (email, name)
        select 'scroll-' || ${tag} || '-' || g || '@test.example', 'Scroll student ' || lpad(g::text, 4, '0') from generate_series(1, ${STUDENTS}) g
        returning id, name
      )
      insert into memberships (course_id, user_id, role, section)
      select ${courseId}, u.id, 'student', 'S' || (right(u.name, 4)::int % 4 + 1) from u`.execute(db);
    await sql`
      insert into labs (course_id, title, template_key, status, spec, questions, policy, counting, due_at)
      select ${courseId}, 'Scroll lab ' || g, 'shunt-burden', 'published', '{"template":"shunt-burden","parameters":{}}'::jsonb,
        '[{"id":"q1","quantity":"indicatedCurrent","kind":"prediction","points":10}]'::jsonb, '{}'::jsonb, 'best', now() - g * interval '1 day'
      from generate_series(1, 3) g`.execute(db);
    await sql`
      insert into attempts (lab_id, user_id, number, idempotency_key, readings, measured, result, raw_score, max_score, score, grader_version, lab_version)
      select l.id, m.user_id, 1, 'scroll-1', '{}'::jsonb, '{}'::jsonb, '{"results":[{"id":"q1","verdict":"correct"}]}'::jsonb, 10, 10, 10, 'test', 1
      from labs l join memberships m on m.course_id = l.course_id and m.role = 'student'
      where l.course_id = ${courseId}`.execute(db);
  } finally {
    await db.destroy();
  }
  browser = await launch();
});

afterAll(async () => {
  await browser?.close();
});

describe("the gradebook of a thousand students", () => {
  it("scrolls to the last student's row, rendering only a window of rows, and still answers the search box", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, instructor, PASSWORD);
    await page.goto(`/courses/${courseId}/gradebook`, { waitUntil: "domcontentloaded", timeout: 120_000 });
    const count = page.getByTestId("student-count");
    await expect.poll(() => count.textContent(), { timeout: 60_000 }).toBe(`${STUDENTS} of ${STUDENTS} students`);
    const scroller = page.getByTestId("gradebook-scroller");
    const rows = scroller.locator("tbody tr[data-student]");
    const first = page.getByRole("link", { name: "Scroll student 0001", exact: true });
    await first.waitFor();

    // virtualised: far fewer rows in the page than students
    const rendered = await rows.count();
    expect(rendered).toBeGreaterThan(0);
    expect(rendered).toBeLessThan(STUDENTS / 4);

    // scroll with the mouse wheel over the table until it reaches the bottom
    await scroller.hover();
    const atBottom = () => scroller.evaluate((el) => el.scrollTop + el.clientHeight >= el.scrollHeight - 2);
    for (let i = 0; i < 200 && !(await atBottom()); i++) await page.mouse.wheel(0, 2500);
    expect(await atBottom()).toBe(true);

    const last = page.getByRole("link", { name: `Scroll student ${STUDENTS}`, exact: true });
    await last.waitFor({ state: "visible" });
    // the last row lies inside the scroller's visible box (not hidden under its edge)
    await expect
      .poll(async () => {
        const [box, row] = await Promise.all([scroller.boundingBox(), last.boundingBox()]);
        return Boolean(box && row && row.y >= box.y && row.y + row.height <= box.y + box.height + 1);
      })
      .toBe(true);
    expect(await first.count()).toBe(0); // the first rows left the page
    expect(await rows.count()).toBeLessThan(STUDENTS / 4);

    // still responsive: the search box filters the thousand rows down to one
    await page.getByLabel("Search by name or e-mail").fill("Scroll student 0500");
    await expect.poll(() => count.textContent()).toBe(`1 of ${STUDENTS} students`);
    await page.getByRole("link", { name: "Scroll student 0500", exact: true }).waitFor({ state: "visible" });
    await context.close();
  });
});
