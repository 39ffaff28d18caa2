// Which lesson teaches a question of a lab: pure, for the gradebook's "What to teach again" panel.
import type { LessonSummary } from "./schema";

type Lesson = Pick<LessonSummary, "slug" | "title" | "order" | "templates" | "quantities">;

/**
 * The lesson that teaches `quantity` of the template `templateKey`: among the lessons preparing for the
 * template, one that names the quantity in its `quantities` first, else one that lists no quantities
 * (it teaches them all); ties go to the lesson preparing the fewest templates, then the earliest.
 * Falls back to any lesson of the template, so a quantity no lesson names still links somewhere useful.
 */
export function lessonFor<L extends Lesson>(lessons: L[], templateKey: string, quantity: string): L | undefined {
  const ofTemplate = lessons.filter((l) => (l.templates as string[]).includes(templateKey));
  const rank = (l: L) => (l.quantities === undefined ? 1 : l.quantities.includes(quantity) ? 0 : 2);
  return ofTemplate.sort((a, b) => rank(a) - rank(b) || a.templates.length - b.templates.length || a.order - b.order)[0];
}
