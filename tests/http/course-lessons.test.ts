// The course's lesson plan over HTTP: the instructor chooses which lessons appear, in which order and
// from when; students see the visible ones only.
import { beforeAll, describe, expect, it } from "vitest";
import { Client } from "../support/http";
import { e2eDb } from "../support/db";
import { clientFor, clientsOf, courseWithPeople } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider", Client>;

beforeAll(async () => {
  f = await courseWithPeople();
  as = await clientsOf(f.people);
});

const path = () => `/api/courses/${f.courseId}/lessons`;
const put = (c: Client, body: unknown) => c.json(path(), { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

describe("a course's lesson plan", () => {
  it("shows every lesson, open, in the syllabus order until the instructor sets a plan", async () => {
    const r = await as.student.json(path());
    expect(r.status).toBe(200);
    expect(r.body.lessons.length).toBe(15);
    expect(r.body.lessons.every((l: { open: boolean }) => l.open)).toBe(true);
    expect(r.body.lessons.map((l: { order: number }) => l.order)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15]);
  });

  it("lets only the instructor set it; others get 403 or 404", async () => {
    const plan = { lessons: [{ slug: "bench-safety", visible: true }] };
    expect((await put(as.ta, plan)).status).toBe(403);
    expect((await put(as.student, plan)).status).toBe(403);
    expect((await put(as.outsider, plan)).status).toBe(404);
    expect((await new Client().json(path())).status).toBe(401);
  });

  it("students see the chosen lessons in the chosen order, a future one not yet open, hidden ones not at all", async () => {
    const later = new Date(Date.now() + 5 * 24 * 3600 * 1000).toISOString();
    const r = await put(as.instructor, {
      lessons: [
        { slug: "burden-voltage", visible: true },
        { slug: "bench-safety", visible: true },
        { slug: "duty-cycled-loads", visible: true, opensAt: later },
        { slug: "noise-floor", visible: false },
      ],
    });
    expect(r.status).toBe(200);
    const seen = await as.student.json(path());
    expect(seen.body.lessons.map((l: { slug: string; open: boolean }) => [l.slug, l.open])).toEqual([
      ["burden-voltage", true],
      ["bench-safety", true],
      ["duty-cycled-loads", false],
    ]);
    const staff = await as.ta.json(path());
    expect(staff.body.lessons.find((l: { slug: string }) => l.slug === "noise-floor").visible).toBe(false);
  });

  it("a student gets the not-found page for a hidden lesson and one not yet open; staff read both (checked on the server)", async () => {
    // the plan of the test above: burden-voltage and bench-safety open, duty-cycled-loads opens in 5 days,
    // noise-floor hidden, every other lesson left out of the plan (hidden)
    for (const slug of ["noise-floor", "duty-cycled-loads", "resolution"]) {
      const r = await as.student.fetch(`/lessons/${slug}`);
      expect(r.status, slug).toBe(404);
      expect(await r.text()).toContain("Not found");
    }
    const open = await as.student.fetch(`/lessons/burden-voltage?course=${f.courseId}`);
    expect(open.status).toBe(200);
    const html = await open.text();
    // the app header with the course's navigation
    expect(html).toContain('aria-label="Course"');
    expect(html).toContain(`href="/courses/${f.courseId}/labs"`);
    expect(html).toContain(`href="/courses/${f.courseId}/lessons"`);
    for (const slug of ["noise-floor", "duty-cycled-loads"]) expect((await as.ta.fetch(`/lessons/${slug}`)).status, slug).toBe(200);
    // someone in no course reads no lesson
    expect((await as.outsider.fetch("/lessons/burden-voltage")).status).toBe(404);
    // the index lists only what the student may read
    const index = await (await as.student.fetch("/lessons")).text();
    expect(index).toContain('href="/lessons/burden-voltage"');
    expect(index).not.toContain('href="/lessons/noise-floor"');
    expect(index).not.toContain('href="/lessons/duty-cycled-loads"');
  });

  it("answers an unknown lesson or a repeated one with 400 and keeps the saved plan", async () => {
    const before = (await as.student.json(path())).body.lessons;
    const unknown = await put(as.instructor, { lessons: [{ slug: "no-such-lesson", visible: true }] });
    expect(unknown.status).toBe(400);
    expect(Object.keys(unknown.body.error.fields)).toEqual(["lessons.0.slug"]);
    const twice = await put(as.instructor, { lessons: [{ slug: "bench-safety", visible: true }, { slug: "bench-safety", visible: false }] });
    expect(twice.status).toBe(400);
    expect((await as.student.json(path())).body.lessons).toEqual(before);
  });

  it("a course whose plan was saved before later lessons joined the catalogue shows them at the end, open; lessons left out on saving stay hidden", async () => {
    const g = await courseWithPeople();
    const instructor = await clientFor(g.people.instructor.email);
    const student = await clientFor(g.people.student.email);
    const url = `/api/courses/${g.courseId}/lessons`;
    const catalogue = ((await student.json(url)).body.lessons as { slug: string; order: number }[]).map((l) => l.slug);
    expect(catalogue).toHaveLength(15);
    // the instructor's own plan: lessons 1 to 11 in reverse order, lesson 5 hidden
    const own = catalogue.slice(0, 11).reverse();
    const saved = await instructor.json(url, {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ lessons: own.map((slug) => ({ slug, visible: slug !== catalogue[4] })) }),
    });
    expect(saved.status).toBe(200);
    // left out of the plan: stored as hidden, so they do not appear
    expect(((await student.json(url)).body.lessons as { slug: string }[]).map((l) => l.slug)).toEqual(own.filter((s) => s !== catalogue[4]));
    // a plan saved before lessons 12 to 15 existed has no rows for them
    const db = e2eDb();
    try {
      await db.deleteFrom("course_lessons").where("course_id", "=", g.courseId).where("slug", "in", catalogue.slice(11)).execute();
    } finally {
      await db.destroy();
    }
    const seen = (await student.json(url)).body.lessons as { slug: string; open: boolean; visible: boolean }[];
    expect(seen.map((l) => l.slug)).toEqual([...own.filter((s) => s !== catalogue[4]), ...catalogue.slice(11)]);
    expect(seen.slice(-4).every((l) => l.open && l.visible)).toBe(true);
    expect((await student.fetch(`/lessons/${catalogue[13]}`)).status).toBe(200);
    // the instructor's plan lists them too, so they can be hidden or dated like the others
    const staff = (await instructor.json(url)).body.lessons as { slug: string; visible: boolean }[];
    expect(staff.map((l) => l.slug)).toEqual([...own, ...catalogue.slice(11)]);
    expect(staff.filter((l) => !l.visible).map((l) => l.slug)).toEqual([catalogue[4]]);
  });
});
