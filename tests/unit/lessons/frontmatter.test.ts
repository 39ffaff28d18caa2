// Every lesson file: valid frontmatter, the eleven lessons of issue 4 and the three of issue 15 in order, a "Check yourself"
// section with at least one question, a "Sources" section with at least one entry.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { extractFrontmatter, lessonFileNames, lessonsDir, readLessonFiles } from "@/lib/lessons/files";
import { lessonFrontmatterSchema } from "@/lib/lessons/schema";
import { questionsFor } from "@/lib/lessons/questions";
import { listLessons } from "@/lib/lessons";

const files = lessonFileNames();
const source = (f: string) => fs.readFileSync(path.join(lessonsDir, f), "utf8");

describe("lesson files", () => {
  it("are the fifteen lessons of the course, in the order of the syllabus", () => {
    expect(listLessons().map((l) => [l.order, l.slug])).toEqual([
      [1, "bench-safety"],
      [2, "burden-voltage"],
      [3, "choosing-a-shunt"],
      [4, "ranges-and-full-scale"],
      [5, "auto-ranging"],
      [6, "resolution"],
      [7, "filtering-and-settling"],
      [8, "bidirectional-currents"],
      [9, "duty-cycled-loads"],
      [10, "noise-floor"],
      [11, "uncertainty-budget"],
      [12, "leakage-and-guarding"],
      [13, "offsets-and-thermoelectric-voltages"],
      [14, "sampling-short-bursts"],
      [15, "feedback-ammeter"],
    ]);
  });

  it("listLessons gives course pages what they need", () => {
    const l = listLessons()[1];
    expect(Object.keys(l).sort()).toEqual(["minutes", "objectives", "order", "slug", "summary", "templates", "title"]);
    expect(l.templates).toEqual(["shunt-burden"]);
  });

  it("rejects a lesson whose frontmatter is invalid", () => {
    expect(() => lessonFrontmatterSchema.parse({ title: "X", summary: "short", order: 0, objectives: [], minutes: 1, templates: ["nope"] })).toThrow();
    expect(() => readLessonFiles(path.join(lessonsDir, "..", "..", "tests"))).not.toThrow(); // no .mdx there: empty list
  });

  for (const f of files) {
    describe(f, () => {
      const src = source(f);
      it("has frontmatter that validates", () => {
        const r = lessonFrontmatterSchema.safeParse(extractFrontmatter(src));
        expect(r.success, r.success ? "" : JSON.stringify(r.error.issues)).toBe(true);
      });
      it("ends with Check yourself (at least one question) and then Sources (at least one entry)", () => {
        const check = src.indexOf("\n## Check yourself\n");
        const sources = src.indexOf("\n## Sources\n");
        expect(check).toBeGreaterThan(0);
        expect(sources).toBeGreaterThan(check);
        const slug = f.replace(/\.mdx$/, "");
        expect(src.slice(check, sources)).toContain(`<CheckYourself lesson="${slug}" />`);
        expect(questionsFor(slug).length).toBeGreaterThanOrEqual(1);
        const entries = src.slice(sources).split("\n").filter((l) => l.startsWith("- "));
        expect(entries.length).toBeGreaterThanOrEqual(1);
      });
      it("has at least one safety caution", () => {
        expect(src).toMatch(/<Caution title="[^"]+">/);
      });
      it("names no instrument makers' products or web calculators as sources", () => {
        const sources = src.slice(src.indexOf("\n## Sources\n"));
        expect(sources).not.toMatch(/https?:\/\//);
      });
    });
  }
});
