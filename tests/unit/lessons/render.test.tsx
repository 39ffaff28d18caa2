// Each lesson compiles as MDX with the same plugins as next.config.mjs (remark-gfm, remark-math,
// rehype-katex), renders to static markup with the page's components, typesets its formulas as KaTeX markup
// and shows its Markdown tables as tables (no raw pipes left in the text).
// And no client component in the lesson tree can pull KaTeX into the browser.
import fs from "node:fs";
import path from "node:path";
import { evaluate } from "@mdx-js/mdx";
import * as runtime from "react/jsx-runtime";
import { renderToStaticMarkup } from "react-dom/server";
import remarkGfm from "remark-gfm";
import remarkMath from "remark-math";
import rehypeKatex from "rehype-katex";
import { describe, expect, it } from "vitest";
import { lessonFileNames, lessonsDir, extractFrontmatter } from "@/lib/lessons/files";
import { tableOfContents } from "@/lib/lessons/toc";
import { lessonComponents } from "@/components/lesson/mdx";
import { DutyCycleCalculator } from "@/components/lesson/calculators";

const root = path.resolve(import.meta.dirname, "../../..");

async function render(file: string) {
  const source = fs.readFileSync(path.join(lessonsDir, file), "utf8");
  const mod = await evaluate(source, {
    ...(runtime as unknown as Parameters<typeof evaluate>[1]),
    remarkPlugins: [remarkGfm, remarkMath],
    rehypePlugins: [[rehypeKatex, { strict: false, output: "html" }]],
  });
  const Content = mod.default;
  return { source, mod, html: renderToStaticMarkup(<Content components={lessonComponents} />) };
}

describe("lessons render", () => {
  for (const file of lessonFileNames()) {
    it(`${file} compiles, typesets its math and fills every number`, async () => {
      const { source, mod, html } = await render(file);
      expect(mod.frontmatter).toEqual(extractFrontmatter(source));
      expect(html).toContain('class="katex"');
      expect(html).not.toContain("katex-error");
      expect(html).not.toMatch(/\[\[[pq]\./); // every <Eq/> placeholder filled
      expect(html).not.toContain("NaN");
      expect(html).toContain('role="note"'); // a caution
      // the table of contents links to headings that exist
      for (const h of tableOfContents(source)) expect(html).toContain(`id="${h.id}"`);
      // each check-yourself question is in the page with its label
      expect(html).toMatch(/Your answer/);
      // every Markdown table is a table: no delimiter row (| --- |) or pipe-led row left as text
      const text = html.replace(/<span class="katex"[\s\S]*?<\/annotation>/g, "");
      expect(text, "raw table syntax").not.toMatch(/\|\s*:?-{3,}:?\s*\|/);
      expect(text, "raw table row").not.toMatch(/(^|>)\s*\|[^<|]+\|[^<]*\|/m);
      const tables = source.split("\n").filter((l) => /^\s*\|\s*:?-{3,}/.test(l)).length;
      expect((html.match(/<table/g) ?? []).length).toBeGreaterThanOrEqual(tables);
    });
  }

  it("states Maren's average current from the grader in the duty-cycle calculator, whose frame the lesson shows until it loads", async () => {
    const { html } = await render("duty-cycled-loads.mdx");
    // the lesson's first load carries the calculator's titled frame; its code comes when it is reached
    expect(html).toMatch(/<section[^>]*data-testid="duty-cycle-calculator"[^>]*data-calculator-pending=""[^>]*><h3[^>]*>Try it: duty-cycled load and battery life<\/h3>/);
    const calc = renderToStaticMarkup(<DutyCycleCalculator />);
    expect(calc).toContain("202.0\u00a0µA"); // PHYSICS.md §8 8a [FORMULA]
    expect(calc).toMatch(/data-testid="battery-life">871\.4\u00a0h = 36\.31\u00a0d/); // PHYSICS.md §8 8b [FORMULA]
  });
});

// ---- no KaTeX on the client --------------------------------------------------------------------
function resolveImport(from: string, spec: string): string | null {
  let base: string;
  if (spec.startsWith("@/")) base = path.join(root, spec.slice(2));
  else if (spec.startsWith(".")) base = path.resolve(path.dirname(from), spec);
  else return null;
  for (const c of [base, `${base}.ts`, `${base}.tsx`, path.join(base, "index.ts"), path.join(base, "index.tsx")]) {
    if (fs.existsSync(c) && fs.statSync(c).isFile()) return c;
  }
  return null;
}

function importsOf(file: string): string[] {
  const src = fs.readFileSync(file, "utf8");
  const out: string[] = [];
  for (const m of src.matchAll(/(?:import|export)\s+(?:type\s+)?(?:[^"';]*?\s+from\s+)?["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)/g)) {
    if (/^import\s+type\s/.test(m[0])) continue;
    out.push(m[1] ?? m[2]);
  }
  return out;
}

/** Everything a client module pulls into the browser bundle, except across a "use server" boundary. */
function clientGraph(entry: string, seen = new Set<string>()): { files: Set<string>; packages: Set<string> } {
  const packages = new Set<string>();
  const visit = (file: string) => {
    if (seen.has(file)) return;
    seen.add(file);
    const src = fs.readFileSync(file, "utf8");
    if (file !== entry && /^\s*["']use server["']/.test(src)) return; // server actions stay on the server
    for (const spec of importsOf(file)) {
      const local = resolveImport(file, spec);
      if (local) visit(local);
      else if (!spec.startsWith(".") && !spec.startsWith("@/")) packages.add(spec);
    }
  };
  visit(entry);
  return { files: seen, packages };
}

describe("no KaTeX JavaScript for the browser", () => {
  const dir = path.join(root, "components/lesson");
  const clientFiles = fs
    .readdirSync(dir)
    .map((f) => path.join(dir, f))
    .filter((f) => /\.tsx?$/.test(f) && /^\s*["']use client["']/.test(fs.readFileSync(f, "utf8")));

  it("finds the client components", () => {
    expect(clientFiles.map((f) => path.basename(f)).sort()).toEqual(expect.arrayContaining(["CheckQuestion.tsx", "Plot.tsx", "calculators.tsx", "fields.tsx"]));
  });

  for (const f of clientFiles) {
    it(`${path.basename(f)} does not import katex, directly or through a local module`, () => {
      const { packages } = clientGraph(f);
      expect([...packages].filter((p) => p === "katex" || p.startsWith("katex/") || p.includes("rehype-katex"))).toEqual([]);
    });
  }

  it("the lessons themselves import nothing (widgets come from the page's component map)", () => {
    for (const file of lessonFileNames()) {
      const src = fs.readFileSync(path.join(lessonsDir, file), "utf8");
      expect(src, file).not.toMatch(/^import\s/m);
    }
  });
});
