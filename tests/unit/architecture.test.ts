// The layout of the source tree (DEVELOPERS.md "Where things go"): imports run downhill only, app/ →
// components/ → lib/ → db/, lib/ is a handful of domain folders, and the grader stays pure. Read from the
// files themselves, so a new file that breaks a rule fails here.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(path.join(root, dir))) {
    const rel = path.posix.join(dir, name);
    if (statSync(path.join(root, rel)).isDirectory()) out.push(...sourceFiles(rel));
    else if (/\.(ts|tsx|mts|mjs)$/.test(name)) out.push(rel);
  }
  return out;
}

/** Every module a file names: static imports and re-exports (type-only ones too), side-effect imports, import(). */
function importsOf(file: string): string[] {
  const src = readFileSync(path.join(root, file), "utf8").replace(/\/\*[\s\S]*?\*\//g, "").replace(/^\s*\/\/.*$/gm, "");
  const specs = [
    ...src.matchAll(/\b(?:import|export)\s[^;]*?\sfrom\s*["']([^"']+)["']/g),
    ...src.matchAll(/\bimport\s*["']([^"']+)["']/g),
    ...src.matchAll(/\bimport\s*\(\s*["']([^"']+)["']\s*\)/g),
  ].map((m) => m[1]);
  return [...new Set(specs)];
}

/** Where an import points inside the repository ("lib/labs/attempts"), or the package name as written. */
function target(file: string, spec: string): string {
  if (spec.startsWith("@/")) return spec.slice(2);
  if (spec.startsWith("./") || spec.startsWith("../")) return path.posix.normalize(path.posix.join(path.posix.dirname(file), spec));
  return spec;
}

function violations(dir: string, forbidden: (to: string) => boolean): string[] {
  return sourceFiles(dir).flatMap((f) => importsOf(f).filter((s) => forbidden(target(f, s))).map((s) => `${f} imports ${s}`));
}

const under = (to: string, folder: string) => to === folder || to.startsWith(`${folder}/`);

describe("the source tree's layout", () => {
  it("finds the imports it checks (the reader is not blind)", () => {
    // a known downhill import of each kind the rules below look for
    expect(importsOf("lib/labs/attempts.ts").map((s) => target("lib/labs/attempts.ts", s))).toContain("db");
    expect(importsOf("components/auth/sign-up-form.tsx")).toContain("@/components/ui/field");
    expect(importsOf("lib/grader/index.ts").length).toBeGreaterThan(0);
  });

  it("no file under db/ imports lib/ or components/", () => {
    expect(violations("db", (to) => under(to, "lib") || under(to, "components"))).toEqual([]);
  });

  it("no file under components/ imports app/", () => {
    expect(violations("components", (to) => under(to, "app"))).toEqual([]);
  });

  it("no file under lib/ imports app/ or components/", () => {
    expect(violations("lib", (to) => under(to, "app") || under(to, "components"))).toEqual([]);
  });

  it("lib/ is domain folders with at most five files at its root", () => {
    const rootFiles = readdirSync(path.join(root, "lib")).filter((n) => statSync(path.join(root, "lib", n)).isFile());
    expect(rootFiles.length, rootFiles.join(", ")).toBeLessThanOrEqual(5);
  });

  it("lib/grader imports no next, react, database or network code", () => {
    const impure = /^(next|react|react-dom|kysely|pg|pg-boss|server-only|node:(net|http|https|dns|tls)|db|lib\/(?!grader\/))(\/|$)/;
    expect(violations("lib/grader", (to) => impure.test(to))).toEqual([]);
  });
});
