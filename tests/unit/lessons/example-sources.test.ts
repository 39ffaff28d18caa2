// Every worked example a lesson shows names its source, and every number it prints is checked.
// - Each example a lesson shows (<V ex>, <Eq ex>, <BudgetTable ex>) exists in lib/lessons/examples.ts, and each
//   phrase of its `cite` appears in that lesson's "Sources" list (a standard, a law, "worked here from the
//   formula", "common practice, no source").
// - Each quantity the lesson prints from an example has a check in examples.ts, whose value comes from
//   lib/grader/PHYSICS.md (source tag beside it); tests/unit/lessons/examples.test.ts recomputes every check
//   through lib/grader. So every number a lesson shows is recomputed and compared with an outside value.
// - No example is kept that no lesson shows, and no source line is vague: each names a document with its year
//   or says honestly that the value is worked from the formula, common practice or from memory.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { examples, type Example } from "@/lib/lessons/examples";
import { lessonFileNames, lessonsDir } from "@/lib/lessons/files";
import { computeExample } from "@/lib/lessons/compute";

type Shown = { ex: string; quantities: Set<string> };

/** The examples a lesson's MDX shows, with the quantities (not the inputs) it prints from each. */
function shownExamples(mdx: string): Map<string, Shown> {
  const out = new Map<string, Shown>();
  const tag = /<(V|Eq|BudgetTable)((?:\s+[A-Za-z]+(?:=(?:"[^"]*"|\{[^}]*\}))?)*)\s*\/>/g;
  const opened = [...mdx.matchAll(/<(V|Eq|BudgetTable)\s/g)].length;
  const parsed = [...mdx.matchAll(tag)];
  if (parsed.length !== opened) throw new Error(`${opened - parsed.length} example tag(s) could not be read`);
  for (const m of parsed) {
    const attrs = Object.fromEntries([...m[2].matchAll(/([A-Za-z]+)="([^"]*)"/g)].map((a) => [a[1], a[2]]));
    const ex = attrs.ex;
    if (!ex) throw new Error(`<${m[1]}> without ex: ${m[0]}`);
    const shown = out.get(ex) ?? { ex, quantities: new Set<string>() };
    if (m[1] === "V" && attrs.q) shown.quantities.add(attrs.q);
    if (m[1] === "Eq") for (const q of (attrs.tex ?? "").matchAll(/\[\[q\.([A-Za-z0-9]+)/g)) shown.quantities.add(q[1]);
    if (m[1] === "BudgetTable")
      for (const q of ["current", "readingContribution", "shuntToleranceContribution", "tempcoContribution", "gainContribution", "referenceContribution", "quantisationContribution", "repeatabilityContribution", "offsetContribution", "biasContribution", "leakageContribution", "combinedStandardUncertainty", "expandedUncertainty", "dominantContribution"])
        shown.quantities.add(q);
    out.set(ex, shown);
  }
  return out;
}

function sourceLines(mdx: string): string[] {
  const i = mdx.indexOf("\n## Sources\n");
  return i < 0 ? [] : mdx.slice(i).split("\n").filter((l) => l.startsWith("- "));
}

const lessons = lessonFileNames().map((f) => ({ slug: f.replace(/\.mdx$/, ""), mdx: fs.readFileSync(path.join(lessonsDir, f), "utf8") }));
const byId = new Map<string, Example>(examples.map((e) => [e.id, e as Example]));

describe("the lesson parser", () => {
  it("finds examples, printed quantities and skips inputs", () => {
    const s = shownExamples(
      '<V ex="a" q="x" unit="mA" /> and <V ex="a" p="y" /> and <Eq ex="b" tex="I = [[p.u|V]] / R = [[q.z|mA|4]]" /> <V ex="c" q="w" sig={4} trim />',
    );
    expect([...s.keys()]).toEqual(["a", "b", "c"]);
    expect([...s.get("a")!.quantities]).toEqual(["x"]);
    expect([...s.get("b")!.quantities]).toEqual(["z"]);
    expect([...s.get("c")!.quantities]).toEqual(["w"]);
  });
  it("refuses a tag it cannot read rather than skip it", () => {
    expect(() => shownExamples('<V ex="a" q=x />')).toThrow(/could not be read/);
  });
});

describe("every worked example a lesson shows names its source", () => {
  for (const { slug, mdx } of lessons) {
    const shown = shownExamples(mdx);
    const sources = sourceLines(mdx).join("\n");
    for (const s of shown.values()) {
      it(`${slug}: ${s.ex} exists, its source is in the lesson's Sources, and every number it prints is checked`, () => {
        const e = byId.get(s.ex);
        expect(e, `${slug} shows an unknown example "${s.ex}"`).toBeDefined();
        expect(e!.cite.length).toBeGreaterThan(0);
        for (const c of e!.cite) expect(sources, `${slug}'s Sources must name "${c}" for ${s.ex}`).toContain(c);
        const checked = new Set(e!.checks.map((c) => c.quantity));
        for (const q of s.quantities) expect(checked.has(q), `${s.ex}.${q} is printed in ${slug} but has no check`).toBe(true);
        const values = computeExample(e!).quantities;
        for (const q of s.quantities) expect(values[q], `${s.ex}.${q}`).toBeDefined();
      });
    }
  }

  it("every check names where its value comes from (a PHYSICS.md section or a hand calculation, with its tag)", () => {
    for (const e of examples)
      for (const c of e.checks) expect(c.source, `${e.id}.${c.quantity}`).toMatch(/(PHYSICS\.md §\d+|by hand|Ohm's law).*\[(FORMULA|PUB|REF|MEM|CP)/);
  });

  it("keeps no example that no lesson shows", () => {
    const shownIds = new Set(lessons.flatMap(({ mdx }) => [...shownExamples(mdx).keys()]));
    expect(examples.map((e) => e.id).filter((id) => !shownIds.has(id))).toEqual([]);
  });
});

describe("source lines are precise or honest", () => {
  const vague = /published (article|page|answer|user guide|gist)|question-and-answer|encyclop|tutorial page|user manual|maker's|Low Level Measurements Handbook|application note|reference pages|calculator/i;
  const honest = /worked here from|common practice|from memory|teaching design/;
  for (const { slug, mdx } of lessons) {
    it(`${slug}: each line names a findable document with its year, or says it has none`, () => {
      const lines = sourceLines(mdx);
      expect(lines.length).toBeGreaterThan(0);
      for (const l of lines) {
        expect(l, `${slug}: vague source`).not.toMatch(vague);
        expect(/\b(19|20)\d\d\b/.test(l) || honest.test(l), `${slug}: "${l}" names no year and no honest substitute`).toBe(true);
      }
    });
  }
});
