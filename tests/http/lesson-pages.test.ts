// Every lesson page, as the demo course's TA receives it from the production build (staff read every
// lesson; the demo course opens its last lessons later, so a student reads only the open ones).
import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { Client } from "../support/http";

const slugs = fs
  .readdirSync(path.join(process.cwd(), "content/lessons"))
  .filter((f) => f.endsWith(".mdx"))
  .map((f) => f.replace(/\.mdx$/, ""));

const student = new Client();
const ta = new Client();
beforeAll(async () => {
  expect(await student.signIn("student.one@larkmoor-tech.example", "bench-demo-2026")).toBe(true);
  expect(await ta.signIn("ta.one@larkmoor-tech.example", "bench-demo-2026")).toBe(true);
});

describe("lesson pages", () => {
  it("there are the fourteen lessons of the syllabus", () => {
    expect(slugs).toHaveLength(15);
  });

  it.each(slugs)("%s renders with typeset math, a check-yourself section, sources and a caution", async (slug) => {
    const res = await ta.fetch(`/lessons/${slug}`);
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain('class="katex"');
    expect(html).toContain("Safety — ");
    expect(html).toContain("lab rules and your instructor");
    expect(html).toMatch(/Check yourself/);
    expect(html).toMatch(/Sources/);
  });

  it("the three lessons of the nanoamp and microvolt problems carry their calculators, diagrams and cautions", async () => {
    const page = async (slug: string) => (await ta.fetch(`/lessons/${slug}`)).text();
    // React separates the caution's prefix from its title with an empty comment in server HTML
    const caution = (title: string) => new RegExp(`Safety — (<!-- -->)?${title}`);
    const leakage = await page("leakage-and-guarding");
    expect(leakage).toContain('data-testid="leakage-calculator"');
    expect(leakage).toContain('data-template="leakage-guard"');
    expect(leakage).toMatch(caution("High-voltage insulation tests"));
    expect(leakage).toMatch(caution("Electrostatic discharge at high-impedance inputs"));
    const thermal = await page("offsets-and-thermoelectric-voltages");
    expect(thermal).toContain('data-testid="thermal-calculator"');
    expect(thermal).toMatch(caution("Hot soldering for thermoelectric experiments"));
    const burst = await page("sampling-short-bursts");
    expect(burst).toContain('data-testid="burst-calculator"');
    expect(burst).toContain('data-template="sampling-burst"');
    // lesson 11 lays out the whole chain as a budget table, the shunt tolerance marked as dominant
    const budget = await page("uncertainty-budget");
    expect(budget).toContain('data-testid="budget-table"');
    expect(budget).toMatch(/shunt tolerance(<!-- -->)? \(dominant\)/);
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
