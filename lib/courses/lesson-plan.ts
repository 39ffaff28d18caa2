// A course's lessons as its members see them: the instructor's plan merged with the lesson files.
import "server-only";
import { db } from "@/db";
import { listCourseLessons, replaceCourseLessons } from "@/db/queries/course-lessons";
import { listCoursesForUser } from "@/db/queries/courses";
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

/**
 * Every lesson with the course's settings. A lesson the plan has no row for was added to the catalogue
 * after the plan was saved (saving stores every lesson, those left out as hidden rows, see `savePlan`).
 * It comes last, in catalogue order, visible and open at once, as the default plan shows every lesson:
 * an instructor who planned the syllabus expects the course's new material to reach the students, and
 * hides or dates it in the plan like any other lesson (the plan editor lists it).
 */
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
  for (const l of bySlug.values()) planned.push({ ...l, position: planned.length + 1, visible: true, opensAt: null, open: true });
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
  // lessons the plan leaves out are stored as hidden rows after the others, so that only lessons added to
  // the catalogue later have no row (and appear, see `coursePlan`)
  const given = new Set(plan.lessons.map((l) => l.slug));
  const left = [...known].filter((slug) => !given.has(slug)).map((slug) => ({ slug, visible: false, opensAt: null }));
  await replaceCourseLessons(
    db,
    courseId,
    [...plan.lessons, ...left].map((l, i) => ({ slug: l.slug, position: i + 1, visible: l.visible, opensAt: l.opensAt ?? null })),
  );
}

export interface LessonCourse {
  id: string;
  code: string;
  title: string;
  role: string;
}

/** Every lesson `user` may read now (the rule of `lessonAccess`, for all lessons at once). */
export async function readableLessonSlugs(user: { id: string; isAdmin: boolean }, now = new Date()): Promise<Set<string>> {
  const all = listLessons().map((l) => l.slug);
  const memberships = await listCoursesForUser(db, user.id);
  if (user.isAdmin || memberships.some((m) => m.role === "ta" || m.role === "instructor")) return new Set(all);
  const out = new Set<string>();
  for (const m of memberships) for (const l of await coursePlan(m.id, now)) if (l.open) out.add(l.slug);
  return out;
}

/**
 * Whether `user` may read lesson `slug` now, and through which of their courses. The site admin and the
 * staff of any course read every lesson; a student reads a lesson one of their courses shows and has
 * opened. `courses` lists the courses that grant it (for the page's course navigation).
 */
export async function lessonAccess(user: { id: string; isAdmin: boolean }, slug: string, now = new Date()): Promise<{ readable: boolean; courses: LessonCourse[] }> {
  const memberships = await listCoursesForUser(db, user.id);
  const courses: LessonCourse[] = [];
  for (const m of memberships) {
    const staff = m.role === "ta" || m.role === "instructor";
    if (staff || (await coursePlan(m.id, now)).some((l) => l.slug === slug && l.open)) courses.push({ id: m.id, code: m.code, title: m.title, role: m.role });
  }
  return { readable: user.isAdmin || courses.length > 0, courses };
}
