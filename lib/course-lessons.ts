// A course's lessons as its members see them: the instructor's plan merged with the lesson files.
import "server-only";
import { db } from "@/db";
import { listCourseLessons, replaceCourseLessons } from "@/db/queries/course-lessons";
import { AppError } from "@/lib/errors";
import { listLessons, type LessonSummary } from "@/lib/lessons";
import type { z } from "zod";
import type { lessonPlanSchema } from "@/lib/validation/course-lessons";

export interface CourseLesson extends LessonSummary {
  position: number;
  visible: boolean;
  opensAt: Date | null;
  open: boolean;
}

/** Every lesson with the course's settings; lessons the plan does not mention come last, hidden. */
export async function coursePlan(courseId: string, now = new Date()): Promise<CourseLesson[]> {
  const all = listLessons();
  const rows = await listCourseLessons(db, courseId);
  if (rows.length === 0) {
    return all.map((l, i) => ({ ...l, position: i + 1, visible: true, opensAt: null, open: true }));
  }
  const bySlug = new Map(all.map((l) => [l.slug, l]));
  const planned: CourseLesson[] = [];
  for (const r of rows) {
    const l = bySlug.get(r.slug);
    if (!l) continue; // a lesson file that no longer exists
    const opensAt = r.opensAt ? new Date(r.opensAt) : null;
    planned.push({ ...l, position: r.position, visible: r.visible, opensAt, open: r.visible && (!opensAt || opensAt <= now) });
    bySlug.delete(r.slug);
  }
  for (const l of bySlug.values()) planned.push({ ...l, position: planned.length + 1, visible: false, opensAt: null, open: false });
  return planned;
}

/** What a student sees: the visible lessons in order, each open or with its opening date. */
export async function lessonsForStudents(courseId: string, now = new Date()) {
  return (await coursePlan(courseId, now)).filter((l) => l.visible);
}

export async function savePlan(courseId: string, plan: z.output<typeof lessonPlanSchema>) {
  const known = new Set(listLessons().map((l) => l.slug));
  const unknown = plan.lessons.map((l, i) => [i, l.slug] as const).filter(([, s]) => !known.has(s));
  if (unknown.length) {
    throw new AppError("bad_request", `No lesson is called ${unknown.map(([, s]) => `"${s}"`).join(", ")}.`, Object.fromEntries(unknown.map(([i]) => [`lessons.${i}.slug`, ["No such lesson."]])));
  }
  await replaceCourseLessons(
    db,
    courseId,
    plan.lessons.map((l, i) => ({ slug: l.slug, position: i + 1, visible: l.visible, opensAt: l.opensAt ?? null })),
  );
}
