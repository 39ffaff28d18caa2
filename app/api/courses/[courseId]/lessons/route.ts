import { json, jsonBody, route } from "@/lib/http/route";
import { isStaff, requireCourseRole } from "@/lib/auth/access";
import { coursePlan, lessonsForStudents, savePlan } from "@/lib/courses/lesson-plan";
import { lessonPlanSchema } from "@/lib/validation/course-lessons";

type Params = { courseId: string };

// The course's lessons in order. Students get the visible ones (each with `open` and `opensAt`);
// staff get the whole plan, hidden lessons included.
export const GET = route<Params>(async (_req, { courseId }) => {
  const access = await requireCourseRole(courseId);
  const lessons = isStaff(access.role) ? await coursePlan(courseId) : await lessonsForStudents(courseId);
  return json({ lessons: lessons.map(({ slug, title, order, minutes, position, visible, opensAt, open }) => ({ slug, title, order, minutes, position, visible, opensAt, open })) });
});

// The instructor sets which lessons appear, in which order, and when each opens.
export const PUT = route<Params>(async (req, { courseId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  await savePlan(courseId, await jsonBody(req, lessonPlanSchema));
  return json({ lessons: await coursePlan(courseId) });
});
