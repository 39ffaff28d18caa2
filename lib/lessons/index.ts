// Lists the lessons in content/lessons (slug = file name without .mdx), ordered by frontmatter `order`.
// Server-only: it reads the files. Course pages use listLessons(); the lesson route uses getLesson().
import "server-only";
import { readLessonFiles, readLessonSource } from "./files";
import { tableOfContents } from "./toc";
import type { LessonSummary } from "./schema";

export type { LessonFrontmatter, LessonSummary, LessonTemplateKey } from "./schema";
export { lessonFrontmatterSchema, templateKeys } from "./schema";

let cache: LessonSummary[] | null = null;

/** Every lesson, in order: {slug, title, summary, order, minutes, objectives, templates}. */
export function listLessons(): LessonSummary[] {
  if (!cache || process.env.NODE_ENV === "development") cache = readLessonFiles();
  return cache;
}

export function getLesson(slug: string): LessonSummary | undefined {
  return listLessons().find((l) => l.slug === slug);
}

/** The lessons either side of `slug` in the given order (global order unless a course passes its own list). */
export function neighbours(slug: string, lessons: LessonSummary[] = listLessons()) {
  const i = lessons.findIndex((l) => l.slug === slug);
  return {
    previous: i > 0 ? lessons[i - 1] : undefined,
    next: i >= 0 && i < lessons.length - 1 ? lessons[i + 1] : undefined,
  };
}

/** The lesson's "## " headings, for the table of contents. */
export function lessonContents(slug: string) {
  return tableOfContents(readLessonSource(slug));
}
