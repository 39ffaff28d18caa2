import { json, route } from "@/lib/api";
import { requireCourseRole } from "@/lib/auth/access";
import { regenerateJoinCode } from "@/lib/course-admin";

type Params = { courseId: string };

/** A new join code; the old one stops working at once. */
export const POST = route<Params>(async (_req, { courseId }) => {
  const access = await requireCourseRole(courseId, ["instructor"]);
  return json({ joinCode: await regenerateJoinCode(access.course.id, access.course.code) });
});
