// Every lesson page, as a signed-in demo student receives it from the production build.
import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { Client } from "../support/http";

const slugs = fs
  .readdirSync(path.join(process.cwd(), "content/lessons"))
  .filter((f) => f.endsWith(".mdx"))
  .map((f) => f.replace(/\.mdx$/, ""));

const student = new Client();
beforeAll(async () => {
  expect(await student.signIn("student.one@larkmoor-tech.example", "bench-demo-2026")).toBe(true);
});

describe("lesson pages", () => {
  it("there are the eleven lessons of the syllabus", () => {
    expect(slugs).toHaveLength(11);
  });

  it.each(slugs)("%s renders with typeset math, a check-yourself section, sources and a caution", async (slug) => {
    const res = await student.fetch(`/lessons/${slug}`);
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain('class="katex"');
    expect(html).toContain("Safety — ");
    expect(html).toContain("lab rules and your instructor");
    expect(html).toMatch(/Check yourself/);
    expect(html).toMatch(/Sources/);
  });

  it("sends anonymous visitors to the sign-in page", async () => {
    const res = await new Client().fetch(`/lessons/${slugs[0]}`);
    expect([302, 307, 308]).toContain(res.status);
    expect(res.headers.get("location")).toMatch(/\/signin/);
  });

  it("answers an unknown lesson with 404", async () => {
    expect((await student.fetch("/lessons/no-such-lesson")).status).toBe(404);
  });
});
