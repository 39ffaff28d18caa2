// File-level reading of lessons, kept free of "server-only" so unit tests can call it directly.
import fs from "node:fs";
import path from "node:path";
import { lessonFrontmatterSchema, slugSchema, type LessonFrontmatter, type LessonSummary } from "./schema";

// turbopackIgnore: the folder is read at build time (static pages) and by scripts; no tracing needed.
export const lessonsDir = path.join(/* turbopackIgnore: true */ process.cwd(), "content", "lessons");

const frontmatterStart = /^export const frontmatter = /m;

/** Extracts the `export const frontmatter = {…};` object (strict JSON) from a lesson's source. */
export function extractFrontmatter(source: string): unknown {
  const m = frontmatterStart.exec(source);
  if (!m) throw new Error("no `export const frontmatter = {…}` found");
  const start = m.index + m[0].length;
  if (source[start] !== "{") throw new Error("frontmatter must be an object literal");
  // Find the matching closing brace, skipping braces inside JSON strings.
  let depth = 0;
  let inString = false;
  for (let i = start; i < source.length; i++) {
    const c = source[i];
    if (inString) {
      if (c === "\\") i++;
      else if (c === '"') inString = false;
      continue;
    }
    if (c === '"') inString = true;
    else if (c === "{") depth++;
    else if (c === "}" && --depth === 0) return JSON.parse(source.slice(start, i + 1));
  }
  throw new Error("unterminated frontmatter object");
}

export function parseLesson(file: string, source: string): LessonSummary {
  const slug = path.basename(file, ".mdx");
  slugSchema.parse(slug);
  const fm: LessonFrontmatter = lessonFrontmatterSchema.parse(extractFrontmatter(source));
  return { slug, ...fm };
}

export function lessonFileNames(dir = lessonsDir): string[] {
  return fs
    .readdirSync(dir)
    .filter((f) => f.endsWith(".mdx"))
    .sort();
}

export function readLessonFiles(dir = lessonsDir): LessonSummary[] {
  const lessons = lessonFileNames(dir).map((f) => parseLesson(f, fs.readFileSync(path.join(dir, f), "utf8")));
  lessons.sort((a, b) => a.order - b.order);
  const orders = new Set(lessons.map((l) => l.order));
  if (orders.size !== lessons.length) throw new Error("two lessons share the same `order`");
  return lessons;
}

export function readLessonSource(slug: string, dir = lessonsDir): string {
  slugSchema.parse(slug);
  return fs.readFileSync(path.join(dir, `${slug}.mdx`), "utf8");
}
